import { binaryTarget, demoSite, demoStations } from "@test/demo-array";
import { describe, expect, it } from "vitest";
import { computeCoverage, parseCoverageRequest, parseSimulateRequest, simulateData, simulateResponse } from "~/engine";

const base = {
  site: demoSite(),
  stations: demoStations("C01", "C02", "W1", "N2", "E3"),
  target: binaryTarget("Test binary"),
  wavelengthsM: [1.6e-6, 1.8e-6, 2.0e-6],
  hourAnglesH: [-4, -3, -2, -1, 0, 1, 2, 3, 4],
  minElevationDeg: 30,
  delayLineStrokeM: null,
};

function simulate(extra: Record<string, unknown> = {}) {
  const parsed = parseSimulateRequest({ ...base, ...extra });
  if (!parsed.ok) throw new Error(parsed.message);
  return {
    request: parsed.value,
    data: simulateData(parsed.value),
    response: simulateResponse(simulateData(parsed.value)),
  };
}

const noiseFree = { noise: { vis2Relative: 0, closurePhaseDeg: 0, seed: 1 } };

describe("simulate", () => {
  it("lists every observable sample and channel of every baseline and triangle", () => {
    const cov = computeCoverage(parseCoverageRequestOrThrow());
    const observable = cov.samples.filter((s) => s.observable).length;
    const { response } = simulate();
    const nB = (5 * 4) / 2;
    expect(response.vis2).toHaveLength(nB * observable * 3);
    // N(N−1)(N−2)/6 triangles in all, (N−1)(N−2)/2 independent ones (Monnier 2003, Rep. Prog. Phys. 66, 789).
    expect(response.closurePhases).toHaveLength(10 * observable * 3);
    expect(response.closurePhaseTriangles).toBe("all");
    const indep = simulate({ closurePhaseTriangles: "independent" }).response;
    expect(indep.closurePhases).toHaveLength(6 * observable * 3);
    expect(indep.closurePhaseTriangles).toBe("independent");
    expect(new Set(indep.closurePhases.map((c) => c.stations[0]))).toEqual(new Set(["C01"]));
    expect(Object.keys(response.vis2[0]).sort()).toEqual(
      ["hourAngleH", "stations", "uM", "vM", "vis2", "vis2Err", "wavelengthM"].sort(),
    );
    expect(Object.keys(response.closurePhases[0]).sort()).toEqual(
      [
        "closurePhaseDeg",
        "closurePhaseErrDeg",
        "hourAngleH",
        "stations",
        "u1M",
        "u2M",
        "v1M",
        "v2M",
        "wavelengthM",
      ].sort(),
    );
  });

  it("gives the coverage's model values when the noise is zero", () => {
    const cov = computeCoverage(parseCoverageRequestOrThrow());
    const { response } = simulate(noiseFree);
    for (const e of response.vis2) {
      expect(e.vis2Err).toBe(0);
      const b = cov.baselines.find((x) => x.stations[0] === e.stations[0] && x.stations[1] === e.stations[1])!;
      const p = b.points.find((x) => x.hourAngleH === e.hourAngleH)!;
      expect(e.uM).toBe(p.uM);
      expect(e.vis2).toBeCloseTo(p.vis2[cov.wavelengthsM.indexOf(e.wavelengthM)], 9);
    }
    for (const e of response.closurePhases) {
      const t = cov.closurePhases.find((x) => x.stations.join() === e.stations.join())!;
      const p = t.points.find((x) => x.hourAngleH === e.hourAngleH)!;
      expect(e.closurePhaseDeg).toBeCloseTo(p.closurePhaseDeg[cov.wavelengthsM.indexOf(e.wavelengthM)], 5);
    }
  });

  it("gives u1/v1 the baseline a–b and u2/v2 the baseline b–c, as OI_T3 defines them", () => {
    const { response } = simulate(noiseFree);
    const uv = (a: string, b: string, ha: number) =>
      response.vis2.find((e) => e.stations[0] === a && e.stations[1] === b && e.hourAngleH === ha)!;
    for (const e of response.closurePhases.slice(0, 60)) {
      const [a, b, c] = e.stations;
      expect([e.u1M, e.v1M]).toEqual([uv(a, b, e.hourAngleH).uM, uv(a, b, e.hourAngleH).vM]);
      expect([e.u2M, e.v2M]).toEqual([uv(b, c, e.hourAngleH).uM, uv(b, c, e.hourAngleH).vM]);
    }
  });

  it("matches an independent closure phase of the binary written here", () => {
    // Binary (primary at the centre, secondary at ρ, PA east of north, flux ratio f):
    // V = (1 + f e^{−2πi(u Δα + v Δδ)}) / (1 + f); CP = arg V(u1) + arg V(u2) − arg V(u1 + u2).
    const mas = Math.PI / 180 / 3600 / 1000;
    const rho = 3 * mas;
    const pa = (40 * Math.PI) / 180;
    const f = 0.5;
    const arg = (u: number, v: number) => {
      const phi = -2 * Math.PI * (u * rho * Math.sin(pa) + v * rho * Math.cos(pa));
      return Math.atan2(f * Math.sin(phi), 1 + f * Math.cos(phi));
    };
    const { response } = simulate(noiseFree);
    for (const e of response.closurePhases) {
      const l = e.wavelengthM;
      let cp = arg(e.u1M / l, e.v1M / l) + arg(e.u2M / l, e.v2M / l) - arg((e.u1M + e.u2M) / l, (e.v1M + e.v2M) / l);
      cp = (((cp * 180) / Math.PI + 540) % 360) - 180;
      const d = Math.abs(((e.closurePhaseDeg - cp + 540) % 360) - 180);
      expect(d).toBeLessThan(1e-5);
    }
  });

  it("adds Gaussian errors of the contract's size", () => {
    const truth = simulate(noiseFree).response;
    const noisy = simulate({ noise: { vis2Relative: 0.05, closurePhaseDeg: 2, seed: 11 } }).response;
    let s = 0;
    let s2 = 0;
    noisy.vis2.forEach((e, i) => {
      const t = truth.vis2[i].vis2;
      // σ(V²) = vis2Relative × max(V², 0.01) (the simulate contract)
      expect(e.vis2Err).toBeCloseTo(0.05 * Math.max(t, 0.01), 9);
      const z = (e.vis2 - t) / e.vis2Err;
      s += z;
      s2 += z * z;
    });
    const n = noisy.vis2.length;
    // 405 normalized residuals: mean within 4/√n, variance within 4·√(2/n) of 1 (sampling tolerance).
    expect(Math.abs(s / n)).toBeLessThan(4 / Math.sqrt(n));
    expect(Math.abs(s2 / n - 1)).toBeLessThan(4 * Math.sqrt(2 / n));
    let c2 = 0;
    noisy.closurePhases.forEach((e, i) => {
      expect(e.closurePhaseErrDeg).toBe(2);
      expect(e.closurePhaseDeg).toBeGreaterThan(-180);
      expect(e.closurePhaseDeg).toBeLessThanOrEqual(180);
      const d = (((e.closurePhaseDeg - truth.closurePhases[i].closurePhaseDeg + 540) % 360) - 180) / 2;
      c2 += d * d;
    });
    const m = noisy.closurePhases.length;
    expect(Math.abs(c2 / m - 1)).toBeLessThan(4 * Math.sqrt(2 / m));
  });

  it("is reproducible from the seed, and the independent set repeats the values of the full set", () => {
    const a = simulate({ noise: { seed: 5 } }).response;
    const b = simulate({ noise: { seed: 5 } }).response;
    const c = simulate({ noise: { seed: 6 } }).response;
    expect(a).toEqual(b);
    expect(a.vis2.map((e) => e.vis2)).not.toEqual(c.vis2.map((e) => e.vis2));
    const indep = simulate({ noise: { seed: 5 }, closurePhaseTriangles: "independent" }).response;
    for (const e of indep.closurePhases) {
      const same = a.closurePhases.find(
        (x) =>
          x.stations.join() === e.stations.join() && x.hourAngleH === e.hourAngleH && x.wavelengthM === e.wavelengthM,
      )!;
      expect(e.closurePhaseDeg).toBe(same.closurePhaseDeg);
    }
    expect(a.noise).toEqual({ vis2Relative: 0.05, closurePhaseDeg: 2, seed: 5 });
  });

  it("has real instants when a night is sampled and nominal ones for an hour-angle list", () => {
    expect(simulate().response.nominalTimes).toBe(true);
    const night = simulate({ hourAnglesH: undefined, night: { date: "2027-01-10", stepMin: 30 } });
    expect(night.response.nominalTimes).toBe(false);
    expect(night.response.firstSampleUtc?.startsWith("2027-01-1")).toBe(true);
    expect(night.response.vis2.length).toBeGreaterThan(0);
  });

  it("refuses requests whose response would be too large, naming the field", () => {
    const r = parseSimulateRequest({ ...base, hourAnglesH: Array.from({ length: 5000 }, (_, i) => -6 + i * 0.0024) });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(/^wavelengthsM: request too large/);
    const bad = parseSimulateRequest({ ...base, noise: { vis2Relative: -1 } });
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.message).toBe("noise.vis2Relative: must be between 0 and 10");
  });
});

function parseCoverageRequestOrThrow() {
  const p = parseCoverageRequest({ ...base, beam: null });
  if (!p.ok) throw new Error(p.message);
  return p.value;
}
