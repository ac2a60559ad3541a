import { rng } from "@test/random";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { minimizeBounded } from "~/engine";

/**
 * A bound-constrained quadratic ½xᵀAx − bᵀx, x ≥ 0, with a known solution: pick x* (a third of it on the
 * bound) and a gradient g* that is 0 where x* > 0 and positive where x* = 0 (the KKT conditions of the
 * problem), then b = A x* − g*. A = BBᵀ + 0.1 I is positive definite.
 */
function knownQuadratic(n: number, seed: number) {
  const r = rng(seed);
  const B = Array.from({ length: n }, () => Array.from({ length: n }, () => r() - 0.5));
  const A = Array.from({ length: n }, (_, i) =>
    Array.from({ length: n }, (_, j) => B[i].reduce((s, v, k) => s + v * B[j][k], 0) + (i === j ? 0.1 : 0)),
  );
  const xStar = Array.from({ length: n }, (_, i) => (i % 3 === 0 ? 0 : r() + 0.1));
  const gStar = Array.from({ length: n }, (_, i) => (i % 3 === 0 ? r() + 0.1 : 0));
  const b = A.map((row, i) => row.reduce((s, a, j) => s + a * xStar[j], 0) - gStar[i]);
  const fg = (x: Float64Array, g: Float64Array) => {
    let f = 0;
    for (let i = 0; i < n; i++) {
      let ax = 0;
      for (let j = 0; j < n; j++) ax += A[i][j] * x[j];
      g[i] = ax - b[i];
      f += 0.5 * x[i] * ax - b[i] * x[i];
    }
    return f;
  };
  return { fg, xStar };
}

/** Non-negative variables, iterated until the gradient (not the objective) says the solution is reached. */
const TO_THE_BOUND = { lower: 0, maxIterations: 2000, objectiveTolerance: 0, gradientTolerance: 1e-9 };

describe("projected L-BFGS (bounds)", () => {
  it("finds the known solution of a bound-constrained quadratic", () => {
    const { fg, xStar } = knownQuadratic(40, 7);
    const r = minimizeBounded(fg, new Float64Array(40).fill(1), TO_THE_BOUND);
    expect(r.converged).toBe(true);
    for (let i = 0; i < 40; i++) expect(Math.abs(r.x[i] - xStar[i])).toBeLessThan(1e-6);
    // active set identified exactly: the bound variables sit on the bound
    for (let i = 0; i < 40; i += 3) expect(r.x[i]).toBe(0);
  });

  it("reaches the same solution with a diagonal metric", () => {
    const { fg, xStar } = knownQuadratic(30, 3);
    const r = minimizeBounded(fg, new Float64Array(30).fill(0.5), {
      ...TO_THE_BOUND,
      metric: (x, out) => {
        for (let i = 0; i < x.length; i++) out[i] = x[i] + 0.01;
      },
    });
    for (let i = 0; i < 30; i++) expect(Math.abs(r.x[i] - xStar[i])).toBeLessThan(1e-6);
  });

  it("solves a box-constrained problem whose minimum is on a corner (known answer)", () => {
    // (x − 2)² + (y + 1)² on 0 ≤ x ≤ 1, y ≥ 0: the minimum is at the corner (1, 0).
    const r = minimizeBounded(
      (x, g) => {
        g[0] = 2 * (x[0] - 2);
        g[1] = 2 * (x[1] + 1);
        return (x[0] - 2) ** 2 + (x[1] + 1) ** 2;
      },
      [0.3, 0.7],
      { lower: new Float64Array([0, 0]), upper: new Float64Array([1, Number.POSITIVE_INFINITY]) },
    );
    expect(r.x[0]).toBe(1);
    expect(r.x[1]).toBe(0);
    expect(r.reason).toBe("gradient");
  });

  it("agrees with a brute-force search on a non-convex bounded function", () => {
    // f = sin(3x) + (x − 0.4)² + cos(2y) + 0.3 y² on [0, 2]², started in the basin of the global minimum:
    // compared with the best of a 2001 × 2001 grid (brute force written here).
    const f = (x: number, y: number) => Math.sin(3 * x) + (x - 0.4) ** 2 + Math.cos(2 * y) + 0.3 * y * y;
    let best = Number.POSITIVE_INFINITY;
    let bx = 0;
    let by = 0;
    for (let i = 0; i <= 2000; i++)
      for (let j = 0; j <= 2000; j++) {
        const v = f(i / 1000, j / 1000);
        if (v < best) [best, bx, by] = [v, i / 1000, j / 1000];
      }
    const r = minimizeBounded(
      (x, g) => {
        g[0] = 3 * Math.cos(3 * x[0]) + 2 * (x[0] - 0.4);
        g[1] = -2 * Math.sin(2 * x[1]) + 0.6 * x[1];
        return f(x[0], x[1]);
      },
      [1.4, 1.2],
      { lower: 0, upper: 2, gradientTolerance: 1e-10, objectiveTolerance: 0 },
    );
    expect(Math.abs(r.x[0] - bx)).toBeLessThan(1.5e-3);
    expect(Math.abs(r.x[1] - by)).toBeLessThan(1.5e-3);
    expect(r.f).toBeLessThanOrEqual(best + 1e-9);
  });

  it("never evaluates outside the bounds and never increases f between iterations", () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 12 }), fc.integer({ min: 1, max: 10_000 }), (n, seed) => {
        const { fg } = knownQuadratic(n, seed);
        const r0 = rng(seed + 1);
        const upper = Float64Array.from({ length: n }, () => 0.2 + r0());
        let last = Number.POSITIVE_INFINITY;
        let monotone = true;
        minimizeBounded(
          (x, g) => {
            for (let i = 0; i < n; i++) {
              if (x[i] < 0 || x[i] > upper[i]) throw new Error("out of bounds");
            }
            return fg(x, g);
          },
          Float64Array.from({ length: n }, () => 2 * r0() - 0.5),
          {
            lower: 0,
            upper,
            maxIterations: 200,
            onIteration: (_, fv) => {
              if (fv > last) monotone = false;
              last = fv;
              return false;
            },
          },
        );
        expect(monotone).toBe(true);
      }),
      { numRuns: 40 },
    );
  });

  it("stops at the iteration limit and reports it", () => {
    const { fg } = knownQuadratic(20, 1);
    const r = minimizeBounded(fg, new Float64Array(20).fill(1), {
      lower: 0,
      maxIterations: 3,
      objectiveTolerance: 0,
      gradientTolerance: 0,
    });
    expect(r.iterations).toBe(3);
    expect(r.reason).toBe("maxIterations");
    expect(r.converged).toBe(false);
  });
});
