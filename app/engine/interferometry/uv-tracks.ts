/**
 * Projected baselines (u, v, w) — Earth-rotation synthesis.
 *
 * Thompson, Moran & Swenson (2017) eq. 4.1, hour angle H, declination δ:
 *   u =  sin H·X + cos H·Y
 *   v = −sin δ cos H·X + sin δ sin H·Y + cos δ·Z
 *   w =  cos δ cos H·X − cos δ sin H·Y + sin δ·Z
 * u points east, v north, w toward the source; all in metres here. Divide by
 * the wavelength for spatial frequencies in wavelengths (cycles per radian).
 */
import type { BaselineSet } from "./baselines";

export interface UvwTracks {
  nBaselines: number;
  nSamples: number;
  /** Index b·nSamples + s, metres. */
  uM: Float64Array;
  vM: Float64Array;
  wM: Float64Array;
}

/** (u, v, w) in metres of one equatorial baseline (X, Y, Z metres) at hour angle haRad and declination decRad. */
export function projectBaseline(
  xM: number,
  yM: number,
  zM: number,
  haRad: number,
  decRad: number,
): { uM: number; vM: number; wM: number } {
  const sh = Math.sin(haRad);
  const ch = Math.cos(haRad);
  const sd = Math.sin(decRad);
  const cd = Math.cos(decRad);
  return {
    uM: sh * xM + ch * yM,
    vM: -sd * ch * xM + sd * sh * yM + cd * zM,
    wM: cd * ch * xM - cd * sh * yM + sd * zM,
  };
}

/**
 * Tracks of every baseline over a list of hour angles (radians) at a fixed
 * declination (radians). sin/cos of each hour angle are computed once.
 */
export function computeUvwTracks(baselines: BaselineSet, haRad: ArrayLike<number>, decRad: number): UvwTracks {
  const nB = baselines.count;
  const nS = haRad.length;
  const sinH = new Float64Array(nS);
  const cosH = new Float64Array(nS);
  for (let s = 0; s < nS; s++) {
    sinH[s] = Math.sin(haRad[s]);
    cosH[s] = Math.cos(haRad[s]);
  }
  const sd = Math.sin(decRad);
  const cd = Math.cos(decRad);
  const uM = new Float64Array(nB * nS);
  const vM = new Float64Array(nB * nS);
  const wM = new Float64Array(nB * nS);
  for (let b = 0; b < nB; b++) {
    const x = baselines.xM[b];
    const y = baselines.yM[b];
    const z = baselines.zM[b];
    const zc = cd * z;
    const zs = sd * z;
    const off = b * nS;
    for (let s = 0; s < nS; s++) {
      const sh = sinH[s];
      const ch = cosH[s];
      uM[off + s] = sh * x + ch * y;
      vM[off + s] = sd * (sh * y - ch * x) + zc;
      wM[off + s] = cd * (ch * x - sh * y) + zs;
    }
  }
  return { nBaselines: nB, nSamples: nS, uM, vM, wM };
}
