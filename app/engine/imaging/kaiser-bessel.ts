/**
 * The Kaiser–Bessel gridding kernel and its Fourier transform (Jackson, Meyer, Nishimura & Macovski 1991,
 * IEEE Trans. Med. Imaging 10, 473, eqs. 5–6), used by the non-uniform FFT of nufft.ts.
 *
 * Kernel of width W grid cells and shape β, s in cells:
 *   φ(s) = I0(β √(1 − (2s/W)²)) / I0(β)   for |s| ≤ W/2, 0 beyond;
 * its continuous Fourier transform, ξ in cycles per cell:
 *   φ̂(ξ) = W · sinh(√(β² − (πWξ)²)) / √(β² − (πWξ)²) / I0(β)   (sin and √(…) of the negated argument when
 *   πW|ξ| > β; W / I0(β) at the common limit).
 *
 * Shape: β = π √((W/σ)² (σ − ½)² − 0.8) for an oversampling σ (Beatty, Nishimura & Pauly 2005, IEEE Trans.
 * Med. Imaging 24, 799, eq. 5), the value that puts the kernel's main lobe at the edge of the aliasing band.
 */

/** Modified Bessel function I0(x) by its power series Σ ((x/2)^k / k!)², to full double precision for |x| ≤ 50. */
export function besselI0(x: number): number {
  const q = (x * x) / 4;
  let term = 1;
  let sum = 1;
  for (let k = 1; k < 500; k++) {
    term *= q / (k * k);
    sum += term;
    if (term < sum * 1e-17) break;
  }
  return sum;
}

/** Beatty et al. (2005) eq. 5: kernel shape β for width W cells and oversampling σ (≥ 1). */
export function kaiserBesselBeta(width: number, oversampling: number): number {
  const a = (width / oversampling) * (oversampling - 0.5);
  return Math.PI * Math.sqrt(a * a - 0.8);
}

/** A Kaiser–Bessel kernel of a given width (cells) and shape. */
export class KaiserBessel {
  readonly width: number;
  readonly beta: number;
  private readonly norm: number;

  constructor(width: number, beta: number) {
    if (!(width > 0) || !(beta > 0)) throw new RangeError("kernel width and shape must be positive");
    this.width = width;
    this.beta = beta;
    this.norm = 1 / besselI0(beta);
  }

  /** φ(s), s in cells; 1 at s = 0, 0 for |s| ≥ W/2. */
  value(s: number): number {
    const t = (2 * s) / this.width;
    const r = 1 - t * t;
    if (r <= 0) return 0;
    return besselI0(this.beta * Math.sqrt(r)) * this.norm;
  }

  /** φ̂(ξ), ξ in cycles per cell; even, positive for |ξ| < β/(πW). */
  transform(xi: number): number {
    const w = this.width;
    const a = Math.PI * w * xi;
    const d = this.beta * this.beta - a * a;
    if (d > 1e-12) {
      const r = Math.sqrt(d);
      return ((w * Math.sinh(r)) / r) * this.norm;
    }
    if (d < -1e-12) {
      const r = Math.sqrt(-d);
      return ((w * Math.sin(r)) / r) * this.norm;
    }
    return w * this.norm;
  }
}
