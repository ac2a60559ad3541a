import { j1 } from "@test/bessel";
import { rng } from "@test/random";
import { describe, expect, it } from "vitest";
import { directDirtyBeam, dirtyBeam, dirtyImage, weightPoints } from "~/engine";

const airy = (x: number) => (x === 0 ? 1 : (2 * j1(x)) / x);

/** Direct DFT of a weighted sampling function with Hermitian mirrors, written independently. */
function dftBeamAt(u: number[], v: number[], w: number[], l: number, m: number): number {
  let num = 0;
  let den = 0;
  for (let p = 0; p < u.length; p++) {
    // point + mirror: w e^{+2πi(ul+vm)} + w e^{−2πi(ul+vm)} = 2w cos(2π(ul+vm))
    num += 2 * w[p] * Math.cos(2 * Math.PI * (u[p] * l + v[p] * m));
    den += 2 * w[p];
  }
  return num / den;
}

/** Points on cell centres of an N-grid with the given pixel size (so gridding is exact). */
function onGridPoints(n: number, pixelRad: number, count: number, seed: number) {
  const cell = 1 / (n * pixelRad);
  const r = rng(seed);
  const u: number[] = [];
  const v: number[] = [];
  for (let i = 0; i < count; i++) {
    u.push(Math.round((r() - 0.5) * (n / 2 - 4)) * cell);
    v.push(Math.round((r() - 0.5) * (n / 2 - 4)) * cell);
  }
  return { u, v };
}

/** Points filling an ellipse in the uv plane: semi-axis a along position angle pa, b across. */
function filledEllipse(a: number, b: number, paRad: number, steps: number) {
  const u: number[] = [];
  const v: number[] = [];
  for (let i = -steps; i <= steps; i++)
    for (let j = -steps; j <= steps; j++) {
      const x = i / steps;
      const y = j / steps;
      if (x * x + y * y > 1) continue;
      const along = x * a; // along the PA direction
      const across = y * b;
      // direction of PA (east of north) in (u east, v north): (sin pa, cos pa)
      u.push(along * Math.sin(paRad) + across * Math.cos(paRad));
      v.push(along * Math.cos(paRad) - across * Math.sin(paRad));
    }
  return { u, v };
}

describe("dirty beam by FFT", () => {
  it("equals a direct DFT of the sampling function at every pixel (points on cell centres), within 1e-6", () => {
    const n = 64;
    const pixelRad = 2e-9;
    const { u, v } = onGridPoints(n, pixelRad, 40, 1);
    for (const weighting of ["natural", "uniform", "robust"] as const) {
      const beam = dirtyBeam(u, v, { gridSize: n, pixelRad, weighting, robust: 0.5 });
      const w = Array.from(beam.weights.weight);
      let worst = 0;
      for (let y = 0; y < n; y += 3)
        for (let x = 0; x < n; x += 3) {
          const expected = dftBeamAt(u, v, w, (x - n / 2) * pixelRad, (y - n / 2) * pixelRad);
          worst = Math.max(worst, Math.abs(beam.image[y * n + x] - expected));
        }
      expect(worst).toBeLessThan(1e-6);
    }
    // The engine's own direct DFT agrees as well (used by the benchmark).
    const beam = dirtyBeam(u, v, { gridSize: n, pixelRad });
    const direct = directDirtyBeam(u, v, null, n, pixelRad);
    let worst = 0;
    for (let i = 0; i < n * n; i++) worst = Math.max(worst, Math.abs(beam.image[i] - direct[i]));
    expect(worst).toBeLessThan(1e-6);
  });

  it("peaks at exactly 1 in the centre and is point-symmetric", () => {
    const { u, v } = filledEllipse(1e8, 4e7, 0.4, 12);
    const n = 128;
    const beam = dirtyBeam(u, v, { gridSize: n });
    expect(beam.image[(n / 2) * n + n / 2]).toBeCloseTo(1, 12);
    let max = -Infinity;
    for (const x of beam.image) max = Math.max(max, x);
    expect(max).toBeCloseTo(1, 12);
    for (const [dx, dy] of [
      [3, 1],
      [-7, 12],
      [20, -5],
    ])
      expect(beam.image[(n / 2 + dy) * n + n / 2 + dx]).toBeCloseTo(beam.image[(n / 2 - dy) * n + n / 2 - dx], 12);
  });

  it("stays close to the exact (ungridded) beam near the centre for arbitrary points", () => {
    const r = rng(5);
    const u = Array.from({ length: 300 }, () => (r() - 0.5) * 2e8);
    const v = Array.from({ length: 300 }, () => (r() - 0.5) * 2e8);
    const n = 256;
    const beam = dirtyBeam(u, v, { gridSize: n });
    const w = u.map(() => 1);
    for (let dy = -4; dy <= 4; dy++)
      for (let dx = -4; dx <= 4; dx++) {
        const exact = dftBeamAt(u, v, w, dx * beam.pixelRad, dy * beam.pixelRad);
        expect(Math.abs(beam.image[(n / 2 + dy) * n + n / 2 + dx] - exact)).toBeLessThan(0.02); // gridding error
      }
  });

  it("fits the FWHM of a filled circular coverage: the Airy lobe, FWHM = 2 x½ / (2π R)", () => {
    // Beam of a uniformly filled disk of radius R (wavelengths) is 2 J1(x)/x with x = 2πRρ;
    // its half-power point x½ is found here by bisection on an independent J1.
    let lo = 1;
    let hi = 3;
    for (let i = 0; i < 50; i++) {
      const mid = 0.5 * (lo + hi);
      if (airy(mid) > 0.5) lo = mid;
      else hi = mid;
    }
    const xHalf = 0.5 * (lo + hi);
    expect(xHalf).toBeCloseTo(2.2152, 3); // 2J1(x)/x = 1/2 at x = 2.2152 (A&S Table 9.1 interpolation, from memory)
    const R = 1e8;
    const { u, v } = filledEllipse(R, R, 0, 60);
    const beam = dirtyBeam(u, v, { gridSize: 256 });
    const expected = (2 * xHalf) / (2 * Math.PI * R);
    expect(beam.fit.fwhmMajorRad as number).toBeGreaterThan(0);
    expect(Math.abs((beam.fit.fwhmMajorRad as number) / expected - 1)).toBeLessThan(0.01);
    expect(Math.abs((beam.fit.fwhmMinorRad as number) / expected - 1)).toBeLessThan(0.01);
    // Peak sidelobe: the first positive ring of 2J1(x)/x (its first ring is negative).
    let ring = 0;
    for (let x = 6; x < 11; x += 0.01) ring = Math.max(ring, airy(x));
    expect(ring).toBeCloseTo(0.0645, 3); // second extremum of the Airy amplitude, about +0.0645 (from memory)
    expect(beam.fit.peakSidelobe).toBeCloseTo(ring, 2);
  });

  it("fits an elliptical coverage: major axis across the long uv axis, at the right position angle", () => {
    const R = 1e8;
    const paUv = (120 * Math.PI) / 180; // long uv axis at PA 120°
    const { u, v } = filledEllipse(2 * R, R, paUv, 60);
    const beam = dirtyBeam(u, v, { gridSize: 256 });
    // Affine stretch of the Airy lobe: FWHM 2x½/(2π·2R) along PA 120°, 2x½/(2πR) along PA 30°.
    const xHalf = 2.21535; // from the previous test's bisection
    expect(Math.abs((beam.fit.fwhmMajorRad as number) / (xHalf / (Math.PI * R)) - 1)).toBeLessThan(0.01);
    expect(Math.abs((beam.fit.fwhmMinorRad as number) / (xHalf / (Math.PI * 2 * R)) - 1)).toBeLessThan(0.01);
    expect(((beam.fit.positionAngleRad as number) * 180) / Math.PI).toBeCloseTo(30, 0);
  });

  it("gives null FWHM for a single baseline (an endless fringe ridge)", () => {
    const beam = dirtyBeam([1e8], [0], { gridSize: 64 });
    expect(beam.fit.fwhmMajorRad).toBeNull();
    expect(beam.fit.peakSidelobe).toBeGreaterThan(0.99); // the next fringe is as high as the centre
  });
});

describe("weighting", () => {
  it("uniform weighting gives every occupied cell the same weight", () => {
    const n = 64;
    const pixelRad = 2e-9;
    const { u, v } = onGridPoints(n, pixelRad, 30, 2);
    // Duplicate the first ten points three times: natural weighting changes, uniform must not.
    const u2 = [...u, ...u.slice(0, 10), ...u.slice(0, 10), ...u.slice(0, 10)];
    const v2 = [...v, ...v.slice(0, 10), ...v.slice(0, 10), ...v.slice(0, 10)];
    const a = dirtyBeam(u, v, { gridSize: n, pixelRad, weighting: "uniform" });
    const b = dirtyBeam(u2, v2, { gridSize: n, pixelRad, weighting: "uniform" });
    const c = dirtyBeam(u2, v2, { gridSize: n, pixelRad, weighting: "natural" });
    let dUniform = 0;
    let dNatural = 0;
    for (let i = 0; i < n * n; i++) {
      dUniform = Math.max(dUniform, Math.abs(a.image[i] - b.image[i]));
      dNatural = Math.max(dNatural, Math.abs(a.image[i] - c.image[i]));
    }
    expect(dUniform).toBeLessThan(1e-12);
    expect(dNatural).toBeGreaterThan(1e-3);
  });

  it("robust weighting goes from near uniform (R = −2) to near natural (R = +2)", () => {
    // Briggs (1995) robust weighting: limits are common practice.
    const r = rng(9);
    const u: number[] = [];
    const v: number[] = [];
    for (let i = 0; i < 2000; i++) {
      const rad = 1e8 * r() ** 3; // strongly centrally concentrated density
      const a = r() * 2 * Math.PI;
      u.push(rad * Math.cos(a));
      v.push(rad * Math.sin(a));
    }
    const n = 128;
    const pixelRad = 1e-9;
    const w = (weighting: "natural" | "uniform" | "robust", robust = 0) =>
      weightPoints(u, v, n, pixelRad, weighting, robust).weight;
    const nat = w("natural");
    const uni = w("uniform");
    const dist = (a: Float64Array, b: Float64Array) => {
      // compare normalized weight distributions
      const sa = a.reduce((s, x) => s + x, 0);
      const sb = b.reduce((s, x) => s + x, 0);
      let d = 0;
      for (let i = 0; i < a.length; i++) d += Math.abs(a[i] / sa - b[i] / sb);
      return d;
    };
    const rPlus = w("robust", 2);
    const rMinus = w("robust", -2);
    expect(dist(rPlus, nat)).toBeLessThan(0.1 * dist(uni, nat));
    expect(dist(rMinus, uni)).toBeLessThan(0.1 * dist(uni, nat));
  });
});

describe("dirty image of a model", () => {
  it("images a point at the phase centre as the beam and an offset point shifted east/north", () => {
    const n = 64;
    const pixelRad = 2e-9;
    const { u, v } = onGridPoints(n, pixelRad, 60, 4);
    const beam = dirtyBeam(u, v, { gridSize: n, pixelRad });
    const ones = u.map(() => 1);
    const zeros = u.map(() => 0);
    const centred = dirtyImage(beam.weights, ones, zeros);
    for (let i = 0; i < n * n; i++) expect(centred.image[i]).toBeCloseTo(beam.image[i], 12);
    // Point 3 pixels east and 5 north: V = exp(−2πi(u α + v δ)) (sign convention of the models).
    const a = 3 * pixelRad;
    const d = 5 * pixelRad;
    const re = u.map((uu, p) => Math.cos(-2 * Math.PI * (uu * a + v[p] * d)));
    const im = u.map((uu, p) => Math.sin(-2 * Math.PI * (uu * a + v[p] * d)));
    const shifted = dirtyImage(beam.weights, re, im);
    let best = -Infinity;
    let at = -1;
    shifted.image.forEach((x, i) => {
      if (x > best) {
        best = x;
        at = i;
      }
    });
    expect(at % n).toBe(n / 2 + 3); // column index grows toward east
    expect(Math.floor(at / n)).toBe(n / 2 + 5); // row index grows toward north
    expect(best).toBeCloseTo(1, 10);
    // Everywhere: the beam shifted by (3, 5) pixels (periodic grid).
    for (let y = 0; y < n; y += 5)
      for (let x = 0; x < n; x += 5)
        expect(shifted.image[y * n + x]).toBeCloseTo(beam.image[((y - 5 + n) % n) * n + ((x - 3 + n) % n)], 10);
  });
});
