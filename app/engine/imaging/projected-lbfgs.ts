/**
 * Minimization of a smooth function under box constraints l ≤ x ≤ u by a projected limited-memory BFGS
 * method with an active set — the projected quasi-Newton scheme of Kim, Sra & Dhillon (2010, SIAM J. Sci.
 * Comput. 32, 3548) with the projection-arc Armijo search of Bertsekas (1982, SIAM J. Control Optim. 20,
 * 221):
 *  1. binding set B = {i : x_i = l_i and g_i > 0, or x_i = u_i and g_i < 0}; the others are free;
 *  2. direction d = −H g on the free variables (H the L-BFGS inverse-Hessian approximation of Nocedal
 *     1980, Math. Comput. 35, 773, two-loop recursion, applied to g with its binding components zeroed,
 *     so d is a descent direction: gᵀd = −g_Fᵀ H_FF g_F < 0), d_B = 0;
 *  3. x(α) = P(x + α d), P the projection on the box, accepted when
 *     f(x(α)) ≤ f(x) + c₁ gᵀ(x(α) − x), c₁ = 1e-4, α from 1 down by safeguarded quadratic interpolation;
 *  4. the pair (s, y) enters the memory when sᵀy > 1e-12 · yᵀy (curvature), H₀ = (sᵀy / yᵀy) I.
 * Stops when the projected gradient ‖P(x − g) − x‖∞ ≤ gradientTolerance, when the relative decrease
 * (f_k − f_{k+1}) / max(|f_k|, |f_{k+1}|, 1) ≤ objectiveTolerance (the criterion of Byrd, Lu, Nocedal &
 * Zhu 1995, SIAM J. Sci. Comput. 16, 1190) on three consecutive iterations that used curvature pairs (a
 * single short steepest-descent step after a warm start does not end the run), after maxIterations, or
 * when no step decreases f.
 */
import { float64Arrays } from "../arrays";

export type Objective = (x: Float64Array, grad: Float64Array) => number;

export interface BoundedOptions {
  /** Lower and upper bounds: one value for every variable or one per variable (±Infinity allowed). */
  lower?: number | Float64Array;
  upper?: number | Float64Array;
  maxIterations?: number;
  /** Most evaluations of f (line-search trials included); unlimited by default. */
  maxEvaluations?: number;
  /** Number of (s, y) pairs kept; default 8. */
  memory?: number;
  objectiveTolerance?: number;
  gradientTolerance?: number;
  /** Length of the first trial step along −g, in the units of x (the largest component moves by it). */
  initialStep?: number;
  /**
   * Diagonal scaling of the initial inverse Hessian, H₀ = γ diag(D(x)) (D > 0; the identity when absent):
   * writes D at x into `out`.
   */
  metric?: (x: Float64Array, out: Float64Array) => void;
  /** Called after every iteration; return true to stop. */
  onIteration?: (iteration: number, f: number, x: Float64Array) => boolean | undefined;
}

export type StopReason = "gradient" | "objective" | "maxIterations" | "maxEvaluations" | "lineSearch" | "stopped";

export interface BoundedResult {
  x: Float64Array;
  f: number;
  iterations: number;
  evaluations: number;
  converged: boolean;
  reason: StopReason;
}

const C1 = 1e-4;
const MAX_BACKTRACKS = 30;

/** Minimizes `fg` from x0 (projected onto the box first). `fg` returns f and writes ∂f/∂x. */
export function minimizeBounded(fg: Objective, x0: ArrayLike<number>, options: BoundedOptions = {}): BoundedResult {
  const n = x0.length;
  const lo = typeof options.lower === "number" || options.lower === undefined ? null : options.lower;
  const hi = typeof options.upper === "number" || options.upper === undefined ? null : options.upper;
  const loS = typeof options.lower === "number" ? options.lower : Number.NEGATIVE_INFINITY;
  const hiS = typeof options.upper === "number" ? options.upper : Number.POSITIVE_INFINITY;
  const lower = (i: number) => (lo ? lo[i] : loS);
  const upper = (i: number) => (hi ? hi[i] : hiS);
  const maxIter = options.maxIterations ?? 500;
  const m = options.memory ?? 8;
  const fTol = options.objectiveTolerance ?? 1e-9;
  const gTol = options.gradientTolerance ?? 1e-10;
  const maxEval = options.maxEvaluations ?? Number.POSITIVE_INFINITY;

  const x = new Float64Array(n);
  for (let i = 0; i < n; i++) x[i] = Math.min(upper(i), Math.max(lower(i), x0[i]));
  const [g, xNew, gNew, d, q, free] = float64Arrays(6, n);
  const S = float64Arrays(m, n);
  const Y = float64Arrays(m, n);
  const [rho, alpha] = float64Arrays(2, m);
  let stored = 0;
  let newest = -1;
  let gamma = 1;
  const diag = new Float64Array(n).fill(1);
  const metric = options.metric;

  let evaluations = 1;
  let f = fg(x, g);
  metric?.(x, diag);
  let iterations = 0;
  let reason: StopReason = "maxIterations";
  let smallSteps = 0;

  const dot = (a: Float64Array, b: Float64Array) => {
    let s = 0;
    for (let i = 0; i < n; i++) s += a[i] * b[i];
    return s;
  };

  while (iterations < maxIter) {
    if (evaluations >= maxEval) {
      reason = "maxEvaluations";
      break;
    }
    // Projected gradient and binding set.
    let pg = 0;
    let gFreeMax = 0;
    for (let i = 0; i < n; i++) {
      const p = Math.min(upper(i), Math.max(lower(i), x[i] - g[i])) - x[i];
      pg = Math.max(pg, Math.abs(p));
      const bound = (x[i] <= lower(i) && g[i] > 0) || (x[i] >= upper(i) && g[i] < 0);
      q[i] = bound ? 0 : g[i];
      free[i] = bound ? 0 : 1;
      gFreeMax = Math.max(gFreeMax, Math.abs(q[i]));
    }
    if (pg <= gTol || gFreeMax === 0) {
      reason = "gradient";
      break;
    }

    // Two-loop recursion on the free gradient.
    let steepest = stored === 0;
    if (!steepest) {
      for (let k = 0, j = newest; k < stored; k++, j = (j - 1 + m) % m) {
        alpha[j] = rho[j] * dot(S[j], q);
        const yj = Y[j];
        for (let i = 0; i < n; i++) q[i] -= alpha[j] * yj[i];
      }
      for (let i = 0; i < n; i++) q[i] *= gamma * diag[i];
      for (let k = 0, j = (newest - stored + 1 + m) % m; k < stored; k++, j = (j + 1) % m) {
        const beta = rho[j] * dot(Y[j], q);
        const sj = S[j];
        for (let i = 0; i < n; i++) q[i] += (alpha[j] - beta) * sj[i];
      }
      for (let i = 0; i < n; i++) d[i] = -q[i] * free[i];
      if (!(dot(g, d) < 0)) steepest = true;
    }
    if (steepest) {
      let gd = 0;
      for (let i = 0; i < n; i++) gd = Math.max(gd, Math.abs(g[i] * free[i] * diag[i]));
      const scale = (options.initialStep ?? 1) / gd;
      for (let i = 0; i < n; i++) d[i] = -g[i] * free[i] * diag[i] * (stored === 0 ? scale : gamma);
      stored = 0;
    }

    // Projected backtracking (Armijo along the projection arc).
    let step = 1;
    let accepted = false;
    let fNew = f;
    for (let t = 0; t < MAX_BACKTRACKS; t++) {
      let decrease = 0;
      for (let i = 0; i < n; i++) {
        xNew[i] = Math.min(upper(i), Math.max(lower(i), x[i] + step * d[i]));
        decrease += g[i] * (xNew[i] - x[i]);
      }
      fNew = fg(xNew, gNew);
      evaluations++;
      if (fNew <= f + C1 * decrease && decrease < 0) {
        accepted = true;
        break;
      }
      if (decrease >= 0) break; // the projection removed every useful component
      const trial = Number.isFinite(fNew) ? (-decrease * step) / (2 * (fNew - f - decrease)) : 0.1 * step;
      step = Math.min(0.5 * step, Math.max(0.1 * step, trial));
    }
    if (!accepted) {
      if (stored > 0) {
        stored = 0; // forget the curvature pairs and retry along the steepest descent
        continue;
      }
      reason = "lineSearch";
      break;
    }

    // Memory update.
    const next = (newest + 1) % m;
    const s = S[next];
    const y = Y[next];
    for (let i = 0; i < n; i++) {
      s[i] = xNew[i] - x[i];
      y[i] = gNew[i] - g[i];
    }
    metric?.(xNew, diag);
    const sy = dot(s, y);
    let yy = 0;
    let yDy = 0;
    for (let i = 0; i < n; i++) {
      yy += y[i] * y[i];
      yDy += y[i] * y[i] * diag[i];
    }
    if (sy > 1e-12 * yy && yy > 0) {
      newest = next;
      rho[next] = 1 / sy;
      stored = Math.min(stored + 1, m);
      gamma = sy / yDy;
    }
    const relative = (f - fNew) / Math.max(Math.abs(f), Math.abs(fNew), 1);
    x.set(xNew);
    g.set(gNew);
    f = fNew;
    iterations++;
    if (options.onIteration?.(iterations, f, x)) {
      reason = "stopped";
      break;
    }
    smallSteps = relative <= fTol && iterations > 1 ? smallSteps + 1 : 0;
    if (smallSteps >= 3) {
      reason = "objective";
      break;
    }
  }
  return {
    x,
    f,
    iterations,
    evaluations,
    converged: reason === "gradient" || reason === "objective",
    reason,
  };
}
