/**
 * A one-dimensional minimum of a smooth cost with a single broad valley: the best of `steps` samples
 * `at(0) … at(steps − 1)` (increasing), then golden-section search between that sample's neighbours.
 * Common practice for fitting one size parameter (a Gaussian's FWHM, a disk's diameter).
 */

/** The golden-section ratio (√5 − 1) / 2. */
const GOLDEN = (Math.sqrt(5) - 1) / 2;

/** The midpoint of the last bracket after `iterations` golden-section steps around the best sample. */
export function scanMinimum(
  cost: (x: number) => number,
  at: (k: number) => number,
  steps: number,
  iterations: number,
): number {
  let best = 0;
  let bestCost = Number.POSITIVE_INFINITY;
  for (let k = 0; k < steps; k++) {
    const c = cost(at(k));
    if (c < bestCost) {
      bestCost = c;
      best = k;
    }
  }
  let a = at(Math.max(0, best - 1));
  let b = at(Math.min(steps - 1, best + 1));
  for (let it = 0; it < iterations; it++) {
    const x1 = b - GOLDEN * (b - a);
    const x2 = a + GOLDEN * (b - a);
    if (cost(x1) < cost(x2)) b = x2;
    else a = x1;
  }
  return 0.5 * (a + b);
}
