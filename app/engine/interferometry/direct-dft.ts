/**
 * Dirty beam by direct Fourier summation, without gridding:
 *   beam(l, m) = Σ_p w_p cos(2π(u_p l + v_p m)) / Σ_p w_p
 * on the same pixel layout as dirty-beam.ts (mirrors contribute the same
 * cosine, so they cancel in the ratio). Cost O(N² · points); the FFT path is the
 * one to use, this one is the reference it is checked and benchmarked against.
 * Separable evaluation: cos(a + b) = cos a cos b − sin a sin b with a and b
 * tabulated per point along each axis.
 */
import { float64Arrays } from "../arrays";

/**
 * @param uW, vW spatial frequencies, wavelengths
 * @param weights per-point weights (natural: all 1 when omitted)
 * @param n image size N (any positive integer; centre at (⌊N/2⌋, ⌊N/2⌋))
 * @param pixelRad pixel size, radians
 */
export function directDirtyBeam(
  uW: ArrayLike<number>,
  vW: ArrayLike<number>,
  weights: ArrayLike<number> | null,
  n: number,
  pixelRad: number,
): Float64Array {
  const image = new Float64Array(n * n);
  const [cu, su, cv, sv] = float64Arrays(4, n);
  const c = Math.floor(n / 2);
  let sumW = 0;
  for (let p = 0; p < uW.length; p++) {
    const w = weights ? weights[p] : 1;
    if (w === 0) continue;
    sumW += w;
    const au = 2 * Math.PI * uW[p] * pixelRad;
    const av = 2 * Math.PI * vW[p] * pixelRad;
    for (let x = 0; x < n; x++) {
      cu[x] = Math.cos(au * (x - c));
      su[x] = Math.sin(au * (x - c));
    }
    for (let y = 0; y < n; y++) {
      cv[y] = w * Math.cos(av * (y - c));
      sv[y] = w * Math.sin(av * (y - c));
    }
    for (let y = 0; y < n; y++) {
      const a = cv[y];
      const b = sv[y];
      const row = y * n;
      for (let x = 0; x < n; x++) image[row + x] += a * cu[x] - b * su[x];
    }
  }
  if (sumW > 0) for (let i = 0; i < image.length; i++) image[i] /= sumW;
  return image;
}
