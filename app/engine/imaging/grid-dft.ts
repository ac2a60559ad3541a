/**
 * Separable discrete Fourier transform between an N × N image (layout of nufft.ts, pixel Δ) and the
 * M × M grid of spatial frequencies u_k = k / (M Δ), k = −M/2 … M/2 − 1 (M = 2N, so the periodic image of
 * the inverse transform is twice the field and a compact source does not wrap onto itself):
 *   S(k, l) = Σ_{y,x} I[y, x] exp(−2πi (k (x − N/2) + l (y − N/2)) / M)          (forward, the engine's sign)
 *   I[y, x] = Re Σ_{k,l} S(k, l) exp(+2πi (k (x − N/2) + l (y − N/2)) / M) / M²    (inverse, cropped to N × N)
 * Used for images convolved with a Gaussian beam and for fits in the Fourier plane; cost O(N M²).
 */
export class GridDft {
  readonly n: number;
  readonly m: number;
  private readonly cos: Float64Array; // [k][t]
  private readonly sin: Float64Array;

  constructor(n: number) {
    this.n = n;
    this.m = 2 * n;
    const m = this.m;
    const c = Math.floor(n / 2);
    this.cos = new Float64Array(m * n);
    this.sin = new Float64Array(m * n);
    for (let k = 0; k < m; k++)
      for (let x = 0; x < n; x++) {
        const a = (-2 * Math.PI * (k - m / 2) * (x - c)) / m;
        this.cos[k * n + x] = Math.cos(a);
        this.sin[k * n + x] = Math.sin(a);
      }
  }

  /** Frequency of grid index k (0 … M−1), in wavelengths, for pixel Δ radians. */
  frequency(k: number, pixelRad: number): number {
    return (k - this.m / 2) / (this.m * pixelRad);
  }

  /** Forward transform: re/im of M² values, index l·M + k (l along v, k along u). */
  forward(image: Float64Array): { re: Float64Array; im: Float64Array } {
    const { n, m, cos, sin } = this;
    // Along x for every row: T(y, k).
    const tr = new Float64Array(n * m);
    const ti = new Float64Array(n * m);
    for (let y = 0; y < n; y++)
      for (let k = 0; k < m; k++) {
        let a = 0;
        let b = 0;
        for (let x = 0; x < n; x++) {
          const v = image[y * n + x];
          a += v * cos[k * n + x];
          b += v * sin[k * n + x];
        }
        tr[y * m + k] = a;
        ti[y * m + k] = b;
      }
    // Along y for every k: S(k, l) = Σ_y T(y, k) e^{−i…}.
    const re = new Float64Array(m * m);
    const im = new Float64Array(m * m);
    mixRows(m, n, m, tr, ti, re, im, n, 1, cos, sin, 1);
    return { re, im };
  }

  /** Inverse transform, real part, cropped to the N × N field. */
  inverse(re: Float64Array, im: Float64Array): Float64Array {
    const { n, m, cos, sin } = this;
    // Along l (v) for every k: U(y, k) = Σ_l S(k, l) e^{+i…}.
    const ur = new Float64Array(n * m);
    const ui = new Float64Array(n * m);
    mixRows(n, m, m, re, im, ur, ui, 1, n, cos, sin, -1);
    const out = new Float64Array(n * n);
    const norm = 1 / (m * m);
    for (let y = 0; y < n; y++)
      for (let x = 0; x < n; x++) {
        let a = 0;
        for (let k = 0; k < m; k++) {
          // Re[(ur + i ui)(cos + i·(−sin))] with the forward table's sign flipped.
          a += ur[y * m + k] * cos[k * n + x] + ui[y * m + k] * sin[k * n + x];
        }
        out[y * n + x] = a * norm;
      }
    return out;
  }
}

/**
 * One complex pass along the row axis of a row-major table of `width` columns:
 *   out[r, k] = Σ_s in[s, k] · (cos[t(r, s)] + i · sign · sin[t(r, s)])   for r < outRows, s < sumRows,
 * with t(r, s) = r · rStride + s · sStride the index into the twiddle tables; sign −1 applies the conjugate twiddle.
 */
function mixRows(
  outRows: number,
  sumRows: number,
  width: number,
  inRe: Float64Array,
  inIm: Float64Array,
  outRe: Float64Array,
  outIm: Float64Array,
  rStride: number,
  sStride: number,
  cos: Float64Array,
  sin: Float64Array,
  sign: 1 | -1,
): void {
  for (let r = 0; r < outRows; r++)
    for (let k = 0; k < width; k++) {
      let a = 0;
      let b = 0;
      for (let s = 0, t = r * rStride; s < sumRows; s++, t += sStride) {
        const c = cos[t];
        const w = sign * sin[t];
        const pr = inRe[s * width + k];
        const pi = inIm[s * width + k];
        a += pr * c - pi * w;
        b += pr * w + pi * c;
      }
      outRe[r * width + k] = a;
      outIm[r * width + k] = b;
    }
}
