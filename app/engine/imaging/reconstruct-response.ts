/**
 * The `reconstruct` response: the contract fields (gridSize, pixelMas, image, chi2Vis2, chi2ClosurePhase,
 * iterations, converged) and the additions documented on the type. Images are rounded to 1e-12 (their
 * sum stays 1 within 1e-8).
 */
import { RAD_TO_DEG, RAD_TO_MAS, roundTo } from "../math";
import { assessReconstruction, type ReconstructionAssessment } from "./assessment";
import type { WeightTrial } from "./auto-weight";
import type { ReconstructInput, Regularizer } from "./inputs";
import type { StopReason } from "./projected-lbfgs";
import { type ProgressCallback, type ReconstructionResult, reconstructImage } from "./reconstruct";

export interface FidelityResponse {
  /** Normalized cross-correlation of the reconstruction ⊗ clean beam with the model ⊗ clean beam. */
  ncc: number;
  /** The same against the reconstruction itself (not convolved). */
  nccUnconvolved: number;
  /** Whole-pixel shift (east, north) of the model image that aligned it with the reconstruction. */
  shiftPixels: [number, number];
  cleanBeam: { fwhmMajorMas: number; fwhmMinorMas: number; positionAngleDeg: number; fitted: boolean };
  verdict: string;
  recovered: boolean;
  kind: "binary" | "disk" | "general";
  /** Binary: measured separation (mas), position angle (deg), flux ratio and their errors; disk: diameter (mas). */
  binary?: {
    separationMas: number;
    positionAngleDeg: number;
    fluxRatio: number;
    separationErrorPixels: number;
    positionAngleErrorDeg: number;
  } | null;
  diameterMas?: number | null;
}

export interface ReconstructResponse {
  gridSize: number;
  pixelMas: number;
  image: number[];
  /** Reduced χ² with the errors as given (closure phases as wrapped angles). */
  chi2Vis2: number;
  chi2ClosurePhase: number;
  iterations: number;
  converged: boolean;
  /** Additions. */
  fieldOfViewMas: number;
  regularizer: Regularizer;
  /** The weight used (the one found when "auto"), and whether it was found automatically. */
  weight: number;
  weightAuto: boolean;
  weightTrials: WeightTrial[] | null;
  /** Whether χ²_ν = 1 was bracketed by the automatic search (null for a given weight). */
  weightBracketed: boolean | null;
  /** R of the final image, J = χ²_ν + weight·R, and the χ² the fit used (closure-phase weights of the fit). */
  regularization: number;
  objective: number;
  chi2Fitted: number;
  chi2ClosurePhaseFitted: number;
  closurePhaseWeighting: "amplitude" | "given";
  evaluations: number;
  stopReason: StopReason;
  shiftPixels: [number, number];
  startFwhmMas: number | null;
  /** Data points whose error was 0 and was replaced by a floor. */
  flooredErrors: number;
  /** Distinct uv points the transform evaluates. */
  uvPoints: number;
  /** When the request gives the model: fidelity, verdict and the two comparison images. */
  fidelity?: FidelityResponse;
  modelImage?: number[];
  dirtyImage?: number[];
}

const round = (x: number, d: number) => roundTo(x, d);
const imageList = (img: Float64Array) => Array.from(img, (x) => roundTo(x, 12));

/** Serializes a reconstruction (and its assessment against the model, when there is one). */
export function reconstructResponse(
  input: ReconstructInput,
  result: ReconstructionResult,
  assessment: ReconstructionAssessment | null,
): ReconstructResponse {
  const pixelMas = result.pixelRad * RAD_TO_MAS;
  const out: ReconstructResponse = {
    gridSize: result.n,
    pixelMas: round(pixelMas, 9),
    image: imageList(result.image),
    chi2Vis2: round(result.chi2Vis2, 6),
    chi2ClosurePhase: round(result.chi2ClosurePhase, 6),
    iterations: result.iterations,
    converged: result.converged,
    fieldOfViewMas: round(pixelMas * result.n, 6),
    regularizer: input.image.regularizer,
    weight: round(result.weight, 9),
    weightAuto: input.image.weight === "auto",
    weightTrials:
      result.weightTrials?.map((t) => ({ ...t, weight: round(t.weight, 9), chi2: round(t.chi2, 6) })) ?? null,
    weightBracketed: result.weightBracketed,
    regularization: round(result.regularization, 6),
    objective: round(result.objective, 6),
    chi2Fitted: round(result.chi2Fitted, 6),
    chi2ClosurePhaseFitted: round(result.chi2ClosurePhaseFitted, 6),
    closurePhaseWeighting: input.image.closurePhaseWeighting,
    evaluations: result.evaluations,
    stopReason: result.stopReason,
    shiftPixels: result.shiftPixels,
    startFwhmMas: result.startFwhmRad === null ? null : round(result.startFwhmRad * RAD_TO_MAS, 6),
    flooredErrors: result.data.flooredErrors,
    uvPoints: result.data.uW.length,
  };
  if (assessment) {
    const b = assessment.cleanBeam;
    out.fidelity = {
      ncc: round(assessment.ncc, 6),
      nccUnconvolved: round(assessment.nccUnconvolved, 6),
      shiftPixels: assessment.shiftPixels,
      cleanBeam: {
        fwhmMajorMas: round(b.fwhmMajorRad * RAD_TO_MAS, 6),
        fwhmMinorMas: round(b.fwhmMinorRad * RAD_TO_MAS, 6),
        positionAngleDeg: round(b.positionAngleRad * RAD_TO_DEG, 3),
        fitted: b.fitted,
      },
      verdict: assessment.verdict.text,
      recovered: assessment.verdict.recovered,
      kind: assessment.verdict.kind,
    };
    const m = assessment.verdict.binary;
    if (assessment.verdict.kind === "binary") {
      out.fidelity.binary = m
        ? {
            separationMas: round(m.separationMas, 6),
            positionAngleDeg: round(m.positionAngleDeg, 4),
            fluxRatio: round(m.fluxRatio, 6),
            separationErrorPixels: round(m.separationErrorPixels, 6),
            positionAngleErrorDeg: round(m.positionAngleErrorDeg, 4),
          }
        : null;
    }
    if (assessment.verdict.kind === "disk") {
      const d = assessment.verdict.diameterMas;
      out.fidelity.diameterMas = d === null || d === undefined ? null : round(d, 6);
    }
    out.modelImage = imageList(assessment.modelImage);
    out.dirtyImage = Array.from(assessment.dirtyImage, (x) => roundTo(x, 9));
  }
  return out;
}

/** Runs a validated reconstruct request end to end (reconstruction, then the assessment when a model is given). */
export function computeReconstruction(input: ReconstructInput, progress?: ProgressCallback): ReconstructResponse {
  const result = reconstructImage(input, progress);
  const assessment = input.model ? assessReconstruction(result, input.model) : null;
  return reconstructResponse(input, result, assessment);
}
