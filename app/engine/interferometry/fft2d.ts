/**
 * Two-dimensional inverse Fourier transform of a Hermitian uv grid into a real
 * image, built on fft.js (radix-4, power-of-two sizes).
 *
 *   f(x, y) = Σ_{k,l} G(k, l) · exp(+2πi (k x + l y) / N)
 *
 * With G Hermitian (G(−k, −l) = conj G(k, l)) f is real. Two savings make it
 * fast: rows of G that are entirely zero are not transformed (a uv grid is
 * mostly empty), and because every column of the half-transformed grid
 * transforms to a real sequence, two columns are packed into one complex
 * transform (c1 + i·c2), halving the column pass.
 */
import FFT from "fft.js";

/** A reusable transform plan for N × N grids (N a power of two ≥ 4). */
export class HermitianImager {
  readonly n: number;
  private readonly fft: FFT;
  private readonly colIn: Float64Array;
  private readonly colOut: Float64Array;
  private readonly rowOut: Float64Array;

  constructor(n: number) {
    if (!(Number.isInteger(n) && n >= 4 && (n & (n - 1)) === 0))
      throw new RangeError(`grid size ${n} is not a power of two ≥ 4`);
    this.n = n;
    this.fft = new FFT(n);
    this.colIn = new Float64Array(2 * n);
    this.colOut = new Float64Array(2 * n);
    this.rowOut = new Float64Array(2 * n);
  }

  /**
   * Transforms `grid` (interleaved complex, row-major: row = v index l, column =
   * u index k, both in FFT order 0, 1, …, N/2−1, −N/2, …, −1) into `out`
   * (real, N × N, row-major, row = north index y, column = east index x,
   * shifted so that the origin sits at (N/2, N/2)). `grid` is overwritten.
   * The result is the unnormalized sum above (no 1/N factors).
   */
  transform(grid: Float64Array, out: Float64Array): void {
    const n = this.n;
    const n2 = 2 * n;
    const half = n >> 1;
    const rowOut = this.rowOut;
    // Row pass: along k for every non-empty row l.
    for (let l = 0; l < n; l++) {
      const off = l * n2;
      let empty = true;
      for (let i = off; i < off + n2; i++) {
        if (grid[i] !== 0) {
          empty = false;
          break;
        }
      }
      if (empty) continue;
      this.fft.inverseTransform(rowOut, grid.subarray(off, off + n2));
      grid.set(rowOut, off); // scaled by 1/N; undone once in the column pass
    }
    // Column pass: two real-output columns per complex transform.
    const colIn = this.colIn;
    const colOut = this.colOut;
    for (let x = 0; x < n; x += 2) {
      for (let l = 0; l < n; l++) {
        const a = l * n2 + 2 * x;
        // Z = W(x) + i·W(x+1)
        colIn[2 * l] = grid[a] - grid[a + 3];
        colIn[2 * l + 1] = grid[a + 1] + grid[a + 2];
      }
      this.fft.inverseTransform(colOut, colIn);
      const scale = n * n; // undo fft.js's 1/N of both passes
      const ox1 = (x + half) % n;
      const ox2 = (x + 1 + half) % n;
      for (let y = 0; y < n; y++) {
        const row = ((y + half) % n) * n;
        out[row + ox1] = colOut[2 * y] * scale;
        out[row + ox2] = colOut[2 * y + 1] * scale;
      }
    }
  }
}
