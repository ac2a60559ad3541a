/**
 * Regularization terms R(p) of a normalized image p (N × N, Σ p = 1, p ≥ 0) and their gradients.
 *
 * Each R is scaled so that a typical image — a centred uniform disk of diameter N/4 pixels — has R = 1
 * (our normalization; the weight in J = χ²_ν + weight · R is then of order 0.01–1 for most data):
 *  - entropy (Skilling & Bryan 1984, MNRAS 211, 111: S = Σ p − m − p ln(p/m)): with Σ p = Σ m = 1,
 *    −S is the Kullback–Leibler divergence Σ p ln(p/m) from the prior m, ≥ 0 and 0 at p = m.
 *    R = Σ p ln((p + ε)/m) / ln(64/π), ln(64/π) the divergence of the typical image from a flat prior;
 *    ε = 1e-12 keeps the gradient finite at p = 0.
 *  - total variation (Rudin, Osher & Fatemi 1992, Physica D 60, 259), smoothed so it is differentiable:
 *    TV = Σ (√(Δx² + Δy² + ε²) − ε), Δx, Δy forward differences (0 across the last column/row),
 *    ε = 0.1/N² (a tenth of the mean pixel value: edges much steeper than ε cost their height, so they
 *    are kept). The typical disk has TV = 2/r = 16/N (its rim, radius r = N/8): R = TV · N/16.
 *  - compactness: flux weighted by the squared distance r from the phase centre (pixels),
 *    R = Σ p r² / (N²/128); N²/128 = r²/2 is ⟨r²⟩ of the typical disk.
 */
import type { Regularizer } from "./inputs";

const ENTROPY_EPS = 1e-12;
const ENTROPY_NORM = 1 / Math.log(64 / Math.PI);

/** A regularizer bound to a grid (and a prior for the entropy); gradients are added with a factor. */
export class RegularizationTerm {
  readonly kind: Regularizer;
  readonly n: number;
  private readonly prior: Float64Array | null;
  private readonly logPrior: Float64Array | null;
  private readonly radius2: Float64Array | null;
  private readonly tvEps: number;

  /**
   * @param prior entropy prior (N² values, Σ = 1, all > 0); a flat prior when null
   */
  constructor(kind: Regularizer, n: number, prior: Float64Array | null = null) {
    this.kind = kind;
    this.n = n;
    this.tvEps = 0.1 / (n * n);
    this.prior = null;
    this.logPrior = null;
    this.radius2 = null;
    if (kind === "entropy") {
      const m = prior ?? new Float64Array(n * n).fill(1 / (n * n));
      this.prior = m;
      this.logPrior = m.map((x) => Math.log(x));
    } else if (kind === "compactness") {
      const c = Math.floor(n / 2);
      const r2 = new Float64Array(n * n);
      const scale = 128 / (n * n);
      for (let y = 0; y < n; y++)
        for (let x = 0; x < n; x++) r2[y * n + x] = ((x - c) * (x - c) + (y - c) * (y - c)) * scale;
      this.radius2 = r2;
    }
  }

  /** R(p); when `grad` is given, adds factor · ∂R/∂p to it. Allocates nothing. */
  evaluate(p: Float64Array, grad: Float64Array | null, factor = 1): number {
    switch (this.kind) {
      case "entropy":
        return this.entropy(p, grad, factor);
      case "totalVariation":
        return this.totalVariation(p, grad, factor);
      case "compactness":
        return this.compactness(p, grad, factor);
    }
  }

  private entropy(p: Float64Array, grad: Float64Array | null, factor: number): number {
    const lm = this.logPrior!;
    let sum = 0;
    for (let i = 0; i < p.length; i++) {
      const q = p[i] + ENTROPY_EPS;
      const l = Math.log(q) - lm[i];
      sum += p[i] * l;
      if (grad) grad[i] += factor * ENTROPY_NORM * (l + p[i] / q);
    }
    return sum * ENTROPY_NORM;
  }

  private totalVariation(p: Float64Array, grad: Float64Array | null, factor: number): number {
    const n = this.n;
    const eps = this.tvEps;
    const eps2 = eps * eps;
    const norm = n / 16;
    const f = factor * norm;
    let sum = 0;
    for (let y = 0; y < n; y++) {
      const row = y * n;
      for (let x = 0; x < n; x++) {
        const i = row + x;
        const dx = x + 1 < n ? p[i + 1] - p[i] : 0;
        const dy = y + 1 < n ? p[i + n] - p[i] : 0;
        const g = Math.sqrt(dx * dx + dy * dy + eps2);
        sum += g - eps;
        if (grad) {
          const a = (f * dx) / g;
          const b = (f * dy) / g;
          grad[i] -= a + b;
          if (x + 1 < n) grad[i + 1] += a;
          if (y + 1 < n) grad[i + n] += b;
        }
      }
    }
    return sum * norm;
  }

  private compactness(p: Float64Array, grad: Float64Array | null, factor: number): number {
    const r2 = this.radius2!;
    let sum = 0;
    for (let i = 0; i < p.length; i++) {
      sum += p[i] * r2[i];
      if (grad) grad[i] += factor * r2[i];
    }
    return sum;
  }

  /** The entropy prior (null for the other terms). */
  priorImage(): Float64Array | null {
    return this.prior;
  }
}
