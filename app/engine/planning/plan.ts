/**
 * One night's plan: the request-level entry point behind `cli plan` and `POST /api/plan`.
 *
 * The night of `date` (it begins on the local evening of that date) is filled with calibrator –
 * science – calibrator sequences by sequences.ts, around any executed blocks and from notBeforeUtc
 * on; each target that gets no science time is listed with the reason (unplaced.ts).
 */
import { moonIlluminatedFraction } from "../astro/moon";
import { isoUtcFromJulianDay, jdeFromJd } from "../astro/time";
import { RAD_TO_DEG, roundTo } from "../math";
import { describeBlock, type PlanBlock } from "./block-fields";
import { buildPlanContext, type PlanContext } from "./context";
import { PLAN_GRID_STEP_SEC, PLAN_SAFETY_MARGINS, type PlanBlockRef, type PlanInput } from "./inputs";
import { isoFromSec } from "./night-sky";
import { type PlacedBlock, placeSequences, scienceUse } from "./sequences";
import { type UnplacedTarget, unplacedReason } from "./unplaced";
import { validatePlan } from "./validate";

/** The caution every plan carries. */
export const PLAN_SAFETY_WARNING =
  "Telescope operation follows the observatory's own safety rules (wind, humidity, Sun); this plan does not override them.";

export interface PlanNight {
  date: string;
  /** Sun centre at −18°, evening and morning (the engine's ephemeris); null when the Sun does not reach it. */
  astronomicalDuskUtc: string | null;
  astronomicalDawnUtc: string | null;
  /** Illuminated fraction of the Moon at local mean midnight, 0..1 (as the ephemeris command gives it). */
  moonIlluminatedFraction: number;
  /** Addition: the interval new blocks were placed in (darkness less its margin, from notBeforeUtc on). */
  planStartUtc: string | null;
  planEndUtc: string | null;
}

/** Addition: the settings the plan used, defaults filled in. */
export interface PlanSettings {
  minElevationDeg: number;
  moonMinSeparationDeg: number;
  sunMinSeparationDeg: number;
  delayLineStrokeM: number | null;
  scienceBlockMin: number;
  calibratorBlockMin: number;
  /** Block lengths actually used, whole seconds (the minutes rounded down). */
  scienceBlockSec: number;
  calibratorBlockSec: number;
  gridStepSec: number;
  safetyMargins: typeof PLAN_SAFETY_MARGINS;
}

export interface PlanResponse {
  night: PlanNight;
  /** Executed and new blocks in time order. */
  blocks: PlanBlock[];
  unplaced: UnplacedTarget[];
  warnings: string[];
  settings: PlanSettings;
}

/** Whole Unix second of an ISO instant, or null. */
export function secondsOfIso(text: string): number | null {
  const ms = Date.parse(text);
  return Number.isFinite(ms) ? ms / 1000 : null;
}

/** Binds an executed block of a validated request to its target and track. */
function placedFromRef(ctx: PlanContext, ref: PlanBlockRef): PlacedBlock {
  const target = ctx.byName.get(ref.target);
  const startSec = secondsOfIso(ref.startUtc);
  const endSec = secondsOfIso(ref.endUtc);
  if (!target || startSec === null || endSec === null) throw new RangeError(`invalid executed block for ${ref.target}`);
  const c = target.input.calibrators.findIndex((x) => x.name === ref.object);
  const track = ref.kind === "science" ? target.science : target.calibrators[c];
  if (!track) throw new RangeError(`executed block: "${ref.object}" is not observed for ${ref.target}`);
  return { kind: ref.kind, target, track, object: ref.object, startSec, endSec, executed: true };
}

/**
 * Plans the night of a validated request (parsePlanRequest applies the defaults).
 * @returns the night, the blocks in time order, the targets that got no time and the warnings
 */
export function computePlan(input: PlanInput): PlanResponse {
  const ctx = buildPlanContext(input);
  const { sky } = ctx;
  const executed = input.executedBlocks.map((ref) => placedFromRef(ctx, ref));
  const notBefore = input.notBeforeUtc === null ? null : secondsOfIso(input.notBeforeUtc);
  const fromSec = Math.max(sky.darkStartSec ?? -Infinity, notBefore === null ? -Infinity : Math.ceil(notBefore));
  const placed = placeSequences(ctx, executed, fromSec);
  const all = [...executed, ...placed].sort((a, b) => a.startSec - b.startSec);
  const blocks = all.map((b) => describeBlock(ctx, b));

  const warnings = [PLAN_SAFETY_WARNING];
  if (sky.count === 0)
    warnings.push(`No astronomical darkness (Sun below −18°) on the night of ${input.date} at this site.`);
  else if (sky.darkEndSec !== null && fromSec + ctx.sequenceSec > sky.darkEndSec) {
    warnings.push(
      "Too little astronomical darkness is left after notBeforeUtc for one sequence: nothing new was planned.",
    );
  }

  const used = scienceUse(all);
  const unplaced: UnplacedTarget[] = [];
  for (const t of ctx.targets) {
    const u = used.get(t);
    if (!u) {
      const r = unplacedReason(ctx, t, fromSec, executed.length > 0);
      unplaced.push({ target: t.input.name, reason: r.reason, code: r.code });
      if (r.code === "sun") warnings.push(`${t.input.name} is not planned. ${r.reason}.`);
    } else if (u.count < t.maxBlocks) {
      warnings.push(
        `${t.input.name}: ${u.count} of ${t.maxBlocks} science blocks planned (${roundTo(t.input.hoursOwed, 2)} h owed).`,
      );
    }
    t.calibrators.forEach((c, i) => {
      if (!t.calibratorUsable[i] && !t.sunExcluded) {
        warnings.push(
          `Calibrator ${c.name} of ${t.input.name} is ${(c.sunSeparationRad * RAD_TO_DEG).toFixed(1)}° from the Sun, inside the ${input.sunMinSeparationDeg}° avoidance angle, and is not used.`,
        );
      }
    });
  }

  if (executed.length > 0) {
    const check = validatePlan(input, blocks, { context: ctx });
    for (const { index, violations } of check.blocks) {
      const b = blocks[index];
      if (!b.executed) continue;
      for (const v of violations) {
        warnings.push(`Executed block ${b.kind} ${b.object} for ${b.target} at ${b.startUtc}: ${v.reason}.`);
      }
    }
  }

  const ev = sky.events;
  return {
    night: {
      date: input.date,
      astronomicalDuskUtc: ev.astronomicalDuskJd === null ? null : isoUtcFromJulianDay(ev.astronomicalDuskJd),
      astronomicalDawnUtc: ev.astronomicalDawnJd === null ? null : isoUtcFromJulianDay(ev.astronomicalDawnJd),
      moonIlluminatedFraction: roundTo(moonIlluminatedFraction(jdeFromJd(ev.localMidnightJd)), 4),
      planStartUtc: sky.count === 0 ? null : isoFromSec(fromSec),
      planEndUtc: sky.darkEndSec === null ? null : isoFromSec(sky.darkEndSec),
    },
    blocks,
    unplaced,
    warnings,
    settings: {
      minElevationDeg: input.minElevationDeg,
      moonMinSeparationDeg: input.moonMinSeparationDeg,
      sunMinSeparationDeg: input.sunMinSeparationDeg,
      delayLineStrokeM: input.delayLineStrokeM,
      scienceBlockMin: input.scienceBlockMin,
      calibratorBlockMin: input.calibratorBlockMin,
      scienceBlockSec: ctx.scienceSec,
      calibratorBlockSec: ctx.calibratorSec,
      gridStepSec: PLAN_GRID_STEP_SEC,
      safetyMargins: PLAN_SAFETY_MARGINS,
    },
  };
}
