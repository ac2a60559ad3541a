/**
 * Why a target received no science time: the first of these that holds, checked over the part of the
 * night that was planned (from notBeforeUtc on when one is given):
 *  sun — inside the Sun-avoidance angle; noHours — nothing owed; noDarkness — no astronomical
 *  darkness left; elevation — never above its limit in darkness; delayLine — the delay lines are out
 *  of range whenever it is high enough; moon — too close to the Moon whenever otherwise observable;
 *  window — never observable for a whole science block; noCalibrators — none given or all inside the
 *  Sun-avoidance angle; calibrator — no calibrator observable right before and after any possible
 *  science block; nightFull — sequences would fit, but their time went to other sequences.
 */
import { RAD_TO_DEG } from "../math";
import type { PlanContext, PlanTarget } from "./context";
import { PLAN_SAFETY_MARGINS } from "./inputs";
import { isoFromSec } from "./night-sky";
import { BAD_DARK, BAD_DELAY, BAD_ELEVATION, BAD_MOON } from "./object-track";
import { sequenceAt } from "./sequences";

export type UnplacedCode =
  | "sun"
  | "noHours"
  | "noDarkness"
  | "elevation"
  | "delayLine"
  | "moon"
  | "window"
  | "noCalibrators"
  | "calibrator"
  | "nightFull";

export interface UnplacedTarget {
  target: string;
  reason: string;
  /** Addition: the reason as a stable code. */
  code: UnplacedCode;
}

const fmt = (x: number, d = 1) => x.toFixed(d);
const hhmm = (sec: number) => `${isoFromSec(Math.round(sec)).slice(11, 16)} UTC`;

const BIT_WORDS: [number, string][] = [
  [BAD_DARK, "outside darkness"],
  [BAD_ELEVATION, "below the elevation limit"],
  [BAD_DELAY, "out of delay-line range"],
  [BAD_MOON, "too close to the Moon"],
];

/**
 * The reason a target got no science time.
 * @param fromSec first instant that was planned (dusk, or notBeforeUtc)
 * @param executedAny whether executed blocks occupied part of the night
 */
export function unplacedReason(
  ctx: PlanContext,
  t: PlanTarget,
  fromSec: number,
  executedAny: boolean,
): { code: UnplacedCode; reason: string } {
  const { sky, input } = ctx;
  const sunLimit = input.sunMinSeparationDeg;
  if (t.sunExcluded) {
    const sep = t.science.sunSeparationRad * RAD_TO_DEG;
    return {
      code: "sun",
      reason: `Sun avoidance: ${fmt(sep)}° from the Sun, inside the ${sunLimit}° avoidance angle`,
    };
  }
  if (t.maxBlocks === 0) return { code: "noHours", reason: "no hours owed" };
  const rest = fromSec > (sky.darkStartSec ?? Infinity);
  const during = rest ? `in darkness after ${hhmm(fromSec)}` : "in darkness";
  if (sky.count === 0 || sky.darkEndSec === null || fromSec + ctx.sequenceSec > sky.darkEndSec) {
    return {
      code: "noDarkness",
      reason:
        sky.count === 0
          ? "no astronomical darkness (Sun below −18°) on this night at this site"
          : `too little astronomical darkness left after ${hhmm(fromSec)} for one sequence`,
    };
  }

  const tr = t.science;
  const k0 = Math.max(0, Math.ceil((fromSec - sky.originSec) / sky.stepSec));
  const limit = t.elevationLimitDeg;
  let maxElev = -Infinity;
  let minNeed = Infinity;
  let maxMoon = -Infinity;
  let high = false;
  let inRange = false;
  let clear = false;
  for (let k = k0; k < sky.count; k++) {
    const b = tr.bad[k];
    if (b & BAD_DARK) continue;
    maxElev = Math.max(maxElev, tr.elevRad[k]);
    if (b & BAD_ELEVATION) continue;
    high = true;
    minNeed = Math.min(minNeed, tr.delayNeedM[k]);
    if (b & BAD_DELAY) continue;
    inRange = true;
    maxMoon = Math.max(maxMoon, tr.moonSepRad[k]);
    if (b & BAD_MOON) continue;
    clear = true;
  }
  if (!high) {
    return {
      code: "elevation",
      reason: `never above its ${limit}° elevation limit ${during} (highest ${fmt(maxElev * RAD_TO_DEG)}°)`,
    };
  }
  if (!inRange) {
    return {
      code: "delayLine",
      reason: `delay lines out of range whenever it is above ${limit}° ${during} (needs at least ${fmt(minNeed)} m, stroke ${input.delayLineStrokeM} m)`,
    };
  }
  if (!clear) {
    return {
      code: "moon",
      reason: `too close to the Moon whenever it is otherwise observable ${during} (at most ${fmt(maxMoon * RAD_TO_DEG)}° away; limit ${input.moonMinSeparationDeg}° plus the lunar parallax and a ${PLAN_SAFETY_MARGINS.moonDeg}° margin)`,
    };
  }

  const S = ctx.scienceSec;
  let scienceFits = false;
  let sequenceFits = false;
  let calBits = 0;
  for (let k = k0; k < sky.count; k++) {
    const s = sky.originSec + k * sky.stepSec;
    if (s + ctx.sequenceSec > sky.darkEndSec) break;
    if (!tr.intervalOk(s + ctx.calibratorSec, s + ctx.calibratorSec + S)) continue;
    scienceFits = true;
    if (sequenceAt(ctx, t, s)) {
      sequenceFits = true;
      break;
    }
    for (let i = 0; i < t.calibrators.length; i++) {
      calBits |= t.calibrators[i].intervalBad(s, s + ctx.calibratorSec);
      calBits |= t.calibrators[i].intervalBad(s + ctx.calibratorSec + S, s + ctx.sequenceSec);
    }
  }
  if (!scienceFits) {
    return {
      code: "window",
      reason: `never observable ${during} for as long as one ${input.scienceBlockMin}-min science block`,
    };
  }
  const usable = t.calibratorUsable.filter(Boolean).length;
  if (t.calibrators.length === 0) return { code: "noCalibrators", reason: "no calibrators given" };
  if (usable === 0) {
    return { code: "noCalibrators", reason: `every calibrator is inside the ${sunLimit}° Sun-avoidance angle` };
  }
  if (!sequenceFits) {
    const why = BIT_WORDS.filter(([bit]) => calBits & bit).map(([, w]) => w);
    return {
      code: "calibrator",
      reason: `no observable calibrator right before and after any possible science block ${during}${why.length ? ` (calibrators ${why.join(", ")})` : ""}`,
    };
  }
  return {
    code: "nightFull",
    reason: `night full: every time a sequence fits ${during} is taken by ${executedAny ? "executed blocks or " : ""}sequences of higher priority or setting sooner`,
  };
}
