/**
 * A placed block as the response lists it: times in UTC and LST, hour angle, elevation and air mass
 * at both ends, and the least Moon distance during the block.
 */
import { airmassKastenYoung } from "../astro/airmass";
import { RAD_TO_DEG, RAD_TO_HOUR, roundTo, wrapHours12, wrapHours24 } from "../math";
import { buildPlanContext, type PlanContext } from "./context";
import type { PlanBlockRef, PlanInput } from "./inputs";
import { isoFromSec } from "./night-sky";
import type { PlacedBlock } from "./sequences";

export interface PlanBlock {
  kind: "calibrator" | "science";
  /** The science target the block serves. */
  target: string;
  /** What the telescopes point at: the target or one of its calibrators. */
  object: string;
  /** ISO-8601 UTC, whole seconds. */
  startUtc: string;
  endUtc: string;
  /** Local mean sidereal time at the start, hours [0, 24). */
  startLstH: number;
  /** Hour angle of the object (LMST − α of date), hours [−12, 12). */
  hourAngleStartH: number;
  hourAngleEndH: number;
  /** Geometric elevation, degrees. */
  elevationStartDeg: number;
  elevationEndDeg: number;
  /** Kasten & Young (1989) air mass; null below the horizon. */
  airmassStart: number | null;
  airmassEnd: number | null;
  /** Least geocentric distance from the Moon during the block (ends and every grid instant), degrees. */
  moonSeparationDeg: number;
  /** Addition: the block was passed in as executed and kept unchanged. */
  executed: boolean;
}

/** Rounded to 1e-4 h, the upper end folded after rounding (11.99999 h reads −12, 23.99999 h reads 0). */
const ha = (rad: number) => {
  const h = roundTo(wrapHours12(rad * RAD_TO_HOUR), 4);
  return h >= 12 ? h - 24 : h;
};
const lst = (rad: number) => {
  const h = roundTo(wrapHours24(rad * RAD_TO_HOUR), 4);
  return h >= 24 ? h - 24 : h;
};

const airmass = (elevDeg: number) => {
  const x = airmassKastenYoung(elevDeg);
  return Number.isFinite(x) ? roundTo(x, 3) : null;
};

/** Serializes a placed block. */
export function describeBlock(ctx: PlanContext, b: PlacedBlock): PlanBlock {
  const { sky } = ctx;
  const start = b.track.stateAt(b.startSec);
  const end = b.track.stateAt(b.endSec);
  let moonSep = Math.min(start.moonSepRad, end.moonSepRad);
  const lo = Math.max(0, Math.ceil((b.startSec - sky.originSec) / sky.stepSec));
  const hi = Math.min(sky.count - 1, Math.floor((b.endSec - sky.originSec) / sky.stepSec));
  for (let k = lo; k <= hi; k++) moonSep = Math.min(moonSep, b.track.moonSepRad[k]);
  const elS = start.elevRad * RAD_TO_DEG;
  const elE = end.elevRad * RAD_TO_DEG;
  return {
    kind: b.kind,
    target: b.target.input.name,
    object: b.object,
    startUtc: isoFromSec(b.startSec),
    endUtc: isoFromSec(b.endSec),
    startLstH: lst(start.sky.lmstRad),
    hourAngleStartH: ha(start.haRad),
    hourAngleEndH: ha(end.haRad),
    elevationStartDeg: roundTo(elS, 2),
    elevationEndDeg: roundTo(elE, 2),
    airmassStart: airmass(elS),
    airmassEnd: airmass(elE),
    moonSeparationDeg: roundTo(moonSep * RAD_TO_DEG, 2),
    executed: b.executed,
  };
}

/**
 * The response fields of blocks given by reference (e.g. after an edit by hand), so that a table can
 * show them before they are validated. A block whose target, object or times cannot be resolved gives
 * null; `executed` is copied from the reference when it carries one.
 * @param context a context already built for this request (optional)
 */
export function describePlanBlocks(
  input: PlanInput,
  refs: readonly (PlanBlockRef & { executed?: boolean })[],
  context?: PlanContext,
): (PlanBlock | null)[] {
  const ctx = context ?? buildPlanContext(input);
  return refs.map((ref) => {
    const target = ctx.byName.get(ref.target);
    if (!target) return null;
    const track =
      ref.kind === "science"
        ? ref.object === target.input.name
          ? target.science
          : undefined
        : target.calibrators[target.input.calibrators.findIndex((c) => c.name === ref.object)];
    const startSec = Date.parse(ref.startUtc) / 1000;
    const endSec = Date.parse(ref.endUtc) / 1000;
    if (!track || !Number.isInteger(startSec) || !Number.isInteger(endSec) || endSec <= startSec) return null;
    const executed = ref.executed === true;
    return describeBlock(ctx, { kind: ref.kind, target, track, object: ref.object, startSec, endSec, executed });
  });
}
