import { describe, expect, it } from "vitest";
import { DEMO_CONFIGURATIONS, DEMO_INSTRUMENTS, DEMO_SITE, DEMO_STATIONS } from "~/db/seed/scenario";
import { channelWavelengthsM } from "~/engine";
import {
  computeFeasibility,
  cycleNights,
  FEASIBILITY_THRESHOLDS,
  type FeasibilityInput,
  type FeasibilityTarget,
  magnitudeLine,
  modelSizeMas,
  visibilityLine,
  worstVerdict,
} from "~/services/proposals/feasibility";

/** The band's channels, as the feasibility report samples them. */
const bandWavelengthsM = (b: { centralWavelengthM: number; bandwidthM: number; channels: number }) =>
  channelWavelengthsM(b.centralWavelengthM, b.bandwidthM, b.channels);

const MAS = Math.PI / (180 * 3600 * 1000);

/** J1 by its power series Σ (−1)^k (x/2)^(2k+1) / (k! (k+1)!) — written here, independent of the engine. */
function besselJ1Series(x: number): number {
  let term = x / 2;
  let sum = term;
  for (let k = 1; k < 60; k++) {
    term *= -((x / 2) ** 2) / (k * (k + 1));
    sum += term;
  }
  return sum;
}
/** Uniform disk: V = 2 J1(x)/x with x = π θ B/λ (the CONVENTIONS.md model table). */
const udVis2 = (thetaMas: number, baselineM: number, wavelengthM: number) => {
  const x = (Math.PI * thetaMas * MAS * baselineM) / wavelengthM;
  return x === 0 ? 1 : ((2 * besselJ1Series(x)) / x) ** 2;
};

const stationsOf = (name: string) => {
  const config = DEMO_CONFIGURATIONS.find((c) => c.name === name)!;
  return { name, stations: config.stations.map((s) => DEMO_STATIONS.find((d) => d.name === s)!) };
};
const brasa = DEMO_INSTRUMENTS.find((i) => i.name === "Brasa")!;
const ascua = DEMO_INSTRUMENTS.find((i) => i.name === "Ascua")!;
const H = { instrumentName: "Brasa", maxTelescopes: brasa.maxTelescopes, ...brasa.bands.find((b) => b.name === "H")! };
const N = { instrumentName: "Ascua", maxTelescopes: ascua.maxTelescopes, ...ascua.bands[0] };

const target = (over: Partial<FeasibilityTarget>): FeasibilityTarget => ({
  name: "Test star",
  raDeg: 150,
  decDeg: -40,
  model: { type: "point" },
  magnitudes: { H: 3 },
  minElevationDeg: null,
  timeWindows: [],
  ...over,
});

const input = (over: Partial<FeasibilityInput>): FeasibilityInput => ({
  site: DEMO_SITE,
  cycle: { name: "2027A", observingStart: "2027-03-01", observingEnd: "2027-08-31" },
  band: H,
  configurations: [stationsOf("compact-3")],
  targets: [target({})],
  ...over,
});

/** The report of one target with the extended-6 configuration in the H band. */
const onExtended = (over: Partial<FeasibilityTarget>) =>
  computeFeasibility(input({ configurations: [stationsOf("extended-6")], targets: [target(over)] }));

const line = (cell: { lines: { check: string; verdict: string; reason: string }[] }, check: string) =>
  cell.lines.find((l) => l.check === check)!;

describe("feasibility report against published checks", () => {
  it("first null of a uniform disk at B = 1.2197 λ/θ (Abramowitz & Stegun Table 9.5: first zero of J1 = 3.8317)", () => {
    // The test's own J1 agrees with the tabulated zero, so it can serve as the independent reference.
    expect(besselJ1Series(3.8317)).toBeCloseTo(0, 4);
    const theta = 3; // mas
    const lambda = 1.65e-6;
    const nullB = (3.8317 / Math.PI) * (lambda / (theta * MAS));
    expect(nullB / (lambda / (theta * MAS))).toBeCloseTo(1.2197, 4);
    expect(udVis2(theta, nullB, lambda)).toBeLessThan(1e-8);
  });

  it("3 mas uniform disk on the 28–42 m compact configuration at H is only partly resolved: caution", () => {
    const report = computeFeasibility(
      input({
        targets: [target({ name: "Disk 3 mas", model: { type: "uniformDisk", diameterMas: 3 }, magnitudes: { H: 3 } })],
      }),
      new Date("2026-12-01T00:00:00Z"),
    );
    const cell = report.cells[0];
    const f = cell.figures;
    // λ/(2 B_max) at the central wavelength, in mas (the resolution element the line compares with).
    expect(f.resolutionMas!).toBeCloseTo(1.65e-6 / (2 * f.longestBaselineM!) / MAS, 2);
    expect(f.resolutionMas!).toBeGreaterThan(3);
    expect(line(cell, "resolution").verdict).toBe("caution");
    // V² range from the uniform-disk formula with the test's own J1: highest at the shortest
    // projected baseline and longest channel, lowest at the longest baseline and shortest channel.
    const channels = bandWavelengthsM(H);
    const lMin = Math.min(...channels);
    const lMax = Math.max(...channels);
    expect(f.vis2Max!).toBeCloseTo(udVis2(3, f.shortestBaselineM!, lMax), 3);
    expect(f.vis2Min!).toBeCloseTo(udVis2(3, f.longestBaselineM!, lMin), 3);
    // About 0.6–0.7 at 42 m: resolved enough to pass the visibility line, not "too resolved".
    expect(f.vis2Min!).toBeGreaterThan(0.5);
    expect(f.vis2Min!).toBeLessThan(FEASIBILITY_THRESHOLDS.unresolvedVis2);
    expect(line(cell, "visibility").verdict).toBe("pass");
    expect(cell.verdict).toBe("caution");
  });

  it("a 10 mas disk on the 137–456 m extended configuration is too resolved: fail", () => {
    // First null at 1.2197 λ/θ = 41.5 m for 10 mas at 1.65 µm (A&S Table 9.5); every extended
    // baseline lies beyond it, where the Airy pattern's rings stay below 1.75 % (from memory).
    const report = onExtended({ model: { type: "uniformDisk", diameterMas: 10 } });
    const v = line(report.cells[0], "visibility");
    expect(v.verdict).toBe("fail");
    expect(v.reason).toMatch(/Too resolved/);
    expect(report.cells[0].figures.vis2Max!).toBeLessThan(0.0176);
  });

  it("a 0.2 mas disk on the compact configuration at 10 µm is unresolved: caution", () => {
    const report = computeFeasibility(
      input({
        band: N,
        targets: [target({ model: { type: "uniformDisk", diameterMas: 0.2 }, magnitudes: { N: 0.5 } })],
      }),
    );
    const v = line(report.cells[0], "visibility");
    expect(v.verdict).toBe("caution");
    expect(v.reason).toMatch(/Barely resolved/);
    expect(report.cells[0].figures.vis2Min!).toBeGreaterThan(0.95);
  });

  it("a star that never climbs above 30° at latitude −31.4° is not observable: fail", () => {
    // Highest elevation at culmination is 90° − |φ − δ| (common practice): δ = +50° gives 8.6°.
    const report = computeFeasibility(input({ targets: [target({ decDeg: 50 })] }));
    const cell = report.cells[0];
    expect(cell.nights.every((n) => n.observableHours === 0)).toBe(true);
    expect(line(cell, "observable-time").verdict).toBe("fail");
    expect(cell.verdict).toBe("fail");
  });

  it("tells a target the delay lines rule out from one below the horizon", () => {
    // Extended-6 spans 137–456 m while the stroke is 200 m: with all six stations the delay lines
    // cover every baseline only within about ±2 h of transit, but the target is up much longer.
    const report = onExtended({ raDeg: 164.12, decDeg: -45.6, model: { type: "uniformDisk", diameterMas: 0.9 } });
    const cell = report.cells[0];
    expect(cell.nights[0].upHours).toBeGreaterThan(cell.nights[0].observableHours);
    expect(line(cell, "observable-time").reason).toMatch(/200 m delay-line stroke/);
    // Baselines within the stroke still measure the visibility.
    expect(cell.figures.vis2Max).not.toBeNull();
    expect(line(cell, "visibility").verdict).not.toBe("fail");
    expect(cell.nights.every((n) => n.upHours <= n.darkHours + 0.25)).toBe(true);
  });

  it("counts closure triangles: 1 for 3 stations, 20 with 10 independent for 6 (Monnier 2003)", () => {
    const report = computeFeasibility(
      input({
        configurations: [stationsOf("compact-3"), stationsOf("extended-6")],
        targets: [target({ raDeg: 200, decDeg: -45 })],
      }),
    );
    const [compact, extended] = report.cells;
    expect(compact.figures.triangles).toBe(1);
    expect(extended.figures.triangles).toBe(20);
    expect(line(extended, "closure").reason).toMatch(/10 independent closure phases|of 20 station triangles/);
    expect(extended.figures.observableTriangles!).toBeGreaterThan(0);
  });

  it("fails a configuration larger than the combiner takes", () => {
    const report = computeFeasibility(
      input({ band: N, configurations: [stationsOf("extended-6")], targets: [target({ magnitudes: { N: 1 } })] }),
    );
    const c = line(report.cells[0], "combiner");
    expect(c.verdict).toBe("fail");
    expect(c.reason).toBe("Ascua combines at most 4 telescopes; extended-6 has 6 stations.");
  });

  it("checks time-critical windows against the observing period and the sky", () => {
    const outside = computeFeasibility(
      input({
        targets: [target({ timeWindows: [{ startUtc: "2027-10-01T00:00:00Z", endUtc: "2027-10-02T00:00:00Z" }] })],
      }),
    );
    expect(line(outside.cells[0], "windows").reason).toMatch(/outside the observing period/);
    expect(line(outside.cells[0], "windows").verdict).toBe("fail");
    // RA 150°, Dec −40° transits near local midnight in early March at this longitude.
    const inside = computeFeasibility(
      input({
        targets: [target({ timeWindows: [{ startUtc: "2027-03-02T00:00:00Z", endUtc: "2027-03-04T12:00:00Z" }] })],
      }),
    );
    expect(line(inside.cells[0], "windows").verdict).toBe("pass");
  });

  it("reports proposal-level problems without a band, targets or configurations", () => {
    const report = computeFeasibility(input({ band: null, targets: [], configurations: [] }));
    expect(report.verdict).toBe("fail");
    expect(report.problems.map((p) => p.label)).toEqual(["Instrument and band", "Targets", "Configurations"]);
    expect(report.cells).toEqual([]);
  });

  it("fails a stored model the engine cannot read, naming it", () => {
    const report = computeFeasibility(
      input({ targets: [target({ model: { type: "uniformDisk", diameterMas: -1 } })] }),
    );
    expect(line(report.cells[0], "model").verdict).toBe("fail");
  });
});

describe("feasibility building blocks", () => {
  it("magnitude: pass, caution within 0.5 mag of the limit, fail beyond, caution when unknown", () => {
    const band = { name: "H", limitingMagnitude: 7.5 };
    expect(magnitudeLine(6.9, band).verdict).toBe("pass");
    expect(magnitudeLine(7.2, band).verdict).toBe("caution");
    expect(magnitudeLine(7.5, band).verdict).toBe("caution");
    expect(magnitudeLine(7.6, band).verdict).toBe("fail");
    expect(magnitudeLine(null, band).verdict).toBe("caution");
  });

  it("visibility thresholds: 0.05 at the shortest baseline, 0.95 everywhere", () => {
    expect(visibilityLine(0.04, 0.001, 0.04).verdict).toBe("fail");
    expect(visibilityLine(0.99, 0.96, 0.99).verdict).toBe("caution");
    expect(visibilityLine(0.9, 0.3, 0.9).verdict).toBe("pass");
  });

  it("spreads channels evenly over the band, centred on the central wavelength", () => {
    const w = bandWavelengthsM({ centralWavelengthM: 1.65e-6, bandwidthM: 0.3e-6, channels: 6 });
    expect(w).toHaveLength(6);
    expect(w[0]).toBeCloseTo(1.525e-6, 12);
    expect(w[5]).toBeCloseTo(1.775e-6, 12);
    expect(w.reduce((a, b) => a + b, 0) / 6).toBeCloseTo(1.65e-6, 12);
    expect(bandWavelengthsM({ centralWavelengthM: 10e-6, bandwidthM: 5e-6, channels: 1 })).toEqual([10e-6]);
  });

  it("samples the first, middle and last night of the cycle", () => {
    expect(cycleNights("2027-03-01", "2027-08-31").map((n) => n.date)).toEqual([
      "2027-03-01",
      "2027-05-31",
      "2027-08-31",
    ]);
  });

  it("gives a model's characteristic size", () => {
    expect(modelSizeMas({ type: "point" })).toBe(0);
    expect(modelSizeMas({ type: "gaussian", fwhmMas: 2.5 })).toBe(2.5);
    expect(modelSizeMas({ type: "binary", separationMas: 4, positionAngleDeg: 10, fluxRatio: 0.3 })).toBe(4);
    expect(
      modelSizeMas({
        type: "sum",
        components: [
          { model: { type: "uniformDisk", diameterMas: 1 }, flux: 1, offsetEastMas: 0, offsetNorthMas: 0 },
          { model: { type: "point" }, flux: 0.2, offsetEastMas: 3, offsetNorthMas: 4 },
        ],
      }),
    ).toBe(5);
  });

  it("takes the worst verdict", () => {
    expect(worstVerdict([])).toBe("pass");
    expect(worstVerdict(["pass", "caution"])).toBe("caution");
    expect(worstVerdict(["caution", "fail", "pass"])).toBe("fail");
  });
});
