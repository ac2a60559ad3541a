/**
 * Mean and population standard deviation of a list of scores.
 *
 * σ = √(Σ(x − μ)² / n) — the population form (divide by n, not n − 1), as the `rank` contract asks.
 * Two passes (mean first, then squared deviations) for accuracy. A list whose values are all equal
 * gets σ = 0 exactly: in floating point the mean of equal values can differ from them by an ulp,
 * which would otherwise leave a spurious σ of ~1e-16 and z-scores of ±1 from nothing.
 */

export interface MeanSd {
  n: number;
  mean: number;
  /** Population standard deviation; 0 for n ≤ 1 or equal values. */
  sd: number;
}

/** Mean and population SD of `values` (NaN mean and 0 SD for an empty list). */
export function meanAndPopulationSd(values: ArrayLike<number>): MeanSd {
  const n = values.length;
  if (n === 0) return { n, mean: Number.NaN, sd: 0 };
  let sum = 0;
  let min = values[0];
  let max = values[0];
  for (let i = 0; i < n; i++) {
    const x = values[i];
    sum += x;
    if (x < min) min = x;
    if (x > max) max = x;
  }
  if (min === max) return { n, mean: min, sd: 0 };
  const mean = sum / n;
  let ss = 0;
  for (let i = 0; i < n; i++) {
    const d = values[i] - mean;
    ss += d * d;
  }
  return { n, mean, sd: Math.sqrt(ss / n) };
}
