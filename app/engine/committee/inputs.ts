/**
 * The inputs of the time-allocation committee's computations, owned by the engine. The `rank` wire
 * schema (api/rank.ts) validates JSON into {@link RankInput}; the other inputs are built by the app from
 * its own records and are checked by the functions themselves (a RangeError names what is wrong).
 *
 * Units at this public edge: scores in the cycle's own scale, angles in degrees, hours of time,
 * positions in metres, dates as YYYY-MM-DD (the night that begins on the local evening of that date).
 */
import type { SiteInput, StationInput } from "../inputs";

// ---------------------------------------------------------------- rank

/** The cycle's score scale: `best` and `worst` are its two ends, in either order (they differ). */
export interface ScoreScale {
  best: number;
  worst: number;
}

/** One reviewer's score of one proposal. At most one review per (reviewer, proposal). */
export interface ReviewScore {
  reviewer: string;
  proposal: string;
  /** Within the scale, ends included; need not be a whole number. */
  score: number;
}

/** The `rank` request: the scale and every submitted score of the cycle. */
export interface RankInput {
  scale: ScoreScale;
  reviews: ReviewScore[];
}

// ---------------------------------------------------------------- dark time and LST pressure

/** How the darkness of an observing period is computed. */
export interface DarkTimeOptions {
  /** Number of LST bins over 24 h of sidereal time (whole, 1..288); default 24 (bins of 1 h). */
  lstBins?: number;
  /**
   * Compute one night in every this many (1..366); default 1 = every night. With k > 1 the period is
   * cut into consecutive blocks of k nights (the last block may be shorter) and the middle night of
   * each block stands for the whole block.
   */
  everyNights?: number;
}

/** A configuration offered in the cycle, as the LST pressure needs it. */
export interface PressureConfiguration {
  id: string;
  /** Nights of the period given to this configuration (≥ 0, may be fractional). */
  nights: number;
  /** Stations in configuration order, with their fixed path offsets. */
  stations: StationInput[];
  /** Delay-line stroke, metres; null for no delay-line limit. */
  delayLineStrokeM: number | null;
  /** Elevation limit of the configuration (the array's), degrees, 0..90. */
  minElevationDeg: number;
}

/** Hours a proposal asks for one target on one configuration. */
export interface PressureRequest {
  proposal: string;
  target: string;
  /** J2000.0 right ascension and declination, degrees. */
  raDeg: number;
  decDeg: number;
  /** Id of a {@link PressureConfiguration}. */
  configuration: string;
  /** Requested hours (≥ 0). */
  hours: number;
  /** The target's own elevation limit, degrees; absent or null = the configuration's. */
  minElevationDeg?: number | null;
}

/** The demand of a cycle: every requested (target, configuration) and the configurations offered. */
export interface LstPressureInput {
  configurations: PressureConfiguration[];
  requests: PressureRequest[];
}

// ---------------------------------------------------------------- allocation

/** One (target, configuration) request with where its hours fall in LST (from the LST pressure). */
export interface AllocationRequest {
  proposal: string;
  target: string;
  configuration: string;
  /** Requested hours, including any the LST pressure found unplaceable. */
  hours: number;
  /** Requested hours per LST bin (Σ ≤ hours; 0 everywhere for an unplaceable target). */
  spreadHours: ArrayLike<number>;
}

/** Capacity of one configuration per LST bin, hours. */
export interface AllocationCapacity {
  configuration: string;
  hoursPerBin: ArrayLike<number>;
}

/** The suggested allocation's input. Every spread and capacity has the same number of bins. */
export interface AllocationInput {
  /** Proposal ids in the order they are walked (the ranking, or the chair's final grades); distinct. */
  order: string[];
  capacity: AllocationCapacity[];
  requests: AllocationRequest[];
  /**
   * Least fraction of its requested hours (all configurations together) a proposal must be granted to be
   * suggested for acceptance, (0, 1]; default 0.5. With 1 a proposal gets all its hours or none.
   */
  minGrantFraction?: number;
}

// ---------------------------------------------------------------- reviewer assignment

export interface AssignmentProposal {
  id: string;
  /** Science category (any label; compared exactly). */
  category: string;
  /** Ids of the PI and co-investigators (conflict when a reviewer is one of them). */
  team: string[];
  /** Institutes of the team (conflict when a reviewer belongs to one; compared trimmed, case-blind). */
  institutes: string[];
}

export interface AssignmentReviewer {
  id: string;
  /** The reviewer's institute; null or empty for none. */
  institute: string | null;
}

/** A conflict a reviewer declared on a proposal. */
export interface DeclaredConflict {
  reviewer: string;
  proposal: string;
  reason?: string;
}

/** An assignment that exists already (scored or in progress) and must be kept. */
export interface KeptAssignment {
  reviewer: string;
  proposal: string;
}

export interface AssignmentInput {
  proposals: AssignmentProposal[];
  reviewers: AssignmentReviewer[];
  conflicts: DeclaredConflict[];
  keep: KeptAssignment[];
  /** Reviewers wanted per proposal, kept ones included (whole, ≥ 1); default 3. */
  reviewersPerProposal?: number;
}

export type { SiteInput, StationInput };
