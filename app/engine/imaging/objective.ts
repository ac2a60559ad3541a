/**
 * The objective minimized by the reconstruction, J = χ²_ν + weight · R, as a function of the optimizer's
 * variables x ≥ 0 (one per pixel).
 *
 * The image is p = x / Σx, so its total flux is exactly 1 whatever x; a term μ (Σx − 1)², μ = 1, fixes
 * the otherwise free scale of x without changing p. χ²_ν = (χ²(V²) + χ²(CP)) / (N_V² + N_CP), the reduced
 * χ² over all data (degrees of freedom counted as the number of data, common practice in imaging).
 * Chain rule for the normalization: ∂J/∂x_i = (g_i − Σ_j p_j g_j) / Σx + 2μ (Σx − 1), g = ∂J/∂p.
 * Every buffer is allocated once; evaluate() allocates nothing.
 */
import { DataTerms } from "./chi2";
import type { PreparedData } from "./data";
import type { ImageTransform } from "./nufft";
import type { RegularizationTerm } from "./regularizers";

const SCALE_PENALTY = 1;

export class ImagingObjective {
  readonly transform: ImageTransform;
  readonly terms: DataTerms;
  readonly regularizer: RegularizationTerm;
  weight: number;
  /** μ of the scale term μ (Σx − 1)². */
  scalePenalty = SCALE_PENALTY;
  /** Parts of the last evaluation: reduced χ² of V² and of closure phases, R, J. */
  lastChi2Vis2 = 0;
  lastChi2ClosurePhase = 0;
  lastChi2 = 0;
  lastRegularization = 0;
  evaluations = 0;
  private readonly p: Float64Array;
  private readonly re: Float64Array;
  private readonly im: Float64Array;
  private readonly gRe: Float64Array;
  private readonly gIm: Float64Array;
  private readonly gImage: Float64Array;
  private readonly nData: number;

  constructor(data: PreparedData, transform: ImageTransform, regularizer: RegularizationTerm, weight: number) {
    this.transform = transform;
    this.terms = new DataTerms(data);
    this.regularizer = regularizer;
    this.weight = weight;
    const n2 = transform.n * transform.n;
    this.p = new Float64Array(n2);
    this.gImage = new Float64Array(n2);
    const k = transform.count;
    this.re = new Float64Array(k);
    this.im = new Float64Array(k);
    this.gRe = new Float64Array(k);
    this.gIm = new Float64Array(k);
    this.nData = Math.max(1, this.terms.nVis2 + this.terms.nClosure);
  }

  /** J(x); writes ∂J/∂x into `grad`. Returns +∞ (gradient 0) when Σx ≤ 0. */
  evaluate(x: Float64Array, grad: Float64Array): number {
    this.evaluations++;
    const { p, re, im, gRe, gIm, gImage } = this;
    let sum = 0;
    for (let i = 0; i < x.length; i++) sum += x[i];
    if (!(sum > 0) || !Number.isFinite(sum)) {
      grad.fill(0);
      return Number.POSITIVE_INFINITY;
    }
    const inv = 1 / sum;
    for (let i = 0; i < x.length; i++) p[i] = x[i] * inv;

    this.transform.forward(p, re, im);
    const parts = this.terms.evaluate(re, im, 1 / this.nData, gRe, gIm);
    this.transform.adjoint(gRe, gIm, gImage);
    const chi2 = (parts.vis2 + parts.closurePhase) / this.nData;
    const reg = this.weight !== 0 ? this.regularizer.evaluate(p, gImage, this.weight) : 0;

    let mean = 0;
    for (let i = 0; i < p.length; i++) mean += p[i] * gImage[i];
    const penalty = this.scalePenalty * (sum - 1) * (sum - 1);
    const dPenalty = 2 * this.scalePenalty * (sum - 1);
    for (let i = 0; i < x.length; i++) grad[i] = (gImage[i] - mean) * inv + dPenalty;

    this.lastChi2Vis2 = this.terms.nVis2 > 0 ? parts.vis2 / this.terms.nVis2 : 0;
    this.lastChi2ClosurePhase = this.terms.nClosure > 0 ? parts.closurePhase / this.terms.nClosure : 0;
    this.lastChi2 = chi2;
    this.lastRegularization = reg;
    return chi2 + this.weight * reg + penalty;
  }

  /** Visibilities of the last evaluated image at the data's distinct points (internal buffers: read only). */
  lastRe(): Float64Array {
    return this.re;
  }

  lastIm(): Float64Array {
    return this.im;
  }

  /** Reduced χ² parts and R of an image p (Σ p = 1) without touching the optimizer's state. */
  measure(image: Float64Array): { chi2Vis2: number; chi2ClosurePhase: number; chi2: number; regularization: number } {
    const grad = new Float64Array(image.length);
    const saved = this.evaluations;
    this.evaluate(image, grad);
    this.evaluations = saved;
    return {
      chi2Vis2: this.lastChi2Vis2,
      chi2ClosurePhase: this.lastChi2ClosurePhase,
      chi2: this.lastChi2,
      regularization: this.lastRegularization,
    };
  }
}
