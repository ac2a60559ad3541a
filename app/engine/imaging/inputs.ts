/**
 * Inputs of the imaging computations (simulate, reconstruct), owned by the engine. The wire schemas in
 * `api/simulate.ts` and `api/reconstruct.ts` validate JSON into these shapes and are checked against them
 * at compile time. Units at this edge: degrees, milliarcseconds, hours, metres.
 */
import type { CoverageInput, TargetModel } from "../inputs";

/** Error model of the simulated data. */
export interface NoiseInput {
  /** σ(V²) = vis2Relative × max(V², 0.01); 0 for noise-free V². */
  vis2Relative: number;
  /** σ(closure phase), degrees; 0 for noise-free closure phases. */
  closurePhaseDeg: number;
  /** Seed of the generator (an integer; the same seed gives the same data). */
  seed: number;
}

/** Which closure phases are returned: every triangle, or the (N−1)(N−2)/2 that contain the first station. */
export type ClosurePhaseTriangles = "all" | "independent";

/** Descriptive fields of the OIFITS file (none changes the data). */
export interface OifitsOptions {
  /** ARRNAME, at most 68 characters. */
  arrayName: string;
  /** INSNAME, at most 68 characters. */
  instrumentName: string;
  /** DIAMETER of every telescope, metres (also sets FOV = λ_max / D). */
  telescopeDiameterM: number;
}

/** A `simulate` request: a coverage request plus the error model. */
export interface SimulateInput extends CoverageInput {
  noise: NoiseInput;
  closurePhaseTriangles: ClosurePhaseTriangles;
  oifits: OifitsOptions;
}

/** One squared-visibility measurement, as on the wire. */
export interface Vis2Datum {
  stations?: string[];
  hourAngleH?: number;
  uM: number;
  vM: number;
  wavelengthM: number;
  vis2: number;
  vis2Err: number;
}

/** One closure-phase measurement, as on the wire; (u1, v1) is the baseline a–b and (u2, v2) b–c. */
export interface ClosurePhaseDatum {
  stations?: string[];
  hourAngleH?: number;
  wavelengthM: number;
  u1M: number;
  v1M: number;
  u2M: number;
  v2M: number;
  closurePhaseDeg: number;
  closurePhaseErrDeg: number;
}

export interface ImagingData {
  vis2: Vis2Datum[];
  closurePhases: ClosurePhaseDatum[];
}

export type Regularizer = "entropy" | "totalVariation" | "compactness";

/** Prior image of the entropy: flat, or a centred circular Gaussian of the given FWHM. */
export type PriorInput = { type: "flat" } | { type: "gaussian"; fwhmMas: number };

/** Start image: flat, a centred Gaussian (FWHM given, or fitted to the V² data when null), or the dirty image. */
export type StartInput = { type: "flat" } | { type: "gaussian"; fwhmMas: number | null } | { type: "dirty" };

export interface ImageOptions {
  /** Pixels per side, 32–128. */
  gridSize: number;
  /** Pixel size, mas; null for λ/(4 B_max) of the data. */
  pixelMas: number | null;
  regularizer: Regularizer;
  /** Weight of the regularizer against the reduced χ², or "auto" (reduced χ² ≈ 1). */
  weight: number | "auto";
  maxIterations: number;
  /** Seed of the start image's perturbation. */
  seed: number;
  prior: PriorInput;
  start: StartInput;
  /** Relative decrease of the objective below which the optimizer stops. */
  tolerance: number;
  /** Closure-phase weights of the fit: widened by the V² errors near visibility nulls ("amplitude"), or as given. */
  closurePhaseWeighting: "amplitude" | "given";
}

/** A `reconstruct` request; `model`, when given, adds the fidelity figure and the verdict. */
export interface ReconstructInput {
  data: ImagingData;
  image: ImageOptions;
  model: TargetModel | null;
}
