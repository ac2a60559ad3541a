/**
 * A placed block as the response lists it: times in UTC and LST, hour angle, elevation and air mass
 * at both ends, and the least Moon distance during the block.
 */
import { airmassKastenYoung } from "../astro/airmass";
import { RAD_TO_DEG, RAD_TO_HOUR, roundTo, wrapHours12 } from "../math";
import type { PlanContext } from "./context";
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
    startLstH: roundTo(start.sky.lmstRad * RAD_TO_HOUR, 4),
    hourAngleStartH: roundTo(wrapHours12(start.haRad * RAD_TO_HOUR), 4),
    hourAngleEndH: roundTo(wrapHours12(end.haRad * RAD_TO_HOUR), 4),
    elevationStartDeg: roundTo(elS, 2),
    elevationEndDeg: roundTo(elE, 2),
    airmassStart: airmass(elS),
    airmassEnd: airmass(elE),
    moonSeparationDeg: roundTo(moonSep * RAD_TO_DEG, 2),
    executed: b.executed,
  };
}
