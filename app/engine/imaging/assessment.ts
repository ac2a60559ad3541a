/**
 * The comparison of a reconstruction with the model it came from: clean beam, model image (model ⊗ clean
 * beam), the model's dirty image, the fidelity figure and the verdict (fidelity.ts, verdict.ts).
 */
import type { TargetModel } from "../inputs";
import { compileModel } from "../interferometry/models";
import { cleanBeamAndDirtyImage, convolvedModelImage, convolveWithBeam, fidelity, type GaussianBeam } from "./fidelity";
import type { ReconstructionResult } from "./reconstruct";
import { type Verdict, verdictFor } from "./verdict";

export interface ReconstructionAssessment {
  /** Normalized cross-correlation of the restored reconstruction (⊗ clean beam) with the model image, −1 … 1. */
  ncc: number;
  /** The same with the reconstruction as it is (not convolved). */
  nccUnconvolved: number;
  /** Whole-pixel shift (east, north) of the model image that gave it. */
  shiftPixels: [number, number];
  cleanBeam: GaussianBeam;
  /** Model ⊗ clean beam, reconstruction ⊗ clean beam and the model's dirty image (N² values each). */
  modelImage: Float64Array;
  restoredImage: Float64Array;
  dirtyImage: Float64Array;
  verdict: Verdict;
}

export function assessReconstruction(result: ReconstructionResult, model: TargetModel): ReconstructionAssessment {
  const compiled = compileModel(model);
  const { n, pixelRad, data } = result;
  const { beam, dirty } = cleanBeamAndDirtyImage(compiled, data.uW, data.vW, data.maxRadiusW, n, pixelRad);
  const modelImage = convolvedModelImage(compiled, n, pixelRad, beam);
  const restoredImage = convolveWithBeam(result.image, n, pixelRad, beam);
  const f = fidelity(restoredImage, modelImage, n);
  const raw = fidelity(result.image, modelImage, n);
  return {
    ncc: f.ncc,
    nccUnconvolved: raw.ncc,
    shiftPixels: f.shiftPixels,
    cleanBeam: beam,
    modelImage,
    restoredImage,
    dirtyImage: dirty,
    verdict: verdictFor(model, result.image, n, pixelRad, beam, f.ncc),
  };
}
