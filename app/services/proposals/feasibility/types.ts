/**
 * The shapes of the feasibility report: its documented thresholds, the verdicts, what it reads (site,
 * band, configurations, targets, cycle) and what it writes (one cell per target × configuration, each
 * with its lines). Pure: types and constants only.
 */
import type { StationInput } from "~/engine";

/**
 * Thresholds of the report. They are our choices (common practice for a first look, not a
 * standard), stated on the report page so a proposer can see why a line reads as it does.
 */
export const FEASIBILITY_THRESHOLDS = {
  /** Hour-angle sampling of each night, minutes (coarser than the Sketchpad's, for speed). */
  stepMin: 15,
  /** Below this many observable hours on a sampled night the line is a caution. */
  minHoursPerNight: 1,
  /** "Too resolved": V² at the shortest projected baseline (best channel) below this. */
  tooResolvedVis2: 0.05,
  /** "Unresolved": the lowest V² anywhere (every observable point and channel) above this. */
  unresolvedVis2: 0.95,
  /** A magnitude within this margin of the band's limit (brighter side) is a caution. */
  magnitudeMarginMag: 0.5,
  /** At most this many nights are sampled inside one time-critical window. */
  maxWindowNights: 14,
} as const;

/** The verdicts, from best to worst. */
export const VERDICTS = ["pass", "caution", "fail"] as const;
export type Verdict = (typeof VERDICTS)[number];

/** The worst of a list of verdicts ("pass" for none). */
export function worstVerdict(list: Iterable<Verdict>): Verdict {
  let out: Verdict = "pass";
  for (const v of list) if (VERDICTS.indexOf(v) > VERDICTS.indexOf(out)) out = v;
  return out;
}

// ---------------------------------------------------------------- inputs

export interface FeasibilitySite {
  latitudeDeg: number;
  longitudeDeg: number;
  altitudeM: number;
  /** The array's own elevation limit, degrees. */
  minElevationDeg: number;
  /** Delay-line stroke, metres. */
  delayLineStrokeM: number;
}

export interface FeasibilityBand {
  instrumentName: string;
  /** Telescopes the combiner takes at once. */
  maxTelescopes: number;
  name: string;
  centralWavelengthM: number;
  bandwidthM: number;
  channels: number;
  limitingMagnitude: number;
}

export interface FeasibilityConfiguration {
  name: string;
  /** Stations in configuration order, with their fixed path offsets. */
  stations: StationInput[];
}

export interface FeasibilityTarget {
  name: string;
  raDeg: number;
  decDeg: number;
  /** As stored; validated here with the API's model schema. */
  model: unknown;
  magnitudes: Record<string, number>;
  /** The target's own elevation limit, degrees; null = the site's. */
  minElevationDeg: number | null;
  timeWindows: { startUtc: string; endUtc: string; note?: string }[];
}

export interface FeasibilityInput {
  site: FeasibilitySite;
  cycle: { name: string; observingStart: string; observingEnd: string };
  band: FeasibilityBand | null;
  configurations: FeasibilityConfiguration[];
  targets: FeasibilityTarget[];
  /** Sampling step, minutes; default FEASIBILITY_THRESHOLDS.stepMin. */
  stepMin?: number;
}

// ---------------------------------------------------------------- outputs

export type FeasibilityCheck =
  | "combiner"
  | "observable-time"
  | "windows"
  | "resolution"
  | "visibility"
  | "magnitude"
  | "closure"
  | "model";

export interface FeasibilityLine {
  check: FeasibilityCheck;
  label: string;
  verdict: Verdict;
  reason: string;
}

export interface FeasibilityNight {
  /** The night that begins on the evening of this date. */
  date: string;
  /** "start", "middle" or "end" of the cycle. */
  when: "start" | "middle" | "end";
  darkHours: number;
  /** Hours the target is above its elevation limit in darkness, whatever the delay lines. */
  upHours: number;
  /** Hours with every baseline of the configuration within the delay-line stroke as well. */
  observableHours: number;
}

export interface FeasibilityCell {
  target: string;
  configuration: string;
  verdict: Verdict;
  nights: FeasibilityNight[];
  figures: {
    longestBaselineM: number | null;
    shortestBaselineM: number | null;
    resolutionMas: number | null;
    sizeMas: number | null;
    vis2Min: number | null;
    vis2Max: number | null;
    observableTriangles: number | null;
    triangles: number;
  };
  lines: FeasibilityLine[];
}

export interface FeasibilityReport {
  computedAt: string;
  cycle: string;
  band: string | null;
  stepMin: number;
  thresholds: typeof FEASIBILITY_THRESHOLDS;
  verdict: Verdict;
  /** Problems of the proposal as a whole (no band, no target, no configuration). */
  problems: FeasibilityLine[];
  cells: FeasibilityCell[];
  /** Milliseconds the computation took. */
  elapsedMs: number;
}
