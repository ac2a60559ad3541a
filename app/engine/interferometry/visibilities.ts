/**
 * Model visibilities over uv tracks and spectral channels.
 *
 * Cube layout: index ((b·nSamples) + s)·nChannels + c for baseline b, hour-angle
 * sample s and channel c; spatial frequencies u/λ_c, v/λ_c in wavelengths.
 */
import type { CompiledModel } from "./models";
import { evaluateVisibilities } from "./models";
import type { UvwTracks } from "./uv-tracks";

export interface VisibilityCube {
  nBaselines: number;
  nSamples: number;
  nChannels: number;
  /** Spatial frequencies, wavelengths. */
  uW: Float64Array;
  vW: Float64Array;
  /** Complex visibility, real and imaginary parts. */
  re: Float64Array;
  im: Float64Array;
}

/**
 * Spatial frequencies in wavelengths for every (baseline, sample, channel):
 * u/λ and v/λ with λ in metres.
 */
export function spatialFrequencies(
  tracks: UvwTracks,
  wavelengthsM: ArrayLike<number>,
): { uW: Float64Array; vW: Float64Array } {
  const nC = wavelengthsM.length;
  const nBS = tracks.nBaselines * tracks.nSamples;
  const inv = new Float64Array(nC);
  for (let c = 0; c < nC; c++) inv[c] = 1 / wavelengthsM[c];
  const uW = new Float64Array(nBS * nC);
  const vW = new Float64Array(nBS * nC);
  for (let k = 0; k < nBS; k++) {
    const u = tracks.uM[k];
    const v = tracks.vM[k];
    const off = k * nC;
    for (let c = 0; c < nC; c++) {
      uW[off + c] = u * inv[c];
      vW[off + c] = v * inv[c];
    }
  }
  return { uW, vW };
}

/** Evaluates a model over every track point and channel. */
export function modelVisibilityCube(
  model: CompiledModel,
  tracks: UvwTracks,
  wavelengthsM: ArrayLike<number>,
): VisibilityCube {
  const { uW, vW } = spatialFrequencies(tracks, wavelengthsM);
  const re = new Float64Array(uW.length);
  const im = new Float64Array(uW.length);
  evaluateVisibilities(model, uW, vW, re, im);
  return { nBaselines: tracks.nBaselines, nSamples: tracks.nSamples, nChannels: wavelengthsM.length, uW, vW, re, im };
}

/** Squared visibility |V|² of every cube entry. */
export function squaredVisibilities(cube: VisibilityCube): Float64Array {
  const out = new Float64Array(cube.re.length);
  for (let i = 0; i < out.length; i++) out[i] = cube.re[i] * cube.re[i] + cube.im[i] * cube.im[i];
  return out;
}

/** Visibility phase arg V of every cube entry, radians in (−π, π]. */
export function visibilityPhases(cube: VisibilityCube): Float64Array {
  const out = new Float64Array(cube.re.length);
  for (let i = 0; i < out.length; i++) out[i] = Math.atan2(cube.im[i], cube.re[i]);
  return out;
}
