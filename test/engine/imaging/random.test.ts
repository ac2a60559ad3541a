import { describe, expect, it } from "vitest";
import { Mt19937 } from "~/engine";

describe("Mersenne Twister MT19937", () => {
  it("matches the published check values", () => {
    const g = new Mt19937(5489);
    // First output for the default seed 5489: 3499211612 (Matsumoto & Nishimura's init_genrand; from memory,
    // widely quoted). The 10 000th output of a default-seeded mt19937 is 4123659995 (ISO/IEC 14882:2011
    // §26.5.5 [rand.predef], the C++ standard's required behaviour).
    expect(g.nextUint32()).toBe(3499211612);
    let last = 0;
    for (let i = 2; i <= 10_000; i++) last = g.nextUint32();
    expect(last).toBe(4123659995);
  });

  it("builds 53-bit doubles from two words as genrand_res53 does", () => {
    const a = new Mt19937(42);
    const b = new Mt19937(42);
    for (let i = 0; i < 100; i++) {
      const hi = b.nextUint32() >>> 5;
      const lo = b.nextUint32() >>> 6;
      // (a·2^26 + b) / 2^53, the authors' genrand_res53
      expect(a.nextDouble()).toBe((hi * 67108864 + lo) / 9007199254740992);
    }
  });

  it("draws Box–Muller pairs from the uniform stream", () => {
    const g = new Mt19937(7);
    const u = new Mt19937(7);
    for (let i = 0; i < 50; i++) {
      const u1 = 1 - u.nextDouble();
      const u2 = u.nextDouble();
      const r = Math.sqrt(-2 * Math.log(u1));
      // Box & Muller (1958): z1 = √(−2 ln u1) cos 2πu2, z2 = √(−2 ln u1) sin 2πu2
      expect(g.nextGaussian()).toBeCloseTo(r * Math.cos(2 * Math.PI * u2), 14);
      expect(g.nextGaussian()).toBeCloseTo(r * Math.sin(2 * Math.PI * u2), 14);
    }
  });

  it("gives standard normal deviates", () => {
    const g = new Mt19937(1);
    const n = 200_000;
    let s = 0;
    let s2 = 0;
    let within1 = 0;
    let within2 = 0;
    for (let i = 0; i < n; i++) {
      const z = g.nextGaussian();
      s += z;
      s2 += z * z;
      if (Math.abs(z) < 1) within1++;
      if (Math.abs(z) < 2) within2++;
    }
    const mean = s / n;
    const variance = s2 / n - mean * mean;
    // Sampling tolerances: 5 standard errors (σ/√n ≈ 0.0022 for the mean, √(2/n) ≈ 0.0032 for the variance).
    expect(Math.abs(mean)).toBeLessThan(0.012);
    expect(Math.abs(variance - 1)).toBeLessThan(0.016);
    // Normal probabilities of |z| < 1 and < 2: 0.682689 and 0.954500 (Abramowitz & Stegun Table 26.1).
    expect(Math.abs(within1 / n - 0.682689)).toBeLessThan(0.006);
    expect(Math.abs(within2 / n - 0.9545)).toBeLessThan(0.003);
  });

  it("repeats itself for the same seed and differs for another", () => {
    const a = new Mt19937(123);
    const b = new Mt19937(123);
    const c = new Mt19937(124);
    const xa = Array.from({ length: 20 }, () => a.nextGaussian());
    const xb = Array.from({ length: 20 }, () => b.nextGaussian());
    const xc = Array.from({ length: 20 }, () => c.nextGaussian());
    expect(xa).toEqual(xb);
    expect(xa).not.toEqual(xc);
  });
});
