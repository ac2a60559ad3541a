/**
 * The regularization weight for which the reconstruction's reduced χ² comes out at 1: the discrepancy
 * principle (Morozov 1966, Soviet Math. Dokl. 7, 414), the "χ² = N" rule of maximum-entropy imaging
 * (Gull & Daniell 1978, Nature 272, 686).
 *
 * χ²_ν of the regularized solution grows with the weight, so the root of log χ²_ν(w) = 0 in log w is
 * searched: trial runs of `trialIterations` each, every one warm-started from the previous image, first
 * stepping the weight by factors of 10 from `startWeight` until the target is bracketed (weights kept
 * within [1e-5, 1e3]), then by regula falsi in (log w, log χ²_ν) for up to four more trials, stopping early
 * when χ²_ν is within 5 % of 1. The weight of the trial whose χ²_ν is nearest to 1 (in log χ²_ν) is
 * returned with the trail of trials; the caller then runs the full reconstruction there, warm-started,
 * unless that trial already converged.
 * When χ²_ν = 1 is out of reach — χ²_ν stops falling above 1 as the weight drops (the pixel grid cannot
 * follow the data further, e.g. point sources between pixel centres) — the principle has no root; then
 * the largest weight whose χ²_ν is within 5 % of the lowest χ²_ν seen is taken (the start of the
 * plateau), not the smallest weight, which would only add noise.
 */

export interface WeightTrial {
  weight: number;
  /** Reduced χ² (the fitted one) at the end of the trial. */
  chi2: number;
  iterations: number;
}

export interface WeightSearch {
  weight: number;
  trials: WeightTrial[];
  /** The image of the chosen trial (a warm start for the final run) and whether that trial converged. */
  image: Float64Array;
  converged: boolean;
  /** True when the target was bracketed (false: the weight sits at a limit of the range). */
  bracketed: boolean;
}

export const MIN_WEIGHT = 1e-5;
export const MAX_WEIGHT = 1e3;
const CLOSE_ENOUGH = 0.05;

/**
 * @param run reconstructs at `weight` from the start image, returns the image and its reduced χ²
 */
export function searchWeight(
  run: (
    weight: number,
    start: Float64Array,
  ) => { image: Float64Array; chi2: number; iterations: number; converged: boolean },
  start: Float64Array,
  startWeight = 0.1,
): WeightSearch {
  const trials: WeightTrial[] = [];
  const images: Float64Array[] = [];
  const converged: boolean[] = [];
  let current = start;
  const attempt = (w: number) => {
    const r = run(w, current);
    current = r.image;
    trials.push({ weight: w, chi2: r.chi2, iterations: r.iterations });
    images.push(r.image);
    converged.push(r.converged);
    return r.chi2;
  };

  let w = Math.min(MAX_WEIGHT, Math.max(MIN_WEIGHT, startWeight));
  let chi = attempt(w);
  let below: number | null = chi <= 1 ? 0 : null;
  let above: number | null = chi > 1 ? 0 : null;
  // Bracket (stop stepping down once χ² no longer falls: a plateau above 1).
  while (below === null || above === null) {
    if (Math.abs(chi - 1) <= CLOSE_ENOUGH) break;
    const n = trials.length;
    if (n >= 2 && chi > 1 && trials[n - 2].chi2 > 1 && chi > trials[n - 2].chi2 * (1 - CLOSE_ENOUGH)) break;
    const next = chi > 1 ? w / 10 : w * 10;
    if (next < MIN_WEIGHT || next > MAX_WEIGHT) break;
    w = next;
    chi = attempt(w);
    const i = trials.length - 1;
    if (chi <= 1) below = i;
    else above = i;
  }
  const bracketed = below !== null && above !== null;
  // Regula falsi in (log w, log χ²).
  if (bracketed) {
    for (let k = 0; k < 4; k++) {
      const b = trials[below!];
      const a = trials[above!];
      if (Math.abs(b.chi2 - 1) <= CLOSE_ENOUGH || Math.abs(a.chi2 - 1) <= CLOSE_ENOUGH) break;
      const lb = Math.log(Math.max(b.chi2, 1e-12));
      const la = Math.log(a.chi2);
      const t = lb === la ? 0.5 : lb / (lb - la);
      const lw = Math.log(b.weight) + Math.min(0.9, Math.max(0.1, t)) * (Math.log(a.weight) - Math.log(b.weight));
      w = Math.exp(lw);
      chi = attempt(w);
      if (chi <= 1) below = trials.length - 1;
      else above = trials.length - 1;
    }
  }
  let best = 0;
  const lowest = Math.min(...trials.map((t) => t.chi2));
  if (!bracketed && lowest > 1) {
    // Plateau above 1: the largest weight within 5 % of the lowest χ².
    best = -1;
    for (let i = 0; i < trials.length; i++) {
      if (trials[i].chi2 > lowest * (1 + CLOSE_ENOUGH)) continue;
      if (best < 0 || trials[i].weight > trials[best].weight) best = i;
    }
  } else {
    // The trial nearest to 1 in log χ².
    for (let i = 1; i < trials.length; i++) {
      if (Math.abs(Math.log(trials[i].chi2)) < Math.abs(Math.log(trials[best].chi2))) best = i;
    }
  }
  return { weight: trials[best].weight, trials, image: images[best], converged: converged[best], bracketed };
}
