/**
 * Inputs of the night planner, owned by the engine (the wire schema in `api/plan.ts` validates JSON
 * into these shapes). Units at this public edge: degrees, minutes, hours, metres, ISO-8601 UTC.
 */
import type { SiteInput, StationInput } from "../inputs";

/** A calibrator star of one science target: J2000.0 position, degrees. */
export interface PlanCalibratorInput {
  name: string;
  raDeg: number;
  decDeg: number;
}

/** A candidate science target. */
export interface PlanTargetInput {
  /** Distinct among the request's targets. */
  name: string;
  /** J2000.0 right ascension, degrees [0, 360]. */
  raDeg: number;
  /** J2000.0 declination, degrees [−90, 90]. */
  decDeg: number;
  /** Lower numbers are planned first. */
  priority: number;
  /** Science time still owed, hours (≥ 0); allowed time is rounded up to whole science blocks. */
  hoursOwed: number;
  /** The target's own elevation limit, degrees; null to use the request's. */
  minElevationDeg: number | null;
  /** The target's own calibrators, in order of preference. */
  calibrators: PlanCalibratorInput[];
}

/** A block as the pages and the re-plan pass it: what is observed, for which target, when. */
export interface PlanBlockRef {
  kind: "calibrator" | "science";
  /** The science target the block serves. */
  target: string;
  /** What the telescopes point at: the target itself or one of its calibrators. */
  object: string;
  /** ISO-8601 UTC instants, whole seconds. */
  startUtc: string;
  endUtc: string;
}

/** One night's planning request (all defaults already applied). */
export interface PlanInput {
  site: SiteInput;
  /** The night of this date begins on its local evening at the site. */
  date: string;
  stations: StationInput[];
  /** Delay-line stroke, metres; null for no delay-line check. */
  delayLineStrokeM: number | null;
  /** Elevation limit of targets without their own, degrees. */
  minElevationDeg: number;
  /** Least angular distance from the Moon, degrees (0: no Moon check). */
  moonMinSeparationDeg: number;
  /** Least angular distance from the Sun for any object to be planned, degrees. */
  sunMinSeparationDeg: number;
  /** Science block length, minutes (rounded to whole seconds). */
  scienceBlockMin: number;
  /** Calibrator block length, minutes (rounded to whole seconds). */
  calibratorBlockMin: number;
  targets: PlanTargetInput[];
  /** Plan only from this instant on (re-plan of the rest of a night); null for the whole night. */
  notBeforeUtc: string | null;
  /** Blocks already executed (or otherwise fixed): kept as they are, their science time counts. */
  executedBlocks: PlanBlockRef[];
}

/** Defaults of the optional request fields. */
export const PLAN_DEFAULTS = {
  /** Air mass 2; the same default as the coverage request. */
  minElevationDeg: 30,
  /** Common practice for bright-time infrared work (the contract's example value). */
  moonMinSeparationDeg: 10,
  /** Common practice (from memory): no pointing within 45° of the Sun. */
  sunMinSeparationDeg: 45,
  scienceBlockMin: 40,
  calibratorBlockMin: 15,
  delayLineStrokeM: null,
} as const;

/**
 * Safety margins the planner keeps beyond each limit, so that an independent ephemeris (apparent
 * instead of mean places, apparent sidereal time, another solar or lunar theory, a topocentric Moon)
 * still finds every block inside its limits. Each is a few seconds of time at the fastest rates
 * (the sky turns 0.25° per minute).
 */
export const PLAN_SAFETY_MARGINS = {
  /** The Sun must be this far below −18°, degrees (≈ 12 s at the equator). */
  sunAltitudeDeg: 0.05,
  /** Elevation kept above the limit, degrees (≥ 12 s). */
  elevationDeg: 0.05,
  /** Delay kept inside the stroke, metres (≥ 14 s on a 500 m baseline). */
  delayLineM: 0.5,
  /**
   * Moon distance kept beyond the limit, degrees, in addition to the Moon's horizontal parallax
   * (Meeus 1998 ch. 47, sin π = 6378.14 km / Δ; ≈ 0.9–1.0°), which bounds the shift between the
   * geocentric Moon used here and a topocentric one.
   */
  moonDeg: 0.1,
} as const;

/** Step of the sampled night on which every constraint is evaluated, seconds (block ends are exact). */
export const PLAN_GRID_STEP_SEC = 60;
