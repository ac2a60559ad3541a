/**
 * Inputs and responses of the star-catalogue computations (`cli resolve`, `cli calibrators`), owned by
 * the engine; the wire schemas in api/resolve.ts and api/calibrators.ts validate JSON into the inputs.
 * Units at this edge: degrees, milliarcseconds, hours, metres, magnitudes; dates YYYY-MM-DD.
 */
import type { SiteInput } from "../inputs";

export interface ResolveInput {
  name: string;
}

export interface ResolveResponse {
  /** Preferred display name: proper name, else Bayer, Flamsteed, variable, HD, HIP designation. */
  name: string;
  hip: number;
  /** Henry Draper number, null when the data give none. */
  hd: number | null;
  /** J2000 position, degrees. */
  raDeg: number;
  decDeg: number;
  vMag: number;
  /** B−V, null when the data give none. */
  bv: number | null;
  /** Every designation, display form ("Betelgeuse", "α Ori", "58 Ori", "HD 39801", "HIP 27989"). */
  designations: string[];
  /** How the typed name matched: catalogue number, designation, name, or typo (a forgiven small typo). */
  matchedBy: "catalogue number" | "designation" | "name" | "typo";
  /** Other stars carrying the same name, when it is shared (display names); the brightest is returned. */
  alsoNamed: string[];
}

/** The target of a shortlist: a catalogue name, or J2000 coordinates. */
export type CalibratorTarget =
  | { name: string; bandMag: number | null }
  | { raDeg: number; decDeg: number; bandMag: number | null };

export interface CalibratorsInput {
  target: CalibratorTarget;
  /** Observing wavelength, metres; also picks the band of the magnitude estimates. */
  wavelengthM: number;
  /** Longest (projected) baseline of the configuration, metres. */
  longestBaselineM: number;
  site: SiteInput;
  /** The night of this date (it begins on the local evening of the date). */
  date: string;
  minElevationDeg: number;
  maxDistanceDeg: number;
  minVis2: number;
  limit: number;
  /** Largest |band magnitude − target's band magnitude| accepted, mag; null for no limit. */
  maxMagDifference: number | null;
  /** Faintest band magnitude accepted (the instrument's limit), mag; null for no limit. */
  bandLimitMag: number | null;
}

export interface CalibratorEntry {
  name: string;
  hip: number;
  raDeg: number;
  decDeg: number;
  /** Angular distance from the target, degrees. */
  distanceDeg: number;
  vMag: number;
  bv: number;
  /** Estimated magnitude in the band of wavelengthM (estimate), and its 1σ uncertainty. */
  bandMag: number | null;
  bandMagErr: number | null;
  /** Estimated angular diameter (estimate), mas, and its 1σ uncertainty. */
  diameterMas: number;
  diameterErrMas: number;
  /** Uniform-disk squared visibility of diameterMas at longestBaselineM and wavelengthM. */
  vis2: number;
  /** Hours of the astronomical night when both this star and the target are above minElevationDeg. */
  observableHours: number;
  /** 0..100, higher is better; see SCORE_WEIGHTS. */
  score: number;
  reasons: string[];
}

export interface CalibratorsResponse {
  target: {
    name: string | null;
    hip: number | null;
    raDeg: number;
    decDeg: number;
    vMag: number | null;
    bv: number | null;
    bandMag: number | null;
    /** "request" when the request gave it, "estimate" when estimated from the catalogue, null if unknown. */
    bandMagSource: "request" | "estimate" | null;
    /** Hours of the astronomical night with the target above minElevationDeg. */
    observableHours: number;
  };
  band: { name: string; centralWavelengthM: number };
  night: { astronomicalDuskUtc: string | null; astronomicalDawnUtc: string | null; stepMin: number };
  calibrators: CalibratorEntry[];
  /** How many stars within maxDistanceDeg were left out, by cause. */
  excluded: {
    target: number;
    noColour: number;
    colourOutOfRange: number;
    resolved: number;
    magnitude: number;
    notTogether: number;
  };
  /** Candidates that passed every rule (before `limit`). */
  candidates: number;
  warnings: string[];
  /** How the score is made. */
  scoring: string;
}
