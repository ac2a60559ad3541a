import { demoSite } from "@test/demo-array";
import { describe, expect, it } from "vitest";
import { parseTrianglesRequest, rankTriangles } from "~/engine";

const STATIONS = [
  { name: "C01", eastM: 0, northM: 0, upM: 0, pathOffsetM: 0 },
  { name: "C02", eastM: 16, northM: 0, upM: 0, pathOffsetM: 0 },
  { name: "C05", eastM: 8, northM: 13.86, upM: 0, pathOffsetM: 0 },
  { name: "W1", eastM: -180, northM: 60, upM: 1.2, pathOffsetM: 0 },
  { name: "E2", eastM: 150, northM: -90, upM: -0.8, pathOffsetM: 0 },
];

function run(extra: Record<string, unknown> = {}) {
  const parsed = parseTrianglesRequest({
    site: demoSite(),
    stations: STATIONS,
    target: {
      raDeg: 84.05,
      decDeg: -1.2,
      model: { type: "binary", separationMas: 3, positionAngleDeg: 40, fluxRatio: 0.5 },
    },
    wavelengthsM: [1.65e-6],
    hourAnglesH: [-3, -2, -1, 0, 1, 2, 3],
    minElevationDeg: 30,
    delayLineStrokeM: null,
    ...extra,
  });
  if (!parsed.ok) throw new Error(parsed.message);
  return rankTriangles(parsed.value);
}

describe("triangle ranking", () => {
  it("lists every triangle with the counts of Monnier (2003)", () => {
    const out = run();
    expect(out.triangleCount).toBe(10); // N(N−1)(N−2)/6 for N = 5
    expect(out.independentClosurePhases).toBe(6); // (N−1)(N−2)/2, Monnier 2003
    expect(out.triangles).toHaveLength(10);
    expect(out.triangles.map((t) => t.rank)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10]);
    const scores = out.triangles.map((t) => t.score);
    expect([...scores].sort((a, b) => b - a)).toEqual(scores);
  });

  it("prefers long triangles for a small binary and says so", () => {
    // A 3 mas binary gives ~0.1 rad of phase on 16 m at 1.65 µm but several radians on
    // 200–300 m baselines, so the compact core triangle carries almost no closure signal.
    const out = run();
    const core = out.triangles.find((t) => t.stations.join() === "C01,C02,C05");
    expect(core).toBeDefined();
    expect(out.triangles[0].stations.some((n) => n === "W1" || n === "E2")).toBe(true); // uses an outrigger
    expect(out.triangles[0].closurePhaseSignalDeg).toBeGreaterThan(10 * (core?.closurePhaseSignalDeg ?? 0));
    expect(core?.rank).toBe(10);
    expect(out.triangles[0].reasons.join(" ")).toContain("closure-phase signal");
    expect(out.triangles[0].observableHours).toBeCloseTo(7, 6); // 7 samples × 1 h spacing
  });

  it("says 0°/180° for a centro-symmetric model", () => {
    const out = run({ target: { raDeg: 84.05, decDeg: -1.2, model: { type: "uniformDisk", diameterMas: 2 } } });
    const reasons = out.triangles.flatMap((t) => t.reasons).join(" ");
    expect(reasons).toMatch(/no closure-phase signal|only 0° or 180°/);
    expect(reasons).not.toContain("rms (strongest");
  });

  it("ranks a triangle that the delay lines never allow last, with the reason", () => {
    const stations = STATIONS.map((s) => (s.name === "E2" ? { ...s, pathOffsetM: 400 } : s));
    const out = run({ stations, delayLineStrokeM: 100 });
    const withE2 = out.triangles.filter((t) => t.stations.includes("E2"));
    expect(withE2).toHaveLength(6);
    for (const t of withE2) {
      expect(t.score).toBe(0);
      expect(t.observableHours).toBe(0);
      expect(t.reasons[0]).toContain("never observable: a baseline of this triangle is beyond the delay-line stroke");
      expect(t.rank).toBeGreaterThan(4);
    }
  });

  it("returns at most maxTriangles", () => {
    expect(run({ maxTriangles: 3 }).triangles).toHaveLength(3);
  });
});
