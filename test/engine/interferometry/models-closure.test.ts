import { MAS } from "@test/angles";
import { besselIntegral } from "@test/bessel";
import { rng } from "@test/random";
import { describe, expect, it } from "vitest";
import {
  besselJ0,
  besselJ1,
  closureCube,
  closurePhase,
  compileModel,
  evaluateVisibilities,
  independentClosurePhaseCount,
  sphericalJ1OverX,
  stationTriangles,
  type TargetModel,
  triangleCount,
  type VisibilityCube,
  visibilityAt,
} from "~/engine";

describe("Bessel functions", () => {
  it("match Abramowitz & Stegun Table 9.1", () => {
    // A&S Table 9.1: J0(1) = 0.7651976866, J1(1) = 0.4400505857, J0(5) = −0.1775967713, J1(5) = −0.3275791376.
    expect(besselJ0(1)).toBeCloseTo(0.7651976866, 7);
    expect(besselJ1(1)).toBeCloseTo(0.4400505857, 7);
    expect(besselJ0(5)).toBeCloseTo(-0.1775967713, 7);
    expect(besselJ1(5)).toBeCloseTo(-0.3275791376, 7);
  });

  it("match the Bessel integral over 0..40 within 1e-7", () => {
    for (let x = 0; x < 40; x += 0.37) {
      expect(Math.abs(besselJ0(x) - besselIntegral(0, x, 4000))).toBeLessThan(1e-7);
      expect(Math.abs(besselJ1(x) - besselIntegral(1, x, 4000))).toBeLessThan(1e-7);
    }
  });
});

describe("target models", () => {
  const lambda = 1.65e-6;

  it("uniform disk: first null at B = 1.2197 λ/θ", () => {
    // A&S Table 9.5: first zero of J1 is 3.8317 → x = πθB/λ = 3.8317 → B = 1.2197 λ/θ.
    const m = compileModel({ type: "uniformDisk", diameterMas: 3 });
    const theta = 3 * MAS;
    const v = (b: number) => visibilityAt(m, b / lambda, 0).re;
    let lo = 0.9 * (lambda / theta);
    let hi = 1.5 * (lambda / theta);
    expect(v(lo)).toBeGreaterThan(0);
    expect(v(hi)).toBeLessThan(0);
    for (let i = 0; i < 60; i++) {
      const mid = 0.5 * (lo + hi);
      if (v(mid) > 0) lo = mid;
      else hi = mid;
    }
    expect(lo / (lambda / theta)).toBeCloseTo(1.2197, 4);
    expect(visibilityAt(m, 0, 0).re).toBe(1);
  });

  it("Gaussian: V = exp(−(π θ r)² / (4 ln 2)) and V = 1/2 at r = 2 ln 2 /(π θ)", () => {
    const m = compileModel({ type: "gaussian", fwhmMas: 5 });
    const theta = 5 * MAS;
    for (const r of [1e6, 3e7, 8e7]) {
      const expected = Math.exp(-((Math.PI * theta * r) ** 2) / (4 * Math.log(2))); // Gaussian formula, CONVENTIONS source list
      expect(visibilityAt(m, r * 0.6, r * 0.8).re).toBeCloseTo(expected, 12);
    }
    // Half visibility at r = 2 ln2 / (π θ): common practice (Fourier pair of a Gaussian).
    expect(visibilityAt(m, (2 * Math.log(2)) / (Math.PI * theta), 0).re).toBeCloseTo(0.5, 12);
  });

  it("limb-darkened disk: a = 0 is the uniform disk; a = 1 has its first null at the first zero of J_{3/2}", () => {
    const ud = compileModel({ type: "uniformDisk", diameterMas: 2 });
    const ld0 = compileModel({ type: "limbDarkenedDisk", diameterMas: 2, coefficient: 0 });
    for (const r of [1e7, 1.2e8, 3e8]) expect(visibilityAt(ld0, r, 0).re).toBeCloseTo(visibilityAt(ud, r, 0).re, 12);
    // Fully darkened disk: V ∝ J_{3/2}(x)/x^{3/2}; first zero where tan x = x, x = 4.4934
    // (A&S Table 10.6, first zero of the spherical Bessel j1).
    const ld1 = compileModel({ type: "limbDarkenedDisk", diameterMas: 2, coefficient: 1 });
    const rNull = 4.4934 / (Math.PI * 2 * MAS);
    expect(Math.abs(visibilityAt(ld1, rNull, 0).re)).toBeLessThan(1e-5);
    expect(visibilityAt(ld1, 0.5 * rNull, 0).re).toBeGreaterThan(0);
    expect(visibilityAt(ld1, 0, 0).re).toBeCloseTo(1, 12);
    // Series branch (x < 0.1) agrees with (sin x / x − cos x)/x² evaluated directly here.
    const x = 0.0999;
    expect(sphericalJ1OverX(x)).toBeCloseTo((Math.sin(x) / x - Math.cos(x)) / (x * x), 11);
    expect(sphericalJ1OverX(0)).toBe(1 / 3);
  });

  it("ring: first null at the first zero of J0, 2.4048 (A&S Table 9.5)", () => {
    const ring = compileModel({ type: "ring", diameterMas: 4 });
    expect(Math.abs(visibilityAt(ring, 2.4048 / (Math.PI * 4 * MAS), 0).re)).toBeLessThan(1e-4);
  });

  it("binary: matches a direct evaluation of two points", () => {
    const sep = 6;
    const pa = 60;
    const f = 0.4;
    const m = compileModel({ type: "binary", separationMas: sep, positionAngleDeg: pa, fluxRatio: f });
    // Direct evaluation with the sign convention V = Σ F_k exp(−2πi(u α_k + v δ_k)) / Σ F_k,
    // α east, δ north; secondary at α = ρ sin PA, δ = ρ cos PA.
    const a = sep * MAS * Math.sin((pa * Math.PI) / 180);
    const d = sep * MAS * Math.cos((pa * Math.PI) / 180);
    const r = rng(3);
    for (let k = 0; k < 20; k++) {
      const u = (r() - 0.5) * 2e8;
      const v = (r() - 0.5) * 2e8;
      const phase = -2 * Math.PI * (u * a + v * d);
      const re = (1 + f * Math.cos(phase)) / (1 + f);
      const im = (f * Math.sin(phase)) / (1 + f);
      const got = visibilityAt(m, u, v);
      expect(got.re).toBeCloseTo(re, 12);
      expect(got.im).toBeCloseTo(im, 12);
      // V² of a binary: (1 + f² + 2f cos φ)/(1 + f)² (common practice).
      expect(got.re ** 2 + got.im ** 2).toBeCloseTo((1 + f * f + 2 * f * Math.cos(phase)) / (1 + f) ** 2, 12);
    }
  });

  it("sum: an offset point is a pure phase ramp, and point + offset point equals the binary", () => {
    const sum = compileModel({
      type: "sum",
      components: [
        { model: { type: "point" }, flux: 1, offsetEastMas: 0, offsetNorthMas: 0 },
        { model: { type: "point" }, flux: 0.25, offsetEastMas: 3, offsetNorthMas: -4 },
      ],
    });
    // Separation 5 mas at PA atan2(3, −4) east of north.
    const bin = compileModel({
      type: "binary",
      separationMas: 5,
      positionAngleDeg: (Math.atan2(3, -4) * 180) / Math.PI,
      fluxRatio: 0.25,
    });
    const shifted = compileModel({
      type: "sum",
      components: [{ model: { type: "uniformDisk", diameterMas: 1 }, flux: 2, offsetEastMas: 2, offsetNorthMas: 1 }],
    });
    const disk = compileModel({ type: "uniformDisk", diameterMas: 1 });
    const r = rng(11);
    for (let k = 0; k < 10; k++) {
      const u = (r() - 0.5) * 3e8;
      const v = (r() - 0.5) * 3e8;
      const a = visibilityAt(sum, u, v);
      const b = visibilityAt(bin, u, v);
      expect(a.re).toBeCloseTo(b.re, 12);
      expect(a.im).toBeCloseTo(b.im, 12);
      const s = visibilityAt(shifted, u, v);
      const d = visibilityAt(disk, u, v).re;
      const phase = -2 * Math.PI * (u * 2 * MAS + v * 1 * MAS);
      expect(s.re).toBeCloseTo(d * Math.cos(phase), 12);
      expect(s.im).toBeCloseTo(d * Math.sin(phase), 12);
    }
  });

  it("the vectorized and single-point paths agree", () => {
    const model: TargetModel = {
      type: "sum",
      components: [
        {
          model: { type: "limbDarkenedDisk", diameterMas: 2, coefficient: 0.3 },
          flux: 1,
          offsetEastMas: 0,
          offsetNorthMas: 0,
        },
        { model: { type: "ring", diameterMas: 5 }, flux: 0.3, offsetEastMas: 1, offsetNorthMas: 0 },
        { model: { type: "gaussian", fwhmMas: 3 }, flux: 0.2, offsetEastMas: 0, offsetNorthMas: 2 },
      ],
    };
    const m = compileModel(model);
    const u = Float64Array.from({ length: 50 }, (_, i) => i * 4e6 - 1e8);
    const v = Float64Array.from({ length: 50 }, (_, i) => 7e7 - i * 3e6);
    const re = new Float64Array(50);
    const im = new Float64Array(50);
    evaluateVisibilities(m, u, v, re, im);
    for (let i = 0; i < 50; i++) {
      const p = visibilityAt(m, u[i], v[i]);
      expect(re[i]).toBe(p.re);
      expect(im[i]).toBe(p.im);
    }
  });
});

describe("closure phases", () => {
  it("counts N(N−1)(N−2)/6 triangles and (N−1)(N−2)/2 independent closure phases", () => {
    // Monnier (2003), Rep. Prog. Phys. 66, 789: (N−1)(N−2)/2 independent closure phases.
    expect([3, 4, 6, 10].map(independentClosurePhaseCount)).toEqual([1, 3, 10, 36]);
    expect([3, 4, 6, 10].map(triangleCount)).toEqual([1, 4, 20, 120]);
    const t = stationTriangles(4);
    expect(Array.from({ length: t.count }, (_, k) => [t.i[k], t.j[k], t.k[k]])).toEqual([
      [0, 1, 2],
      [0, 1, 3],
      [0, 2, 3],
      [1, 2, 3],
    ]);
  });

  /** Visibilities of a model on random baselines of N stations, as a one-sample cube. */
  function cubeFor(model: TargetModel, n: number, seed: number, phaseErrors?: Float64Array): VisibilityCube {
    const r = rng(seed);
    const pos = Array.from({ length: n }, () => [(r() - 0.5) * 4e8, (r() - 0.5) * 4e8]);
    const nb = (n * (n - 1)) / 2;
    const uW = new Float64Array(nb);
    const vW = new Float64Array(nb);
    let b = 0;
    for (let i = 0; i < n; i++)
      for (let j = i + 1; j < n; j++) {
        uW[b] = pos[j][0] - pos[i][0];
        vW[b] = pos[j][1] - pos[i][1];
        b++;
      }
    const re = new Float64Array(nb);
    const im = new Float64Array(nb);
    evaluateVisibilities(compileModel(model), uW, vW, re, im);
    if (phaseErrors) {
      b = 0;
      for (let i = 0; i < n; i++)
        for (let j = i + 1; j < n; j++) {
          const e = phaseErrors[i] - phaseErrors[j]; // station-based error ψ_i − ψ_j on baseline i–j
          const c = Math.cos(e);
          const s = Math.sin(e);
          const x = re[b] * c - im[b] * s;
          im[b] = re[b] * s + im[b] * c;
          re[b] = x;
          b++;
        }
    }
    return { nBaselines: nb, nSamples: 1, nChannels: 1, uW, vW, re, im };
  }

  it("is 0° or 180° for centro-symmetric models", () => {
    const models: TargetModel[] = [
      { type: "uniformDisk", diameterMas: 4 },
      { type: "limbDarkenedDisk", diameterMas: 3, coefficient: 0.6 },
      { type: "ring", diameterMas: 5 },
      { type: "gaussian", fwhmMas: 3 },
      { type: "binary", separationMas: 5, positionAngleDeg: 30, fluxRatio: 1 }, // equal pair: symmetric about its midpoint
    ];
    let saw180 = false;
    for (const model of models) {
      const cube = cubeFor(model, 6, 5);
      const cp = closureCube(cube, stationTriangles(6)).phaseRad;
      for (const x of cp) {
        const a = Math.abs(x);
        expect(Math.min(a, Math.abs(Math.PI - a))).toBeLessThan(1e-9);
        if (Math.abs(Math.PI - a) < 1e-9) saw180 = true;
      }
    }
    expect(saw180).toBe(true); // the long baselines go past the disk's first null
  });

  it("is unchanged by random per-station phase errors", () => {
    const model: TargetModel = { type: "binary", separationMas: 3, positionAngleDeg: 110, fluxRatio: 0.3 };
    const r = rng(99);
    const errors = Float64Array.from({ length: 6 }, () => (r() - 0.5) * 20);
    const clean = closureCube(cubeFor(model, 6, 8), stationTriangles(6)).phaseRad;
    const dirty = closureCube(cubeFor(model, 6, 8, errors), stationTriangles(6)).phaseRad;
    let nonzero = 0;
    for (let i = 0; i < clean.length; i++) {
      const d = Math.atan2(Math.sin(clean[i] - dirty[i]), Math.cos(clean[i] - dirty[i]));
      expect(Math.abs(d)).toBeLessThan(1e-9);
      if (Math.abs(clean[i]) > 0.01) nonzero++;
    }
    expect(nonzero).toBeGreaterThan(5); // the binary really has closure-phase signal
    // The per-baseline phases themselves do change.
    const v0 = cubeFor(model, 6, 8);
    const v1 = cubeFor(model, 6, 8, errors);
    expect(Math.abs(Math.atan2(v0.im[0], v0.re[0]) - Math.atan2(v1.im[0], v1.re[0]))).toBeGreaterThan(1e-3);
  });

  it("binary closure phase equals φ_ij + φ_jk − φ_ik from a direct evaluation", () => {
    const sep = 4 * MAS;
    const pa = (75 * Math.PI) / 180;
    const f = 0.5;
    const a = sep * Math.sin(pa);
    const d = sep * Math.cos(pa);
    // Direct phase of a binary written out here (sign convention of CONVENTIONS.md).
    const phaseOf = (u: number, v: number) => {
      const p = -2 * Math.PI * (u * a + v * d);
      return Math.atan2(f * Math.sin(p), 1 + f * Math.cos(p));
    };
    const pos = [
      [0, 0],
      [0.7e8, 0.2e8],
      [0.1e8, 0.9e8],
    ];
    const uv = (i: number, j: number) => [pos[j][0] - pos[i][0], pos[j][1] - pos[i][1]];
    const expected =
      phaseOf(...(uv(0, 1) as [number, number])) +
      phaseOf(...(uv(1, 2) as [number, number])) -
      phaseOf(...(uv(0, 2) as [number, number]));
    const m = compileModel({ type: "binary", separationMas: 4, positionAngleDeg: 75, fluxRatio: f });
    const [vij, vjk, vik] = [uv(0, 1), uv(1, 2), uv(0, 2)].map(([u, v]) => visibilityAt(m, u, v));
    const got = closurePhase(vij.re, vij.im, vjk.re, vjk.im, vik.re, vik.im);
    expect(Math.atan2(Math.sin(got - expected), Math.cos(got - expected))).toBeCloseTo(0, 12);
    expect(Math.abs(got)).toBeGreaterThan(1); // about −79°: a clearly non-zero signal
  });
});
