/**
 * Checks a list of blocks (the planner's, or one edited by hand) against the request, block by block,
 * with the same safety margins and the same sampled night as the planner: the planner's own output
 * always validates clean. A violation names its rule and a one-line reason.
 *
 * Sequences are read in list order: a science block needs, right before and right after it in the
 * list, a calibrator block of one of its own target's calibrators, touching it (a gap of at most
 * `maxSequenceGapSec`, default 0). A calibrator block that both follows one science block and
 * precedes another serves two sequences.
 */
import { RAD_TO_DEG, roundTo } from "../math";
import { buildPlanContext, type PlanContext, type PlanTarget } from "./context";
import { PLAN_SAFETY_MARGINS, type PlanBlockRef, type PlanInput } from "./inputs";
import { isoFromSec } from "./night-sky";
import { BAD_DARK, BAD_DELAY, BAD_ELEVATION, BAD_MOON, type ObjectTrack } from "./object-track";

export type PlanRule =
  | "time"
  | "unknown"
  | "darkness"
  | "elevation"
  | "delayLine"
  | "moon"
  | "sun"
  | "order"
  | "calibrators"
  | "calibratorReused"
  | "hoursOwed";

export interface PlanViolation {
  rule: PlanRule;
  reason: string;
}

export interface PlanValidation {
  /** True when no block has a violation. */
  ok: boolean;
  /** One entry per block, in the order given. */
  blocks: { index: number; violations: PlanViolation[] }[];
}

export interface ValidateOptions {
  /** A context already built for this request (saves rebuilding the night). */
  context?: PlanContext;
  /** Largest gap between a science block and its calibrator blocks, seconds (default 0). */
  maxSequenceGapSec?: number;
}

interface Resolved {
  ref: PlanBlockRef;
  startSec: number | null;
  endSec: number | null;
  target: PlanTarget | null;
  track: ObjectTrack | null;
}

const wholeSecond = (text: unknown): number | null => {
  if (typeof text !== "string" || !/T.*(Z|[+-]\d\d:?\d\d)$/.test(text)) return null;
  const ms = Date.parse(text);
  return Number.isFinite(ms) && ms % 1000 === 0 ? ms / 1000 : null;
};
/** Longest block the validator samples, seconds. */
const MAX_BLOCK_SEC = 86_400;
const hms = (sec: number) => `${isoFromSec(sec).slice(11, 19)} UTC`;
const f2 = (x: number) => x.toFixed(2);

/** The instants a block's constraints are read at: both ends, the grid inside, 60 s steps off the grid. */
function sampleInstants(ctx: PlanContext, s: number, e: number): number[] {
  const { sky } = ctx;
  const out = [s, e];
  for (let t = s; t <= e; t += sky.stepSec) {
    const k = Math.ceil((t - sky.originSec) / sky.stepSec);
    if (k < 0 || k >= sky.count) out.push(t);
  }
  const lo = Math.max(0, Math.ceil((s - sky.originSec) / sky.stepSec));
  const hi = Math.min(sky.count - 1, Math.floor((e - sky.originSec) / sky.stepSec));
  for (let k = lo; k <= hi; k++) out.push(sky.originSec + k * sky.stepSec);
  return out;
}

/** One reason per failed sky constraint, with the worst value found. */
function skyViolations(ctx: PlanContext, b: Resolved, limitDeg: number): PlanViolation[] {
  const { sky, input } = ctx;
  const track = b.track as ObjectTrack;
  const s = b.startSec as number;
  const e = b.endSec as number;
  const out: PlanViolation[] = [];
  if (s < sky.windowStartSec || e > sky.windowEndSec) {
    out.push({ rule: "darkness", reason: `outside the night of ${input.date}` });
  }
  const bits = track.intervalBad(s, e);
  if (bits !== 0) {
    const worst = {
      sun: -Infinity,
      sunAt: s,
      el: Infinity,
      elAt: s,
      need: -Infinity,
      needAt: s,
      moon: Infinity,
      moonAt: s,
    };
    for (const t of sampleInstants(ctx, s, e)) {
      const st = track.stateAt(t);
      if (st.sky.sunAltRad > worst.sun) Object.assign(worst, { sun: st.sky.sunAltRad, sunAt: t });
      if (st.elevRad < worst.el) Object.assign(worst, { el: st.elevRad, elAt: t });
      if (st.delayNeedM > worst.need) Object.assign(worst, { need: st.delayNeedM, needAt: t });
      if (st.moonSepRad < worst.moon) Object.assign(worst, { moon: st.moonSepRad, moonAt: t });
    }
    const m = PLAN_SAFETY_MARGINS;
    if (bits & BAD_DARK) {
      out.push({
        rule: "darkness",
        reason: `outside astronomical darkness: Sun at ${f2(worst.sun * RAD_TO_DEG)}° at ${hms(worst.sunAt)} (must stay below −18° by ${m.sunAltitudeDeg}°)`,
      });
    }
    if (bits & BAD_ELEVATION) {
      out.push({
        rule: "elevation",
        reason: `below the elevation limit: ${f2(worst.el * RAD_TO_DEG)}° at ${hms(worst.elAt)} (limit ${limitDeg}° plus a ${m.elevationDeg}° margin)`,
      });
    }
    if (bits & BAD_DELAY) {
      out.push({
        rule: "delayLine",
        reason: `delay line out of range: a baseline needs ${worst.need.toFixed(1)} m at ${hms(worst.needAt)} (stroke ${input.delayLineStrokeM} m less a ${m.delayLineM} m margin)`,
      });
    }
    if (bits & BAD_MOON) {
      out.push({
        rule: "moon",
        reason: `too close to the Moon: ${f2(worst.moon * RAD_TO_DEG)}° at ${hms(worst.moonAt)} (limit ${input.moonMinSeparationDeg}° plus the lunar parallax and a ${m.moonDeg}° margin)`,
      });
    }
  }
  if (track.sunSeparationRad < ctx.sunMinRad) {
    out.push({
      rule: "sun",
      reason: `Sun avoidance: ${f2(track.sunSeparationRad * RAD_TO_DEG)}° from the Sun, inside the ${input.sunMinSeparationDeg}° avoidance angle`,
    });
  }
  return out;
}

function resolve(ctx: PlanContext, ref: PlanBlockRef, out: PlanViolation[]): Resolved {
  const startSec = wholeSecond(ref.startUtc);
  const endSec = wholeSecond(ref.endUtc);
  const r: Resolved = { ref, startSec, endSec, target: null, track: null };
  if (startSec === null) out.push({ rule: "time", reason: "startUtc is not an ISO-8601 UTC instant in whole seconds" });
  if (endSec === null) out.push({ rule: "time", reason: "endUtc is not an ISO-8601 UTC instant in whole seconds" });
  if (startSec !== null && endSec !== null && endSec <= startSec) {
    out.push({ rule: "time", reason: "must end after it starts" });
    r.startSec = r.endSec = null;
  } else if (startSec !== null && endSec !== null && endSec - startSec > MAX_BLOCK_SEC) {
    out.push({ rule: "time", reason: "must not be longer than 24 h" });
    r.startSec = r.endSec = null;
  }
  const target = ctx.byName.get(ref.target) ?? null;
  if (!target) {
    out.push({ rule: "unknown", reason: `target "${ref.target}" is not in the request` });
    return r;
  }
  r.target = target;
  if (ref.kind === "science") {
    if (ref.object === target.input.name) r.track = target.science;
    else out.push({ rule: "unknown", reason: `a science block must point at its target "${target.input.name}"` });
  } else if (ref.kind === "calibrator") {
    const i = target.input.calibrators.findIndex((c) => c.name === ref.object);
    if (i >= 0) r.track = target.calibrators[i];
    else out.push({ rule: "unknown", reason: `"${ref.object}" is not a calibrator of ${target.input.name}` });
  } else {
    out.push({ rule: "unknown", reason: `kind must be calibrator or science` });
  }
  return r;
}

/**
 * Validates blocks against a request.
 * @param request the validated request (defaults applied)
 * @param blocks the plan in its listed order
 */
export function validatePlan(
  request: PlanInput,
  blocks: readonly PlanBlockRef[],
  options: ValidateOptions = {},
): PlanValidation {
  const ctx = options.context ?? buildPlanContext(request);
  const maxGap = options.maxSequenceGapSec ?? 0;
  const found: PlanViolation[][] = blocks.map(() => []);
  const res = blocks.map((ref, i) => resolve(ctx, ref, found[i]));
  const timed = (r: Resolved) => r.startSec !== null && r.endSec !== null;

  let latestEnd: number | null = null;
  let latestAt = -1;
  let prev: Resolved | null = null;
  for (let i = 0; i < res.length; i++) {
    const r = res[i];
    if (!timed(r)) continue;
    const s = r.startSec as number;
    if (r.track && r.target) {
      const limit = r.ref.kind === "science" ? r.target.elevationLimitDeg : r.target.calibratorElevationLimitDeg;
      found[i].push(...skyViolations(ctx, r, limit));
    }
    if (prev && s < (prev.startSec as number)) {
      found[i].push({ rule: "order", reason: `out of time order: starts before the block listed before it` });
    } else if (latestEnd !== null && s < latestEnd) {
      found[i].push({ rule: "order", reason: `overlaps block ${latestAt + 1}, which ends at ${hms(latestEnd)}` });
    }
    if (latestEnd === null || (r.endSec as number) > latestEnd) {
      latestEnd = r.endSec as number;
      latestAt = i;
    }
    prev = r;
  }

  // Is block c a calibrator of science block s's target, touching it on the given side?
  const serves = (c: number, s: number, before: boolean): boolean => {
    const cb = res[c];
    const sb = res[s];
    if (!cb || !sb || cb.ref.kind !== "calibrator" || !cb.track || cb.target !== sb.target) return false;
    if (!timed(cb) || !timed(sb)) return false;
    const gap = before
      ? (sb.startSec as number) - (cb.endSec as number)
      : (cb.startSec as number) - (sb.endSec as number);
    return gap >= 0 && gap <= maxGap;
  };
  const use = new Map<PlanTarget, { sec: number; count: number }>();
  for (let i = 0; i < res.length; i++) {
    const r = res[i];
    if (r.ref.kind === "science" && r.target && r.track) {
      const name = r.target.input.name;
      if (!serves(i - 1, i, true)) {
        found[i].push({ rule: "calibrators", reason: `no calibrator block of ${name} immediately before it` });
      }
      if (!serves(i + 1, i, false)) {
        found[i].push({ rule: "calibrators", reason: `no calibrator block of ${name} immediately after it` });
      }
      if (timed(r)) {
        const u = use.get(r.target) ?? { sec: 0, count: 0 };
        u.sec += (r.endSec as number) - (r.startSec as number);
        u.count += 1;
        use.set(r.target, u);
        if (u.count > r.target.maxBlocks || u.sec > r.target.allowedSec + 1e-6) {
          found[i].push({
            rule: "hoursOwed",
            reason: `science time of ${name} reaches ${(u.sec / 3600).toFixed(2)} h in ${u.count} blocks, over the ${roundTo(r.target.input.hoursOwed, 2)} h owed (at most ${r.target.maxBlocks} ${r.target.maxBlocks === 1 ? "block" : "blocks"} of ${request.scienceBlockMin} min)`,
          });
        }
      }
    } else if (
      r.ref.kind === "calibrator" &&
      res[i - 1]?.ref.kind === "science" &&
      res[i + 1]?.ref.kind === "science"
    ) {
      if (serves(i, i - 1, false) && serves(i, i + 1, true)) {
        found[i].push({
          rule: "calibratorReused",
          reason: "serves two sequences: the science blocks before and after it",
        });
      }
    }
  }
  return { ok: found.every((v) => v.length === 0), blocks: found.map((violations, index) => ({ index, violations })) };
}
