import { MAS, rad } from "@test/angles";
import { j1 } from "@test/bessel";
import { demoSite, demoStations } from "@test/demo-array";
import { describe, expect, it } from "vitest";
import {
  assessObservability,
  buildBaselines,
  type CoverageRequest,
  computeCoverage,
  computeUvwTracks,
  coverageFigures,
  parseCoverageRequest,
  stationsToEquatorial,
} from "~/engine";

/** Demo site (invented): Sierra Lumbre Array. */
const SITE = demoSite();
const STATIONS = demoStations("C01", "C02", "C05", "W1");

function request(extra: Record<string, unknown> = {}): CoverageRequest {
  const parsed = parseCoverageRequest({
    site: SITE,
    stations: STATIONS,
    target: { raDeg: 84.05, decDeg: -1.2, model: { type: "uniformDisk", diameterMas: 3 } },
    wavelengthsM: [1.65e-6, 2.2e-6],
    hourAnglesH: [-4, -3, -2, -1, 0, 1, 2, 3, 4, 6],
    minElevationDeg: 30,
    delayLineStrokeM: null,
    beam: { gridSize: 128, weighting: "natural" },
    ...extra,
  });
  if (!parsed.ok) throw new Error(parsed.message);
  return parsed.value;
}

describe("observability", () => {
  const lat = rad(-31.4);
  const stations = [
    { eastM: 0, northM: 0, upM: 0 },
    { eastM: 100, northM: 0, upM: 0 },
    { eastM: 0, northM: 10, upM: 0 },
  ];
  const baselines = buildBaselines(stationsToEquatorial(stations, lat), [0, 30, 0]);
  const dec = rad(-20);
  const ha = Float64Array.from([-3, -1, 0, 1, 3].map((h) => rad(h * 15)));
  const tracks = computeUvwTracks(baselines, ha, dec);
  const elevation = Float64Array.from([50, 60, 70, 60, 20].map(rad));

  it("applies |w_ij + P_j − P_i| ≤ S per baseline and needs every baseline in range", () => {
    // East–west 100 m baseline: X = 0, Y = 100, Z = 0 → w = −cos δ sin H · 100 (TMS eq. 4.1).
    const wEW = (h: number) => -Math.cos(dec) * Math.sin(rad(h * 15)) * 100;
    const need = [-3, -1, 0, 1, 3].map((h) => Math.abs(wEW(h) + 30)); // P_1 − P_0 = 30 m
    const stroke = 60;
    const obs = assessObservability({
      elevationRad: elevation,
      minElevationRad: rad(30),
      sunAltitudeRad: null,
      tracks,
      baselines,
      stationNames: ["A", "B", "C"],
      delayLineStrokeM: stroke,
    });
    for (let s = 0; s < 5; s++) expect(obs.baselineInRange[0 * 5 + s]).toBe(need[s] <= stroke ? 1 : 0);
    // H = −3 h: w = +66.4 m, |66.4 + 30| = 96.4 m → out of range; H = +3 h: |−66.4 + 30| = 36.4 m → in range.
    expect(obs.baselineInRange[0]).toBe(0);
    expect(obs.baselineInRange[4]).toBe(1);
    for (let s = 0; s < 5; s++) {
      const allIn = [0, 1, 2].every((b) => obs.baselineInRange[b * 5 + s] === 1);
      const up = elevation[s] >= rad(30);
      expect(obs.observable[s]).toBe(allIn && up ? 1 : 0);
    }
    // B–C (P_C − P_B = −30 m) is out of range at H = −3 h as well: two baselines, A–B the worst.
    expect(obs.reasons[0]).toBe("delay line out of range on 2 baselines (worst A–B needs 96.4 m, stroke 60 m)");
    expect(obs.reasons[4]).toBe("elevation 20.0° below minimum 30.0°");
    expect(obs.reasons[2]).toBeNull();
  });

  it("skips the delay-line rule without a stroke and checks the Sun when samples have instants", () => {
    const obs = assessObservability({
      elevationRad: elevation,
      minElevationRad: rad(30),
      sunAltitudeRad: Float64Array.from([-30, -20, -17, -40, -40].map(rad)),
      tracks,
      baselines,
      stationNames: ["A", "B", "C"],
      delayLineStrokeM: null,
    });
    expect(Array.from(obs.observable)).toEqual([1, 1, 0, 1, 0]);
    expect(obs.reasons[2]).toBe("Sun at -17.0°, above -18°");
    expect(obs.reasons.join(" ")).not.toContain("delay");
  });
});

describe("computeCoverage (explicit hour angles)", () => {
  const req = request({ delayLineStrokeM: 90 });
  const out = computeCoverage(req);

  it("returns the contract shape", () => {
    expect(out.samples).toHaveLength(10);
    for (const s of out.samples) {
      expect(Object.keys(s)).toEqual(expect.arrayContaining(["hourAngleH", "elevationDeg", "observable", "reason"]));
      expect(s.observable).toBe(s.reason === null);
    }
    expect(out.baselines).toHaveLength(6); // N(N−1)/2 for N = 4
    expect(out.baselines.map((b) => b.stations)).toEqual([
      ["C01", "C02"],
      ["C01", "C05"],
      ["C01", "W1"],
      ["C02", "C05"],
      ["C02", "W1"],
      ["C05", "W1"],
    ]);
    expect(out.closurePhases.map((c) => c.stations)).toEqual([
      ["C01", "C02", "C05"],
      ["C01", "C02", "W1"],
      ["C01", "C05", "W1"],
      ["C02", "C05", "W1"],
    ]);
    expect(out.independentClosurePhases).toBe(3);
    expect(out.beam).not.toBeNull();
    for (const key of ["fwhmMajorMas", "fwhmMinorMas", "positionAngleDeg", "peakSidelobe"] as const) {
      expect(typeof out.beam?.[key]).toBe("number");
    }
  });

  it("gives points only at observable samples, one vis2 and one closure phase per wavelength", () => {
    const observableHa = out.samples.filter((s) => s.observable).map((s) => s.hourAngleH);
    expect(observableHa.length).toBeGreaterThan(0);
    expect(observableHa.length).toBeLessThan(10); // H = 6 h is below 30°, late samples beyond the stroke
    for (const b of out.baselines) {
      expect(b.points.map((p) => p.hourAngleH)).toEqual(observableHa);
      for (const p of b.points) expect(p.vis2).toHaveLength(2);
    }
    for (const c of out.closurePhases) for (const p of c.points) expect(p.closurePhaseDeg).toHaveLength(2);
  });

  it("computes vis2 of the uniform disk from the projected baseline", () => {
    const theta = 3 * MAS;
    for (const b of out.baselines)
      for (const p of b.points)
        [1.65e-6, 2.2e-6].forEach((lambda, c) => {
          const x = (Math.PI * theta * Math.hypot(p.uM, p.vM)) / lambda;
          const v = x === 0 ? 1 : (2 * j1(x)) / x; // A&S 9.1.20-based uniform-disk visibility
          expect(p.vis2[c]).toBeCloseTo(v * v, 6);
        });
  });

  it("closure phases of the centro-symmetric disk are 0° or 180°", () => {
    for (const c of out.closurePhases)
      for (const p of c.points)
        for (const x of p.closurePhaseDeg)
          expect(Math.min(Math.abs(x), Math.abs(180 - Math.abs(x)))).toBeLessThan(1e-4);
  });

  it("reports coverage figures consistent with the points", () => {
    let bMax = 0;
    for (const b of out.baselines) for (const p of b.points) bMax = Math.max(bMax, Math.hypot(p.uM, p.vM));
    expect(out.figures.longestBaselineM).toBeCloseTo(bMax, 4);
    // Resolution λ_min / (2 B_max): CONVENTIONS / common practice.
    expect(out.figures.resolutionMas).toBeCloseTo(1.65e-6 / (2 * bMax) / MAS, 4);
    expect(out.figures.radialCoverage).toBeGreaterThan(0);
    expect(out.figures.positionAngleCoverage).toBeGreaterThan(0);
  });

  it("computes the default beam when beam is absent and none when it is null", () => {
    const absent = parseCoverageRequest({ ...request(), beam: undefined });
    expect(absent.ok).toBe(true);
    if (!absent.ok) return;
    expect(computeCoverage(absent.value).beam?.gridSize).toBe(256);
    expect(computeCoverage(request({ beam: null })).beam).toBeNull();
    const withImages = computeCoverage(request({ beam: { gridSize: 64, includeImages: true } }));
    expect(withImages.beam?.image).toHaveLength(64 * 64);
    expect(withImages.beam?.dirtyImage).toHaveLength(64 * 64);
    expect(withImages.beam?.image?.[32 * 64 + 32]).toBe(1);
  });

  it("handles a target that never rises high enough", () => {
    const none = computeCoverage(request({ target: { raDeg: 10, decDeg: 60 } })); // culminates at 28.6°
    expect(none.samples.every((s) => !s.observable)).toBe(true);
    expect(none.baselines.every((b) => b.points.length === 0)).toBe(true);
    expect(none.beam).toBeNull();
    expect(none.notes.join(" ")).toContain("no observable sample");
  });
});

describe("computeCoverage (night sampling)", () => {
  const out = computeCoverage(request({ hourAnglesH: undefined, night: { date: "2027-03-15", stepMin: 10 } }));

  it("samples the astronomical night of the date at the step", () => {
    expect(out.night).not.toBeNull();
    const dusk = Date.parse(out.night?.astronomicalDuskUtc as string);
    const dawn = Date.parse(out.night?.astronomicalDawnUtc as string);
    expect(out.samples.length).toBeGreaterThan(50); // about 9 h at 10 min
    for (const s of out.samples) {
      const t = Date.parse(s.utc as string);
      expect(t).toBeGreaterThanOrEqual(dusk - 1000);
      expect(t).toBeLessThanOrEqual(dawn + 1000);
      expect(s.sunAltitudeDeg as number).toBeLessThan(-18);
      expect(new Date(t).getUTCMinutes() % 10).toBe(0); // aligned to the step
    }
  });

  it("has hour angles H = LST − α of date, with LST from an independent GMST formula", () => {
    const ra = out.night?.raOfDateDeg as number;
    expect(Math.abs(ra - 84.05)).toBeLessThan(0.5); // precession over 27 years is ~0.4°
    for (const s of out.samples.slice(0, 5)) {
      const jd = Date.parse(s.utc as string) / 86400000 + 2440587.5;
      const t = (jd - 2451545) / 36525;
      // Meeus eq. 12.4 (IAU 1982 GMST), written out here.
      const gmst = 280.46061837 + 360.98564736629 * (jd - 2451545) + 0.000387933 * t * t - (t * t * t) / 38710000;
      let h = ((gmst + SITE.longitudeDeg - ra) / 15) % 24;
      if (h < -12) h += 24;
      if (h >= 12) h -= 24;
      expect(s.hourAngleH).toBeCloseTo(h, 5);
    }
  });

  it("reports the target's window above the minimum elevation", () => {
    const rise = Date.parse(out.night?.targetRiseUtc as string);
    const set = Date.parse(out.night?.targetSetUtc as string);
    const observable = out.samples.filter((s) => s.observable).map((s) => Date.parse(s.utc as string));
    expect(observable.length).toBeGreaterThan(0);
    for (const t of observable) {
      expect(t).toBeGreaterThanOrEqual(rise - 1000);
      expect(t).toBeLessThanOrEqual(set + 1000);
    }
  });
});

describe("coverage figures", () => {
  it("bins a single east–west track", () => {
    // One 100 m east–west baseline at the pole-facing declination −90°: u, v trace a full
    // circle of radius 100 m → every position-angle bin, one radial bin.
    const set = buildBaselines(
      stationsToEquatorial(
        [
          { eastM: 0, northM: 0, upM: 0 },
          { eastM: 100, northM: 0, upM: 0 },
        ],
        rad(-31.4),
      ),
      [0, 0],
    );
    const ha = Float64Array.from({ length: 720 }, (_, i) => (i / 720) * 2 * Math.PI);
    const tracks = computeUvwTracks(set, ha, rad(-90));
    const f = coverageFigures(tracks, new Uint8Array(720).fill(1), [2e-6]);
    expect(f.longestBaselineM).toBeCloseTo(100, 6);
    expect(f.shortestBaselineM).toBeCloseTo(100, 6);
    expect(f.positionAngleCoverage).toBe(1);
    expect(f.radialCoverage).toBe(1 / 20);
    expect(f.resolutionMas).toBeCloseTo(2e-6 / 200 / MAS, 6);
  });
});
