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
    const re = new Float64Array(m * m);
    const im = new Float64Array(m * m);
    for (let l = 0; l < m; l++)
      for (let k = 0; k < m; k++) {
        let a = 0;
        let b = 0;
        for (let y = 0; y < n; y++) {
          const c = cos[l * n + y];
          const s = sin[l * n + y];
          const pr = tr[y * m + k];
          const pi = ti[y * m + k];
          a += pr * c - pi * s;
          b += pr * s + pi * c;
        }
        re[l * m + k] = a;
        im[l * m + k] = b;
      }
    return { re, im };
  }

  /** Inverse transform, real part, cropped to the N × N field. */
  inverse(re: Float64Array, im: Float64Array): Float64Array {
    const { n, m, cos, sin } = this;
    // Along l (v) for every k: U(y, k) = Σ_l S(k, l) e^{+i…}.
    const ur = new Float64Array(n * m);
    const ui = new Float64Array(n * m);
    for (let y = 0; y < n; y++)
      for (let k = 0; k < m; k++) {
        let a = 0;
        let b = 0;
        for (let l = 0; l < m; l++) {
          const c = cos[l * n + y];
          const s = -sin[l * n + y];
          const sr = re[l * m + k];
          const si = im[l * m + k];
          a += sr * c - si * s;
          b += sr * s + si * c;
        }
        ur[y * m + k] = a;
        ui[y * m + k] = b;
      }
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
