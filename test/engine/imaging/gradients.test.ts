import { rng } from "@test/random";
import { describe, expect, it } from "vitest";
import {
  DataTerms,
  gaussianImage,
  ImageTransform,
  type ImagingData,
  ImagingObjective,
  prepareData,
  RegularizationTerm,
} from "~/engine";

/** A small data set: 4 stations' baselines at a few hour angles, V² and closure phases of every triangle. */
function smallData(seed: number): ImagingData {
  const r = rng(seed);
  const st = [
    [0, 0],
    [40, 10],
    [-30, 60],
    [70, -50],
  ];
  const vis2: ImagingData["vis2"] = [];
  const closurePhases: ImagingData["closurePhases"] = [];
  for (let h = 0; h < 5; h++) {
    const rot = 0.3 * h;
    const uv = (a: number, b: number): [number, number] => {
      const dx = st[b][0] - st[a][0];
      const dy = st[b][1] - st[a][1];
      return [dx * Math.cos(rot) - dy * Math.sin(rot), dx * Math.sin(rot) + dy * Math.cos(rot)];
    };
    for (let a = 0; a < 4; a++)
      for (let b = a + 1; b < 4; b++) {
        const [u, v] = uv(a, b);
        vis2.push({ uM: u, vM: v, wavelengthM: 2e-6, vis2: 0.2 + 0.6 * r(), vis2Err: 0.02 + 0.02 * r() });
        for (let c = b + 1; c < 4; c++) {
          const [u2, v2] = uv(b, c);
          closurePhases.push({
            wavelengthM: 2e-6,
            u1M: u,
            v1M: v,
            u2M: u2,
            v2M: v2,
            closurePhaseDeg: 170 * (2 * r() - 1),
            closurePhaseErrDeg: 1 + 3 * r(),
          });
        }
      }
  }
  return { vis2, closurePhases };
}

/**
 * Largest difference between an analytic gradient and central differences, relative to the largest
 * gradient component probed. Step h, or h·|x_i| when `relative` (for the entropy's logarithm).
 */
function checkGradient(
  f: (x: Float64Array, g: Float64Array) => number,
  x0: Float64Array,
  step: number,
  indices: number[],
  relative = false,
) {
  const g = new Float64Array(x0.length);
  f(x0, g);
  const scratch = new Float64Array(x0.length);
  let worst = 0;
  let scale = 0;
  for (const i of indices) scale = Math.max(scale, Math.abs(g[i]));
  for (const i of indices) {
    const h = relative ? step * Math.abs(x0[i]) : step;
    const xp = x0.slice();
    const xm = x0.slice();
    xp[i] += h;
    xm[i] -= h;
    const fd = (f(xp, scratch) - f(xm, scratch)) / (2 * h);
    worst = Math.max(worst, Math.abs(fd - g[i]) / Math.max(scale, 1e-12));
  }
  return worst;
}

describe("analytic gradients against central finite differences", () => {
  const data = prepareData(smallData(4));
  const terms = new DataTerms(data);
  const k = data.uW.length;

  it("χ² of V² and closure phases with respect to Re V and Im V", () => {
    const r = rng(8);
    const v0 = Float64Array.from({ length: 2 * k }, () => 0.3 + 0.5 * r());
    const f = (x: Float64Array, g: Float64Array) => {
      const gr = new Float64Array(k);
      const gi = new Float64Array(k);
      const p = terms.evaluate(x.subarray(0, k), x.subarray(k), 1, gr, gi);
      g.set(gr, 0);
      g.set(gi, k);
      return p.vis2 + p.closurePhase;
    };
    expect(
      checkGradient(
        f,
        v0,
        1e-6,
        Array.from({ length: 2 * k }, (_, i) => i),
      ),
    ).toBeLessThan(1e-6);
  });

  const n = 32;
  const image = gaussianImage(n, 6);
  const r = rng(3);
  for (let i = 0; i < image.length; i++) image[i] *= 0.5 + r();
  const probe = Array.from({ length: 60 }, (_, i) => (i * 977) % (n * n));
  // Pixels well above the Gaussian's floor: there a relative step resolves the logarithm's curvature.
  const peak = Math.max(...image);
  const bright = probe.filter((i) => image[i] > 1e-4 * peak);

  for (const [name, term] of [
    ["entropy, flat prior", new RegularizationTerm("entropy", n)],
    ["entropy, Gaussian prior", new RegularizationTerm("entropy", n, gaussianImage(n, 10))],
    ["total variation", new RegularizationTerm("totalVariation", n)],
    ["compactness", new RegularizationTerm("compactness", n)],
  ] as const) {
    it(`regularizer: ${name}`, () => {
      const f = (x: Float64Array, g: Float64Array) => {
        g.fill(0);
        return term.evaluate(x, g);
      };
      const rel = name.startsWith("entropy");
      expect(bright.length).toBeGreaterThan(20);
      expect(checkGradient(f, image, rel ? 1e-5 : 1e-9, rel ? bright : probe, rel)).toBeLessThan(1e-5);
    });
  }

  it("the whole objective J(x) = χ²_ν + weight·R through the normalization and the transform's adjoint", () => {
    const transform = new ImageTransform(n, 0.4 * 4.848e-9, data.uW, data.vW);
    for (const kind of ["entropy", "totalVariation", "compactness"] as const) {
      const obj = new ImagingObjective(data, transform, new RegularizationTerm(kind, n), 0.3);
      const x = image.map((v) => v * 1.1);
      expect(
        checkGradient((a, g) => obj.evaluate(a, g), x, 1e-8, probe),
        kind,
      ).toBeLessThan(1e-5);
    }
  });
});

describe("regularizer normalization (each R is 1 for the typical image)", () => {
  it("gives R ≈ 1 for a centred uniform disk of diameter N/4", () => {
    for (const n of [32, 64, 128]) {
      const c = n / 2;
      const disk = new Float64Array(n * n);
      for (let y = 0; y < n; y++)
        for (let x = 0; x < n; x++) if ((x - c) ** 2 + (y - c) ** 2 <= (n / 8) ** 2) disk[y * n + x] = 1;
      const s = disk.reduce((a, b) => a + b, 0);
      for (let i = 0; i < disk.length; i++) disk[i] /= s;
      // Our normalization (regularizers.ts): the pixelized disk differs from the ideal one by its rim,
      // so the tolerances are those of the rim's share of the disk (coarser at N = 32).
      expect(new RegularizationTerm("entropy", n).evaluate(disk, null)).toBeCloseTo(1, 1);
      expect(Math.abs(new RegularizationTerm("compactness", n).evaluate(disk, null) - 1)).toBeLessThan(0.12);
      expect(Math.abs(new RegularizationTerm("totalVariation", n).evaluate(disk, null) - 1)).toBeLessThan(0.35);
    }
  });
});
