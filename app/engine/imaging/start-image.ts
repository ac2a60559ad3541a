/**
 * Start images and entropy priors on the reconstruction grid (N × N, Σ = 1, every pixel > 0), and the
 * size of a Gaussian fitted to the V² data.
 *
 *  - flat: 1/N² everywhere;
 *  - Gaussian: a centred circular Gaussian of FWHM θ, floored at 1e-6 of its peak so no pixel starts at 0;
 *  - dirty: the image of the visibility amplitudes √max(V², 0) with zero phase (the phases are unknown),
 *    Σ_k |V_k| cos 2π(u_k·x) — centrally symmetric — with its negative parts replaced by the floor.
 * A seeded perturbation (each pixel × (1 + 0.01 z), z standard normal) breaks the symmetry of the start,
 * so the seed makes runs reproducible.
 *
 * Gaussian size fit: V² of a Gaussian is exp(−(π θ r)²/(2 ln 2)) (the square of the Gaussian visibility,
 * interferometry/models.ts); θ minimizes Σ (V²_model − V²)²/σ² over a logarithmic grid of 200 sizes from
 * 0.1 to 20 times 1/r_max, then by golden-section search between the neighbours of the best one.
 */
import type { PreparedData } from "./data";
import type { ImageTransform } from "./nufft";
import { Mt19937 } from "./random";
import { scanMinimum } from "./scan-minimum";

const FLOOR = 1e-6;

/** A centred circular Gaussian of FWHM `fwhmPx` pixels, floored and normalized. */
export function gaussianImage(n: number, fwhmPx: number): Float64Array {
  const c = Math.floor(n / 2);
  const k = (4 * Math.LN2) / (fwhmPx * fwhmPx);
  const out = new Float64Array(n * n);
  for (let y = 0; y < n; y++)
    for (let x = 0; x < n; x++) out[y * n + x] = Math.max(FLOOR, Math.exp(-k * ((x - c) ** 2 + (y - c) ** 2)));
  return normalize(out);
}

export function flatImage(n: number): Float64Array {
  return new Float64Array(n * n).fill(1 / (n * n));
}

/** The zero-phase image of the V² amplitudes, through the transform's adjoint (points of `data`). */
export function dirtyAmplitudeImage(data: PreparedData, transform: ImageTransform): Float64Array {
  const k = data.uW.length;
  const sum = new Float64Array(k);
  const count = new Float64Array(k);
  for (let i = 0; i < data.vis2.length; i++) {
    sum[data.vis2Point[i]] += Math.sqrt(Math.max(data.vis2[i], 0));
    count[data.vis2Point[i]] += 1;
  }
  for (let p = 0; p < k; p++) sum[p] = count[p] > 0 ? sum[p] / count[p] : 0;
  const out = new Float64Array(transform.n * transform.n);
  transform.adjoint(sum, new Float64Array(k), out);
  let peak = 0;
  for (const v of out) peak = Math.max(peak, v);
  if (!(peak > 0)) return flatImage(transform.n);
  for (let i = 0; i < out.length; i++) out[i] = Math.max(out[i], FLOOR * peak);
  return normalize(out);
}

/** Multiplies every pixel by (1 + 0.01 z) with seeded normal deviates, keeps it positive, normalizes. */
export function perturb(image: Float64Array, seed: number): Float64Array {
  const rng = new Mt19937(seed);
  const out = new Float64Array(image.length);
  for (let i = 0; i < image.length; i++) out[i] = image[i] * Math.max(0.5, 1 + 0.01 * rng.nextGaussian());
  return normalize(out);
}

export function normalize(image: Float64Array): Float64Array {
  let s = 0;
  for (const v of image) s += v;
  if (s > 0) for (let i = 0; i < image.length; i++) image[i] /= s;
  return image;
}

/** FWHM in radians of the circular Gaussian whose V² best fits the data (weighted least squares). */
export function fitGaussianFwhmRad(data: PreparedData): number {
  const r2 = new Float64Array(data.vis2.length);
  for (let i = 0; i < r2.length; i++) {
    const p = data.vis2Point[i];
    r2[i] = data.uW[p] * data.uW[p] + data.vW[p] * data.vW[p];
  }
  const cost = (theta: number) => {
    const a = (Math.PI * theta) ** 2 / (2 * Math.LN2);
    let s = 0;
    for (let i = 0; i < r2.length; i++) {
      const res = Math.exp(-a * r2[i]) - data.vis2[i];
      s += res * res * data.vis2InvVar[i];
    }
    return s;
  };
  const unit = data.maxRadiusW > 0 ? 1 / data.maxRadiusW : 1;
  const steps = 200;
  return scanMinimum(cost, (k) => unit * 0.1 * 200 ** (k / (steps - 1)), steps, 40);
}
