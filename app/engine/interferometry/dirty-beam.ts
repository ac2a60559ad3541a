/**
 * Dirty beam (point-spread function of the sampled uv coverage) and dirty
 * image of a target model.
 *
 * Every sampled (u, v) point and its Hermitian mirror (−u, −v) are put on the
 * nearest cell of an N × N uv grid; the grid is weighted (natural, uniform or
 * robust/Briggs) and Fourier transformed:
 *   beam(l, m)  = Σ_p w_p cos(2π(u_p l + v_p m)) / Σ_p w_p          (mirrors included)
 *   image(l, m) = Σ_p w_p Re[V_p exp(+2πi(u_p l + v_p m))] / Σ_p w_p
 * so the beam peaks at exactly 1 at the centre and a unit point source at the
 * phase centre images to the beam.
 *
 * Pixel scale: unless given, Δl = 1 / (8 · r_max), r_max the largest sampled
 * |(u, v)| in wavelengths — four pixels across the resolution element
 * λ/(2B_max); the sampled points then occupy the central quarter of the uv
 * grid (cell Δu = 1/(N Δl)), so nothing is aliased and the main lobe spans
 * several pixels. Field of view N·Δl.
 *
 * Image layout: Float64Array of N² values, row-major, row index y toward north,
 * column index x toward east, the phase centre at (x, y) = (N/2, N/2);
 * l = (x − N/2)·Δl east, m = (y − N/2)·Δl north (astronomical displays flip
 * east to the left; that is the viewer's business).
 */
import { type BeamFit, fitBeam } from "./beam-fit";
import { HermitianImager } from "./fft2d";

export type Weighting = "natural" | "uniform" | "robust";

export interface ImagingOptions {
  /** Grid size N, a power of two (32..2048 through the API). */
  gridSize: number;
  /** Weighting scheme; natural when absent. */
  weighting?: Weighting;
  /** Briggs robustness R (−2..2) for "robust"; 0 when absent. */
  robust?: number;
  /** Pixel size in radians; derived from the longest spatial frequency when absent. */
  pixelRad?: number;
  /** A plan to reuse across calls with the same grid size. */
  imager?: HermitianImager;
}

/** Pixels per resolution element λ/(2B_max) used by the automatic pixel scale. */
export const PIXELS_PER_RESOLUTION = 4;

/** Automatic pixel size, radians, for a largest spatial frequency r_max (wavelengths > 0). */
export function autoPixelRad(maxRadiusW: number): number {
  return 1 / (2 * PIXELS_PER_RESOLUTION * maxRadiusW);
}

/** Largest √(u² + v²) over the points, wavelengths (0 for none). */
export function maxUvRadius(uW: ArrayLike<number>, vW: ArrayLike<number>): number {
  let m = 0;
  for (let i = 0; i < uW.length; i++) {
    const r2 = uW[i] * uW[i] + vW[i] * vW[i];
    if (r2 > m) m = r2;
  }
  return Math.sqrt(m);
}

export interface WeightedPoints {
  n: number;
  pixelRad: number;
  /** uv cell size, wavelengths: 1 / (N · pixelRad). */
  cellW: number;
  /** Grid cell of each point (signed cell indices); the mirror sits at (−cu, −cv). */
  cellU: Int32Array;
  cellV: Int32Array;
  /** Imaging weight of each point (its mirror has the same); 0 for points dropped outside the grid. */
  weight: Float64Array;
  /** Σ weights over points and mirrors (2 Σ weight). */
  sumWeights: number;
  /** Points that fell outside the grid (only possible with an explicit pixel size). */
  dropped: number;
}

/**
 * Assigns every point (and its mirror) to a grid cell and computes its imaging
 * weight.
 *  - natural: 1 per point;
 *  - uniform: 1 / D(cell), D the natural weight density of the cell (mirrors
 *    included), so every occupied cell weighs the same;
 *  - robust (Briggs): 1 / (1 + D(cell) f²), f² = (5·10^−R)² / (Σ D² / Σ D).
 */
export function weightPoints(
  uW: ArrayLike<number>,
  vW: ArrayLike<number>,
  n: number,
  pixelRad: number,
  weighting: Weighting = "natural",
  robust = 0,
): WeightedPoints {
  const count = uW.length;
  const cellW = 1 / (n * pixelRad);
  const cellU = new Int32Array(count);
  const cellV = new Int32Array(count);
  const weight = new Float64Array(count);
  const half = n >> 1;
  const lim = half - 1;
  let dropped = 0;
  for (let p = 0; p < count; p++) {
    const cu = Math.round(uW[p] / cellW);
    const cv = Math.round(vW[p] / cellW);
    if (cu > lim || cu < -lim || cv > lim || cv < -lim || !Number.isFinite(cu) || !Number.isFinite(cv)) {
      dropped++;
      continue;
    }
    cellU[p] = cu;
    cellV[p] = cv;
    weight[p] = 1;
  }
  if (weighting !== "natural") {
    const density = new Float64Array(n * n);
    const idx = (cu: number, cv: number) => ((cv + n) % n) * n + ((cu + n) % n);
    for (let p = 0; p < count; p++) {
      if (weight[p] === 0) continue;
      density[idx(cellU[p], cellV[p])] += 1;
      density[idx(-cellU[p], -cellV[p])] += 1;
    }
    if (weighting === "uniform") {
      for (let p = 0; p < count; p++) if (weight[p] !== 0) weight[p] = 1 / density[idx(cellU[p], cellV[p])];
    } else {
      let sumD = 0;
      let sumD2 = 0;
      for (let i = 0; i < density.length; i++) {
        sumD += density[i];
        sumD2 += density[i] * density[i];
      }
      const f2 = sumD > 0 ? (5 * 10 ** -robust) ** 2 / (sumD2 / sumD) : 0;
      for (let p = 0; p < count; p++) {
        if (weight[p] !== 0) weight[p] = 1 / (1 + density[idx(cellU[p], cellV[p])] * f2);
      }
    }
  }
  let sum = 0;
  for (let p = 0; p < count; p++) sum += weight[p];
  return { n, pixelRad, cellW, cellU, cellV, weight, sumWeights: 2 * sum, dropped };
}

export interface DirtyImageResult {
  n: number;
  /** Pixel size, radians. */
  pixelRad: number;
  /** N² values, layout described in the module comment. Beam: peak 1 at the centre. */
  image: Float64Array;
  /** Points gridded (mirrors not counted) and points dropped outside the grid. */
  pointsGridded: number;
  pointsDropped: number;
}

export interface DirtyBeamResult extends DirtyImageResult {
  fit: BeamFit;
  /** The weighted points, reusable for the dirty image of a model on the same coverage. */
  weights: WeightedPoints;
}

function resolvePixel(uW: ArrayLike<number>, vW: ArrayLike<number>, options: ImagingOptions): number {
  if (options.pixelRad !== undefined) return options.pixelRad;
  const r = maxUvRadius(uW, vW);
  if (!(r > 0)) throw new RangeError("no baseline longer than zero: the beam is undefined");
  return autoPixelRad(r);
}

/**
 * Grids `count` weighted samples and their Hermitian mirrors onto the n×n uv grid of `weights` and
 * transforms it to the image plane, normalized by the sum of weights. Samples are the values
 * (re, im), or 1 for every point when `re` is null (the beam).
 */
function griddedImage(
  weights: WeightedPoints,
  count: number,
  re: ArrayLike<number> | null,
  im: ArrayLike<number> | null,
  imager?: HermitianImager,
): Float64Array {
  const n = weights.n;
  const grid = new Float64Array(2 * n * n);
  for (let p = 0; p < count; p++) {
    const w = weights.weight[p];
    if (w === 0) continue;
    const cu = weights.cellU[p];
    const cv = weights.cellV[p];
    const a = 2 * (((cv + n) % n) * n + ((cu + n) % n));
    const b = 2 * (((n - cv) % n) * n + ((n - cu) % n));
    const wr = re ? w * re[p] : w;
    const wi = im ? w * im[p] : 0;
    grid[a] += wr;
    grid[a + 1] += wi;
    grid[b] += wr;
    grid[b + 1] -= wi;
  }
  const image = new Float64Array(n * n);
  (imager ?? new HermitianImager(n)).transform(grid, image);
  const norm = weights.sumWeights > 0 ? 1 / weights.sumWeights : 0;
  for (let i = 0; i < image.length; i++) image[i] *= norm;
  return image;
}

/**
 * Dirty beam of a set of sampled spatial frequencies (wavelengths), with the
 * central-lobe fit and peak sidelobe (see beam-fit.ts).
 * @throws RangeError when there are no points or all are at the origin.
 */
export function dirtyBeam(uW: ArrayLike<number>, vW: ArrayLike<number>, options: ImagingOptions): DirtyBeamResult {
  if (uW.length === 0) throw new RangeError("no uv points: the beam is undefined");
  const n = options.gridSize;
  const pixelRad = resolvePixel(uW, vW, options);
  const weights = weightPoints(uW, vW, n, pixelRad, options.weighting ?? "natural", options.robust ?? 0);
  const image = griddedImage(weights, uW.length, null, null, options.imager);
  return {
    n,
    pixelRad,
    image,
    pointsGridded: uW.length - weights.dropped,
    pointsDropped: weights.dropped,
    fit: fitBeam(image, n, pixelRad),
    weights,
  };
}

/**
 * Dirty image of model visibilities (re, im) sampled at the weighted points of
 * a beam: the model convolved with the dirty beam, same normalization.
 */
export function dirtyImage(
  weights: WeightedPoints,
  re: ArrayLike<number>,
  im: ArrayLike<number>,
  imager?: HermitianImager,
): DirtyImageResult {
  const n = weights.n;
  const image = griddedImage(weights, re.length, re, im, imager);
  return {
    n,
    pixelRad: weights.pixelRad,
    image,
    pointsGridded: re.length - weights.dropped,
    pointsDropped: weights.dropped,
  };
}
