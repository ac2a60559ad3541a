import { describe, expect, it } from "vitest";
import { DEMO_CONFIGURATIONS, DEMO_SITE, DEMO_STATIONS } from "~/db/seed/scenario";
import { computeCoverage, parseCoverageRequest } from "~/engine";

/**
 * Issue 10 and PRODUCT.md: with the demo array's delay-line stroke and the stations' fixed path offsets,
 * every offered configuration observes a target near the zenith for at least 4 h around transit.
 */
const STEP_H = 0.01;

function observableHourAngles(configuration: string, decDeg: number) {
  const byName = new Map(DEMO_STATIONS.map((s) => [s.name, s]));
  const config = DEMO_CONFIGURATIONS.find((c) => c.name === configuration)!;
  const hourAnglesH = Array.from({ length: 1201 }, (_, i) => Math.round((-6 + i * STEP_H) * 100) / 100);
  const parsed = parseCoverageRequest({
    site: { latitudeDeg: DEMO_SITE.latitudeDeg, longitudeDeg: DEMO_SITE.longitudeDeg, altitudeM: DEMO_SITE.altitudeM },
    stations: config.stations.map((n) => ({ ...byName.get(n)!, name: n })),
    target: { raDeg: 120, decDeg, model: { type: "point" } },
    wavelengthsM: [1.65e-6],
    hourAnglesH,
    minElevationDeg: DEMO_SITE.minElevationDeg,
    delayLineStrokeM: DEMO_SITE.delayLineStrokeM,
  });
  if (!parsed.ok) throw new Error(parsed.message);
  return computeCoverage(parsed.value).samples;
}

/** The contiguous observable window around transit (H = 0), hours. */
function windowAroundTransit(samples: { hourAngleH: number; observable: boolean }[]) {
  const at0 = samples.findIndex((s) => s.hourAngleH === 0);
  if (!samples[at0].observable) return null;
  let a = at0;
  let b = at0;
  while (a > 0 && samples[a - 1].observable) a--;
  while (b < samples.length - 1 && samples[b + 1].observable) b++;
  return { fromH: samples[a].hourAngleH, toH: samples[b].hourAngleH };
}

describe("the demo array's delay lines", () => {
  it("has a stroke of 200 m", () => {
    expect(DEMO_SITE.delayLineStrokeM).toBe(200);
  });

  // A target through the zenith: δ = φ = −31.4°. At H = 0 it culminates at 90°, so the elevation limit of 30°
  // (reached near |H| ≈ 4.8 h for this δ, sin e = sin φ sin δ + cos φ cos δ cos H, common practice) is not what
  // limits the window; the delay lines are.
  for (const c of DEMO_CONFIGURATIONS) {
    it(`lets ${c.name} observe a zenith target for ≥ 4 h around transit`, () => {
      const w = windowAroundTransit(observableHourAngles(c.name, DEMO_SITE.latitudeDeg));
      expect(w).not.toBeNull();
      expect(w!.toH - w!.fromH).toBeGreaterThanOrEqual(4);
      expect(w!.fromH).toBeLessThanOrEqual(-2);
      expect(w!.toH).toBeGreaterThanOrEqual(2);
    });
  }

  it("gives extended-6, the longest, a window from about −2.3 h to +2.1 h", () => {
    // Measured here in 0.01 h steps (the engine's own observability rules, as `coverage` applies them):
    // −2.31 h to +2.12 h; at 15-minute steps the same window reads −2.25 h to +2.00 h.
    const w = windowAroundTransit(observableHourAngles("extended-6", DEMO_SITE.latitudeDeg))!;
    expect(w.fromH).toBeCloseTo(-2.31, 1);
    expect(w.toH).toBeCloseTo(2.12, 1);
    // Shorter configurations are limited by the 30° elevation limit (≈ ±4.8 h), not by the delay lines.
    const compact = windowAroundTransit(observableHourAngles("compact-3", DEMO_SITE.latitudeDeg))!;
    expect(compact.toH).toBeGreaterThan(4.7);
  });
});
