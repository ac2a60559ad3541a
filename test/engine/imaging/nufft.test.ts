import { rng } from "@test/random";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { besselI0, ImageTransform, KaiserBessel, kaiserBesselBeta } from "~/engine";

/** Direct DFT written here: V(u, v) = Σ I[y, x] exp(−2πi (u (x − c)Δ + v (y − c)Δ)), c = ⌊N/2⌋. */
function directDft(image: Float64Array, n: number, pixel: number, u: number, v: number) {
  const c = Math.floor(n / 2);
  let re = 0;
  let im = 0;
  for (let y = 0; y < n; y++)
    for (let x = 0; x < n; x++) {
      const ph = -2 * Math.PI * (u * (x - c) * pixel + v * (y - c) * pixel);
      re += image[y * n + x] * Math.cos(ph);
      im += image[y * n + x] * Math.sin(ph);
    }
  return { re, im };
}

const PIXEL = 0.25 * 4.848e-9; // 0.25 mas
/** Points over twice the Nyquist range in u and v, both signs (the transform folds them). */
function points(count: number, seed: number) {
  const r = rng(seed);
  const u = new Float64Array(count);
  const v = new Float64Array(count);
  for (let i = 0; i < count; i++) {
    u[i] = ((r() - 0.5) * 2) / PIXEL;
    v[i] = ((r() - 0.5) * 2) / PIXEL;
  }
  return { u, v };
}

describe("Kaiser–Bessel kernel", () => {
  it("computes I0 as its integral representation (Abramowitz & Stegun 9.6.16)", () => {
    for (const x of [0, 0.5, 1, 5, 12, 20]) {
      // I0(x) = (1/π) ∫_0^π e^{x cos t} dt, Simpson's rule with 2000 intervals
      const m = 2000;
      let s = 0;
      for (let i = 0; i <= m; i++)
        s += Math.exp(x * Math.cos((Math.PI * i) / m)) * (i === 0 || i === m ? 1 : i % 2 ? 4 : 2);
      expect(besselI0(x) / ((s * (Math.PI / m)) / 3 / Math.PI) - 1).toBeLessThan(1e-12);
    }
    expect(besselI0(1)).toBeCloseTo(1.2660658777520082, 14); // from memory (A&S Table 9.8: e^{-1} I0(1) = 0.4657596)
  });

  it("has the Fourier transform of Jackson et al. (1991) eq. 6", () => {
    const w = 8;
    const k = new KaiserBessel(w, kaiserBesselBeta(w, 2));
    for (const xi of [0, 0.05, 0.125, 0.25, 0.5, 0.9]) {
      // ∫ φ(s) e^{−2πi s ξ} ds over |s| ≤ W/2 by Simpson's rule (φ is even: a cosine transform)
      const m = 4000;
      let s = 0;
      for (let i = 0; i <= m; i++) {
        const x = -w / 2 + (w * i) / m;
        s += k.value(x) * Math.cos(2 * Math.PI * x * xi) * (i === 0 || i === m ? 1 : i % 2 ? 4 : 2);
      }
      expect(k.transform(xi)).toBeCloseTo((s * w) / m / 3, 9);
    }
  });
});

describe("non-uniform FFT", () => {
  it("matches a direct DFT to 1e-6 for images of unit flux, on grids of any size", () => {
    for (const n of [32, 48, 64]) {
      const r = rng(n);
      const img = new Float64Array(n * n);
      let s = 0;
      for (let i = 0; i < img.length; i++) s += img[i] = r() ** 4;
      for (let i = 0; i < img.length; i++) img[i] /= s;
      const { u, v } = points(120, n + 1);
      const t = new ImageTransform(n, PIXEL, u, v);
      const re = new Float64Array(u.length);
      const im = new Float64Array(u.length);
      t.forward(img, re, im);
      for (let p = 0; p < u.length; p++) {
        const d = directDft(img, n, PIXEL, u[p], v[p]);
        expect(Math.hypot(re[p] - d.re, im[p] - d.im)).toBeLessThan(1e-6);
      }
    }
  });

  it("stays within 1e-6 for a point source anywhere, even at the field's corners (the worst case)", () => {
    const n = 64;
    const { u, v } = points(150, 3);
    const t = new ImageTransform(n, PIXEL, u, v);
    const re = new Float64Array(u.length);
    const im = new Float64Array(u.length);
    for (const [x, y] of [
      [0, 0],
      [n - 1, 0],
      [0, n - 1],
      [n - 1, n - 1],
      [32, 32],
      [40, 7],
    ]) {
      const img = new Float64Array(n * n);
      img[y * n + x] = 1;
      t.forward(img, re, im);
      for (let p = 0; p < u.length; p++) {
        const d = directDft(img, n, PIXEL, u[p], v[p]);
        expect(Math.hypot(re[p] - d.re, im[p] - d.im)).toBeLessThan(1e-6);
      }
    }
  });

  it("has an exact adjoint: ⟨A x, g⟩ = ⟨x, Aᴴ g⟩ (real inner products)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 32, max: 40 }), fc.integer({ min: 1, max: 1000 }), (n, seed) => {
        const r = rng(seed);
        const { u, v } = points(40, seed);
        const t = new ImageTransform(n, PIXEL, u, v);
        const x = Float64Array.from({ length: n * n }, () => r() - 0.3);
        const gr = Float64Array.from({ length: u.length }, () => r() - 0.5);
        const gi = Float64Array.from({ length: u.length }, () => r() - 0.5);
        const re = new Float64Array(u.length);
        const im = new Float64Array(u.length);
        t.forward(x, re, im);
        const out = new Float64Array(n * n);
        t.adjoint(gr, gi, out);
        let lhs = 0;
        for (let p = 0; p < u.length; p++) lhs += re[p] * gr[p] + im[p] * gi[p];
        let rhs = 0;
        for (let i = 0; i < x.length; i++) rhs += x[i] * out[i];
        expect(Math.abs(lhs - rhs)).toBeLessThan(1e-11 * (1 + Math.abs(lhs)));
      }),
      { numRuns: 12 },
    );
  });

  it("gives the same result with the generic (width 7) kernel loop within its accuracy", () => {
    const n = 32;
    const { u, v } = points(60, 9);
    const img = new Float64Array(n * n).fill(1 / (n * n));
    img[5 * n + 9] += 0.3;
    const a = new ImageTransform(n, PIXEL, u, v);
    const b = new ImageTransform(n, PIXEL, u, v, { width: 7 });
    const ra = new Float64Array(u.length);
    const ia = new Float64Array(u.length);
    const rb = new Float64Array(u.length);
    const ib = new Float64Array(u.length);
    a.forward(img, ra, ia);
    b.forward(img, rb, ib);
    for (let p = 0; p < u.length; p++) expect(Math.hypot(ra[p] - rb[p], ia[p] - ib[p])).toBeLessThan(1e-5);
  });
});
