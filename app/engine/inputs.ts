/**
 * The inputs of the engine's computations, owned by the engine. The wire schemas in `api/` validate
 * JSON into these shapes (and are checked against them at compile time); the core never imports the
 * wire schemas.
 *
 * Units follow the project conventions at this public edge: angles in degrees, angular sizes in
 * milliarcseconds, hour angles in hours, wavelengths and positions in metres, dates as YYYY-MM-DD.
 */

/** Geographic site. `altitudeM` is accepted for completeness; the geocentric computations do not use it. */
export interface SiteInput {
  latitudeDeg: number;
  longitudeDeg: number;
  altitudeM: number;
}

/** A station in local east/north/up metres with its fixed optical path offset, metres. */
export interface StationInput {
  name: string;
  eastM: number;
  northM: number;
  upM: number;
  pathOffsetM: number;
}

/** Brightness models (PRODUCT.md capability 3). Position angles east of north; flux ratio secondary/primary. */
export type TargetModel =
  | { type: "point" }
  | { type: "uniformDisk"; diameterMas: number }
  | { type: "gaussian"; fwhmMas: number }
  | { type: "limbDarkenedDisk"; diameterMas: number; coefficient: number }
  | { type: "ring"; diameterMas: number }
  | { type: "binary"; separationMas: number; positionAngleDeg: number; fluxRatio: number }
  | { type: "sum"; components: SumComponent[] };

export interface SumComponent {
  model: TargetModel;
  /** Relative flux (any positive scale; normalized by the total). */
  flux: number;
  /** Offset of the component's centre toward east, mas. */
  offsetEastMas: number;
  /** Offset of the component's centre toward north, mas. */
  offsetNorthMas: number;
}

/** A target: J2000 RA/Dec in degrees and its model. */
export interface TargetInput {
  name?: string;
  raDeg: number;
  decDeg: number;
  model: TargetModel;
}

/** Samples across the astronomical night of `date` every `stepMin` minutes. */
export interface NightSampling {
  date: string;
  stepMin: number;
}

/** Dirty-beam options. */
export interface BeamOptions {
  gridSize: number;
  weighting: "natural" | "uniform" | "robust";
  /** Briggs robustness R for weighting "robust": −2 (near uniform) .. 2 (near natural). */
  robust: number;
  /** When true the response carries the beam image and the model's dirty image. */
  includeImages: boolean;
}

/** What the observation stage reads: shared by the coverage and triangle computations. */
export interface ObservationInput {
  site: SiteInput;
  stations: StationInput[];
  target: TargetInput;
  wavelengthsM: number[];
  /** Exactly one of hourAnglesH and night is given. */
  hourAnglesH?: number[];
  night?: NightSampling;
  minElevationDeg: number;
  delayLineStrokeM: number | null;
}

/** A coverage computation; `beam: null` asks for no beam. */
export interface CoverageInput extends ObservationInput {
  beam: BeamOptions | null;
}

/** A triangle ranking; `maxTriangles` caps the list returned. */
export interface TrianglesInput extends ObservationInput {
  maxTriangles: number;
}

/** The ephemeris of the night of `date` at `site`. */
export interface EphemerisInput {
  site: SiteInput;
  date: string;
}
