/**
 * χ² of the data given the image's visibilities, and its derivatives with respect to Re V and Im V.
 *
 *   χ²(V²) = Σ_k (|V_{p(k)}|² − d_k)² / σ_k²
 *   χ²(CP) = Σ_k 2 (1 − cos r_k) / σ_k²,   r_k = Σ_j s_kj arg V_{p(k,j)} − φ_k
 * The closure phases are compared as angles: 2(1 − cos r) depends on r modulo 2π only and equals
 * r² − r⁴/12 + … , i.e. the wrapped squared residual for residuals of a few σ (the von Mises form of the
 * likelihood of an angle, Mardia & Jupp 2000, Directional Statistics, §3.5). Unlike wrap(r)², it is smooth
 * where a residual crosses ±180°, so the minimizer's line search does not stall on that kink. The
 * reported χ² uses wrap(r)² (closureChi2).
 * Derivatives: ∂|V|²/∂(Re V, Im V) = 2 (Re V, Im V); ∂ arg V/∂(Re V, Im V) = (−Im V, Re V) / |V|².
 * Where |V| = 0 the phase is undefined; |V|² is floored at 1e-30 there.
 */
import type { PreparedData } from "./data";

const TINY = 1e-30;

export interface Chi2Parts {
  /** Σ of the V² and closure-phase terms (not reduced). */
  vis2: number;
  closurePhase: number;
}

export class DataTerms {
  readonly data: PreparedData;
  readonly nVis2: number;
  readonly nClosure: number;
  private readonly phase: Float64Array;
  private readonly abs2: Float64Array;

  constructor(data: PreparedData) {
    this.data = data;
    this.nVis2 = data.vis2.length;
    this.nClosure = data.cpRad.length;
    this.phase = new Float64Array(data.uW.length);
    this.abs2 = new Float64Array(data.uW.length);
  }

  /**
   * Evaluates both χ² sums at the visibilities (re, im) of the distinct points and writes
   * scale · ∂(χ²(V²) + χ²(CP))/∂(Re V, Im V) into gRe/gIm (overwritten). Allocates nothing.
   */
  evaluate(re: Float64Array, im: Float64Array, scale: number, gRe: Float64Array, gIm: Float64Array): Chi2Parts {
    const d = this.data;
    const { phase, abs2 } = this;
    const nP = re.length;
    for (let p = 0; p < nP; p++) {
      gRe[p] = 0;
      gIm[p] = 0;
      abs2[p] = re[p] * re[p] + im[p] * im[p];
    }
    let chiV = 0;
    for (let k = 0; k < this.nVis2; k++) {
      const p = d.vis2Point[k];
      const r = abs2[p] - d.vis2[k];
      const w = d.vis2InvVar[k];
      chiV += r * r * w;
      const f = 4 * scale * r * w; // ∂(r² w)/∂|V|² · 2
      gRe[p] += f * re[p];
      gIm[p] += f * im[p];
    }
    if (this.nClosure === 0) return { vis2: chiV, closurePhase: 0 };
    for (let p = 0; p < nP; p++) phase[p] = Math.atan2(im[p], re[p]);
    let chiC = 0;
    const { cpPoint, cpSign, cpRad, cpInvVar } = d;
    for (let k = 0; k < this.nClosure; k++) {
      const o = 3 * k;
      const p0 = cpPoint[o];
      const p1 = cpPoint[o + 1];
      const p2 = cpPoint[o + 2];
      const s0 = cpSign[o];
      const s1 = cpSign[o + 1];
      const s2 = cpSign[o + 2];
      const r = s0 * phase[p0] + s1 * phase[p1] + s2 * phase[p2] - cpRad[k];
      const w = cpInvVar[k];
      chiC += 2 * (1 - Math.cos(r)) * w;
      const f = 2 * scale * Math.sin(r) * w;
      let a = f * s0;
      let q = Math.max(abs2[p0], TINY);
      gRe[p0] -= (a * im[p0]) / q;
      gIm[p0] += (a * re[p0]) / q;
      a = f * s1;
      q = Math.max(abs2[p1], TINY);
      gRe[p1] -= (a * im[p1]) / q;
      gIm[p1] += (a * re[p1]) / q;
      a = f * s2;
      q = Math.max(abs2[p2], TINY);
      gRe[p2] -= (a * im[p2]) / q;
      gIm[p2] += (a * re[p2]) / q;
    }
    return { vis2: chiV, closurePhase: chiC };
  }

  /** χ²(CP) (not reduced) at visibilities (re, im) with other inverse variances, e.g. the errors as given. */
  closureChi2(re: Float64Array, im: Float64Array, invVar: Float64Array): number {
    const { cpPoint, cpSign, cpRad } = this.data;
    let chi = 0;
    for (let k = 0; k < this.nClosure; k++) {
      const o = 3 * k;
      let r = 0;
      for (let j = 0; j < 3; j++) r += cpSign[o + j] * Math.atan2(im[cpPoint[o + j]], re[cpPoint[o + j]]);
      r -= cpRad[k];
      r -= 2 * Math.PI * Math.round(r / (2 * Math.PI));
      chi += r * r * invVar[k];
    }
    return chi;
  }
}
