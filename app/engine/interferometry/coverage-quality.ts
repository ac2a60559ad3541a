/**
 * Figures of merit of a uv coverage, for the feasibility report and the
 * imaging preview.
 *
 *  - longest / shortest projected baseline √(u² + v²), metres, over observable samples;
 *  - angular resolution λ_min / (2 B_max) and largest angular scale
 *    λ_max / (2 B_min) (the same criterion applied to the shortest baseline and
 *    longest wavelength: structure larger than this is resolved out), mas;
 *  - radial coverage: fraction of 20 equal bins of spatial-frequency radius
 *    over [0, r_max] that hold at least one point;
 *  - position-angle coverage: fraction of 36 bins of 5° over [0°, 180°)
 *    (a point and its Hermitian mirror share a bin) that hold a point.
 * The bins are common practice for a quick filling figure, not a standard.
 */
import { RAD_TO_MAS } from "../math";
import type { UvwTracks } from "./uv-tracks";

export const RADIAL_BINS = 20;
export const POSITION_ANGLE_BINS = 36;

export interface CoverageFigures {
  /** Observable samples and uv points (baselines × observable samples × channels). */
  observableSamples: number;
  uvPoints: number;
  /** Metres; null without observable points. */
  longestBaselineM: number | null;
  shortestBaselineM: number | null;
  /** Milliarcseconds; null without points (largest scale also null for a zero-length baseline). */
  resolutionMas: number | null;
  largestAngularScaleMas: number | null;
  /** 0..1 */
  radialCoverage: number;
  /** 0..1 */
  positionAngleCoverage: number;
}

/** Fraction of radial and position-angle bins filled by points (u, v in any one unit). */
export function binFilling(
  u: ArrayLike<number>,
  v: ArrayLike<number>,
  mask: ((i: number) => boolean) | null,
  rMax: number,
): { radial: number; positionAngle: number } {
  const radial = new Uint8Array(RADIAL_BINS);
  const pa = new Uint8Array(POSITION_ANGLE_BINS);
  let any = false;
  for (let i = 0; i < u.length; i++) {
    if (mask && !mask(i)) continue;
    const r = Math.sqrt(u[i] * u[i] + v[i] * v[i]);
    if (rMax > 0) radial[Math.min(RADIAL_BINS - 1, Math.floor((r / rMax) * RADIAL_BINS))] = 1;
    if (r > 0) {
      let a = Math.atan2(u[i], v[i]); // east of north
      if (a < 0) a += Math.PI;
      if (a >= Math.PI) a -= Math.PI;
      pa[Math.min(POSITION_ANGLE_BINS - 1, Math.floor((a / Math.PI) * POSITION_ANGLE_BINS))] = 1;
    }
    any = true;
  }
  if (!any) return { radial: 0, positionAngle: 0 };
  const sum = (a: Uint8Array) => a.reduce((s, x) => s + x, 0);
  return { radial: sum(radial) / RADIAL_BINS, positionAngle: sum(pa) / POSITION_ANGLE_BINS };
}

/**
 * Coverage figures of the observable part of a set of tracks.
 * @param sampleMask 1 for observable samples
 * @param wavelengthsM channel wavelengths, metres
 */
export function coverageFigures(
  tracks: UvwTracks,
  sampleMask: Uint8Array,
  wavelengthsM: readonly number[],
): CoverageFigures {
  const { nBaselines: nB, nSamples: nS, uM, vM } = tracks;
  let observableSamples = 0;
  for (let s = 0; s < nS; s++) observableSamples += sampleMask[s];
  const uvPoints = nB * observableSamples * wavelengthsM.length;
  let bMax = 0;
  let bMin = Number.POSITIVE_INFINITY;
  for (let b = 0; b < nB; b++) {
    for (let s = 0; s < nS; s++) {
      if (!sampleMask[s]) continue;
      const k = b * nS + s;
      const r = Math.sqrt(uM[k] * uM[k] + vM[k] * vM[k]);
      if (r > bMax) bMax = r;
      if (r < bMin) bMin = r;
    }
  }
  if (uvPoints === 0) {
    return {
      observableSamples,
      uvPoints,
      longestBaselineM: null,
      shortestBaselineM: null,
      resolutionMas: null,
      largestAngularScaleMas: null,
      radialCoverage: 0,
      positionAngleCoverage: 0,
    };
  }
  const lMin = Math.min(...wavelengthsM);
  const lMax = Math.max(...wavelengthsM);
  // Bins in wavelengths: every channel of every observable point.
  const nC = wavelengthsM.length;
  const uW = new Float64Array(uvPoints);
  const vW = new Float64Array(uvPoints);
  let p = 0;
  for (let b = 0; b < nB; b++)
    for (let s = 0; s < nS; s++) {
      if (!sampleMask[s]) continue;
      const k = b * nS + s;
      for (let c = 0; c < nC; c++) {
        uW[p] = uM[k] / wavelengthsM[c];
        vW[p] = vM[k] / wavelengthsM[c];
        p++;
      }
    }
  const fill = binFilling(uW, vW, null, bMax / lMin);
  return {
    observableSamples,
    uvPoints,
    longestBaselineM: bMax,
    shortestBaselineM: bMin,
    resolutionMas: bMax > 0 ? (lMin / (2 * bMax)) * RAD_TO_MAS : null,
    largestAngularScaleMas: bMin > 0 ? (lMax / (2 * bMin)) * RAD_TO_MAS : null,
    radialCoverage: fill.radial,
    positionAngleCoverage: fill.positionAngle,
  };
}
