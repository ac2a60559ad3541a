/**
 * Image reconstruction by regularized maximum likelihood: minimize J = χ²_ν + weight · R(p) over images
 * p ≥ 0 with Σ p = 1 (objective.ts), the visibilities by the non-uniform FFT (nufft.ts), the minimizer the
 * projected L-BFGS of projected-lbfgs.ts with the initial inverse Hessian scaled by the entropy metric
 * diag(x + 0.01·x̄) (Skilling & Bryan 1984, MNRAS 211, 111 use the metric diag(p) for this reason: pixel
 * values span orders of magnitude; a diagonal H₀ in L-BFGS as in Gilbert & Lemaréchal 1989, Math. Program.
 * 45, 407).
 *
 * Grid: N × N (32–128), pixel Δ = λ/(4 B_max) of the data unless given, i.e. 1/(4 r_max) with r_max the
 * longest spatial frequency. Start: a Gaussian with the FWHM fitted to the V² data (clamped to 2 … N/4
 * pixels) unless asked otherwise, with a seeded 1 % perturbation. Weight "auto": auto-weight.ts, trial
 * runs of max(30, maxIterations/4) iterations, then the full run. V² and closure phases carry no absolute
 * position, so the result is shifted by whole pixels to put its centroid on the phase centre (N/2, N/2).
 */
import { MAS_TO_RAD } from "../math";
import { searchWeight, type WeightTrial } from "./auto-weight";
import { type PreparedData, prepareData } from "./data";
import type { ReconstructInput } from "./inputs";
import { ImageTransform } from "./nufft";
import { ImagingObjective } from "./objective";
import { minimizeBounded, type StopReason } from "./projected-lbfgs";
import { RegularizationTerm } from "./regularizers";
import { dirtyAmplitudeImage, fitGaussianFwhmRad, flatImage, gaussianImage, normalize, perturb } from "./start-image";

export interface ReconstructionResult {
  n: number;
  pixelRad: number;
  /** N² values, Σ = 1, row-major, row toward north, column toward east, phase centre (N/2, N/2). */
  image: Float64Array;
  /** Reduced χ² with the errors as given. */
  chi2Vis2: number;
  chi2ClosurePhase: number;
  /** Reduced χ² of the fit: closure phases with the weights the fit used, and over all data (χ²_ν of J). */
  chi2ClosurePhaseFitted: number;
  chi2Fitted: number;
  regularization: number;
  weight: number;
  objective: number;
  iterations: number;
  evaluations: number;
  converged: boolean;
  stopReason: StopReason;
  /** Whole-pixel shift applied to centre the image (east, north). */
  shiftPixels: [number, number];
  /** Trials of the automatic weight (null for a given weight) and whether χ²_ν = 1 was bracketed. */
  weightTrials: WeightTrial[] | null;
  weightBracketed: boolean | null;
  startFwhmRad: number | null;
  data: PreparedData;
  transform: ImageTransform;
}

/** Called after every optimizer iteration with the running iteration count and χ²_ν; return true to stop. */
export type ProgressCallback = (iteration: number, chi2: number) => boolean | undefined;

/** Reconstructs an image from validated data. @throws RangeError when no datum has a non-zero baseline. */
export function reconstructImage(input: ReconstructInput, progress?: ProgressCallback): ReconstructionResult {
  const opts = input.image;
  const data = prepareData(input.data, opts.closurePhaseWeighting);
  if (!(data.maxRadiusW > 0)) throw new RangeError("data: every baseline has zero length: no image scale");
  const n = opts.gridSize;
  const pixelRad = opts.pixelMas !== null ? opts.pixelMas * MAS_TO_RAD : 1 / (4 * data.maxRadiusW);
  const transform = new ImageTransform(n, pixelRad, data.uW, data.vW);

  const prior =
    opts.prior.type === "gaussian" && opts.regularizer === "entropy"
      ? gaussianImage(n, (opts.prior.fwhmMas * MAS_TO_RAD) / pixelRad)
      : null;
  const regularizer = new RegularizationTerm(opts.regularizer, n, prior);
  const objective = new ImagingObjective(data, transform, regularizer, 0);

  let startFwhmRad: number | null = null;
  let start: Float64Array;
  if (opts.start.type === "flat") start = flatImage(n);
  else if (opts.start.type === "dirty") start = dirtyAmplitudeImage(data, transform);
  else {
    startFwhmRad = opts.start.fwhmMas !== null ? opts.start.fwhmMas * MAS_TO_RAD : fitGaussianFwhmRad(data);
    start = gaussianImage(n, Math.min(n / 4, Math.max(2, startFwhmRad / pixelRad)));
  }
  start = perturb(start, opts.seed);

  let iterations = 0;
  let stopped = false;
  const metric = (x: Float64Array, out: Float64Array) => {
    let s = 0;
    for (let i = 0; i < x.length; i++) s += x[i];
    const floor = (0.01 * s) / x.length;
    for (let i = 0; i < x.length; i++) out[i] = x[i] + floor;
  };
  const run = (weight: number, from: Float64Array, maxIterations: number) => {
    objective.weight = weight;
    const result = minimizeBounded((x, g) => objective.evaluate(x, g), from, {
      lower: 0,
      maxIterations,
      objectiveTolerance: opts.tolerance,
      gradientTolerance: 0,
      maxEvaluations: 3 * maxIterations,
      initialStep: 1 / (n * n),
      metric,
      onIteration: () => {
        iterations++;
        if (progress?.(iterations, objective.lastChi2)) stopped = true;
        return stopped;
      },
    });
    const image = normalize(result.x.slice());
    return { result, image, chi2: objective.measure(image).chi2 };
  };

  let weight: number;
  let from = start;
  let trials: WeightTrial[] | null = null;
  let bracketed: boolean | null = null;
  const trialRuns = new Map<Float64Array, ReturnType<typeof run>>();
  let finalRun: ReturnType<typeof run> | undefined;
  if (opts.weight === "auto") {
    const trialIterations = Math.max(30, Math.floor(opts.maxIterations / 4));
    const search = searchWeight((w, s) => {
      if (stopped) return { image: s, chi2: Number.NaN, iterations: 0, converged: false };
      const before = iterations;
      const r = run(w, s, trialIterations);
      trialRuns.set(r.image, r);
      return { image: r.image, chi2: r.chi2, iterations: iterations - before, converged: r.result.converged };
    }, start);
    weight = search.weight;
    from = search.image;
    trials = search.trials;
    bracketed = search.bracketed;
    if (search.converged) finalRun = trialRuns.get(search.image);
  } else {
    weight = opts.weight;
  }
  const final = finalRun ?? run(weight, from, stopped ? 0 : opts.maxIterations);
  const shift = recentre(final.image, n);
  const m = objective.measure(final.image);
  const given = objective.terms.closureChi2(objective.lastRe(), objective.lastIm(), data.cpInvVarGiven);

  return {
    n,
    pixelRad,
    image: final.image,
    chi2Vis2: m.chi2Vis2,
    chi2ClosurePhase: objective.terms.nClosure > 0 ? given / objective.terms.nClosure : 0,
    chi2ClosurePhaseFitted: m.chi2ClosurePhase,
    chi2Fitted: m.chi2,
    regularization: m.regularization,
    weight,
    objective: m.chi2 + weight * m.regularization,
    iterations,
    evaluations: objective.evaluations,
    converged: final.result.converged,
    stopReason: stopped ? "stopped" : final.result.reason,
    shiftPixels: shift,
    weightTrials: trials,
    weightBracketed: bracketed,
    startFwhmRad,
    data,
    transform,
  };
}

/** Shifts `image` in place by whole pixels (zero fill) so its centroid lies within half a pixel of (N/2, N/2). */
export function recentre(image: Float64Array, n: number): [number, number] {
  let sx = 0;
  let sy = 0;
  let s = 0;
  for (let y = 0; y < n; y++)
    for (let x = 0; x < n; x++) {
      const v = image[y * n + x];
      sx += v * x;
      sy += v * y;
      s += v;
    }
  if (!(s > 0)) return [0, 0];
  const c = Math.floor(n / 2);
  const dx = Math.round(c - sx / s);
  const dy = Math.round(c - sy / s);
  if (dx === 0 && dy === 0) return [0, 0];
  const copy = image.slice();
  image.fill(0);
  for (let y = 0; y < n; y++) {
    const ty = y + dy;
    if (ty < 0 || ty >= n) continue;
    for (let x = 0; x < n; x++) {
      const tx = x + dx;
      if (tx >= 0 && tx < n) image[ty * n + tx] = copy[y * n + x];
    }
  }
  normalize(image);
  return [dx, dy];
}
