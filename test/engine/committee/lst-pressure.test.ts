import { rad } from "@test/angles";
import { demoSite } from "@test/demo-array";
import { skyPositionArbitraries } from "@test/random";
import { sum } from "@test/sum";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  assessObservability,
  buildBaselines,
  computeUvwTracks,
  darkTimeOverPeriod,
  jdeFromJd,
  julianDayFromDate,
  type LstPressureInput,
  lstPressure,
  observabilityMasks,
  precessFromJ2000,
  stationsToEquatorial,
} from "~/engine";

const site = demoSite();

const STATIONS = [
  { name: "C01", eastM: 0, northM: 0, upM: 0, pathOffsetM: 0 },
  { name: "C02", eastM: 16, northM: 0, upM: 0, pathOffsetM: 2 },
  { name: "W1", eastM: -182, northM: 64, upM: 1.2, pathOffsetM: 40 },
  { name: "E3", eastM: 301, northM: -117, upM: -0.9, pathOffsetM: 70 },
];
const configurations = [
  { id: "compact", nights: 60, stations: STATIONS.slice(0, 2), delayLineStrokeM: null, minElevationDeg: 30 },
  { id: "wide", nights: 40.5, stations: STATIONS, delayLineStrokeM: 150, minElevationDeg: 30 },
];

/** LMST in hours from Meeus eq. 12.4 (IAU 1982), written out here as an independent second method. */
function meeusLstH(jd: number, lonDeg: number): number {
  const t = (jd - 2451545) / 36525;
  const gmst = 280.46061837 + 360.98564736629 * (jd - 2451545) + 0.000387933 * t * t - (t * t * t) / 38710000;
  return ((((gmst + lonDeg) / 15) % 24) + 24) % 24;
}

describe("LST pressure", () => {
  const dark = darkTimeOverPeriod(site, "2027-04-01", "2027-04-30", { everyNights: 3 });
  const input: LstPressureInput = {
    configurations,
    requests: [
      { proposal: "P1", target: "A", raDeg: 150, decDeg: -40, configuration: "compact", hours: 12 },
      { proposal: "P1", target: "B", raDeg: 210, decDeg: -10, configuration: "wide", hours: 7.5 },
      { proposal: "P2", target: "C", raDeg: 100, decDeg: -60, configuration: "wide", hours: 3, minElevationDeg: 45 },
      { proposal: "P2", target: "Polaris-like", raDeg: 38, decDeg: 89, configuration: "compact", hours: 4 },
      { proposal: "P3", target: "D", raDeg: 170, decDeg: -30, configuration: "extended", hours: 2 },
    ],
  };
  const p = lstPressure(dark, input);

  it("spreads each target's requested hours over the LST bins with Σ bins = requested hours", () => {
    for (const r of p.requests.slice(0, 3)) {
      expect(r.unplaceableHours).toBe(0);
      expect(r.unplaceableReason).toBeNull();
      expect(sum(r.spreadHours)).toBeCloseTo(r.hoursRequested, 9);
      // In proportion to the observable hours.
      const b = r.observableHoursPerBin.findIndex((x) => x > 0);
      expect(r.spreadHours[b] / r.hoursRequested).toBeCloseTo(r.observableHoursPerBin[b] / r.observableHours, 12);
    }
  });

  it("capacity per bin = nights × mean dark hours per bin; Σ capacity = nights × mean dark hours per night", () => {
    for (const c of p.configurations) {
      const config = configurations.find((x) => x.id === c.configuration)!;
      expect(sum(c.capacityHours)).toBeCloseTo(config.nights * dark.meanDarkHoursPerNight, 9);
      expect(c.capacityTotalH).toBeCloseTo(config.nights * dark.meanDarkHoursPerNight, 12);
      for (let b = 0; b < 24; b++)
        expect(c.capacityHours[b]).toBeCloseTo(config.nights * dark.meanDarkHoursPerBin[b], 12);
    }
  });

  it("requested hours per configuration: Σ bins + unplaceable = every hour requested on it", () => {
    const compact = p.configurations[0];
    expect(compact.requestedTotalH).toBe(16);
    expect(compact.unplaceableH).toBe(4);
    expect(sum(compact.requestedHours)).toBeCloseTo(12, 9);
    const wide = p.configurations[1];
    expect(wide.requestedTotalH).toBe(10.5);
    expect(sum(wide.requestedHours) + wide.unplaceableH).toBeCloseTo(10.5, 9);
    expect(wide.oversubscription).toBeCloseTo(10.5 / wide.capacityTotalH, 12);
  });

  it("reports a target that is never observable as unplaceable, with the reason", () => {
    // δ = +89° from latitude −31.4°: highest elevation 90° − |φ − δ| = 90 − 120.4 < 0 (Meeus eq. 13.6 at H = 0).
    const never = p.requests[3];
    expect(never.unplaceableHours).toBe(4);
    expect(never.unplaceableReason).toBe("never above 30° in darkness during the period");
    expect(sum(never.spreadHours)).toBe(0);
    const unknown = p.requests[4];
    expect(unknown.unplaceableHours).toBe(2);
    expect(unknown.unplaceableReason).toBe('configuration "extended" is not offered in this cycle');
  });

  it("names the delay lines when they, not the sky, exclude a target", () => {
    const short = lstPressure(dark, {
      configurations: [{ ...configurations[1], delayLineStrokeM: 1 }],
      requests: [{ proposal: "P", target: "T", raDeg: 150, decDeg: -30, configuration: "wide", hours: 1 }],
    });
    expect(short.requests[0].unplaceableReason).toBe("the delay lines never reach it while it is up in darkness");
  });

  it("observable hours agree with a 20-second walk through every dark interval", { timeout: 30_000 }, () => {
    // Independent method: every sampled night, every 20 s of darkness (as given by the dark time),
    // hour angle from Meeus 12.4 LMST, sin e = sin φ sin δ + cos φ cos δ cos H; no delay lines ("compact").
    const r = p.requests[0];
    // Positions of date at local midnight of the middle night (2027-04-15), as the method states.
    expect(p.positionsOfDate).toBe("2027-04-15");
    const mid = julianDayFromDate(new Date("2027-04-15T00:00:00Z")) + 1 - site.longitudeDeg / 360;
    const pos = precessFromJ2000(rad(150), rad(-40), jdeFromJd(mid));
    const walked = new Float64Array(24);
    const step = 1 / 4320;
    for (const n of dark.nights) {
      const t0 = julianDayFromDate(new Date(n.darkStartUtc!));
      const t1 = julianDayFromDate(new Date(n.darkEndUtc!));
      for (let jd = t0 + step / 2; jd < t1; jd += step) {
        const lst = meeusLstH(jd, site.longitudeDeg);
        const h = rad(lst * 15) - pos.raRad;
        const sinE =
          Math.sin(rad(site.latitudeDeg)) * Math.sin(pos.decRad) +
          Math.cos(rad(site.latitudeDeg)) * Math.cos(pos.decRad) * Math.cos(h);
        if (sinE >= Math.sin(rad(30))) walked[Math.floor(lst)] += n.weight / 180;
      }
    }
    // The walk itself is good to ±10 s per edge per night (30 nights → ±0.08 h at worst in an edge
    // bin); found: 191.91 h against 191.93 h, worst bin 0.035 h.
    expect(Math.abs(r.observableHours - sum(walked))).toBeLessThan(0.001 * sum(walked));
    for (let b = 0; b < 24; b++) expect(Math.abs(r.observableHoursPerBin[b] - walked[b])).toBeLessThan(0.1);
  });

  it("refuses negative hours and repeated configurations", () => {
    expect(() => lstPressure(dark, { configurations, requests: [{ ...input.requests[0], hours: -1 }] })).toThrow(
      /requests\[0\]\.hours/,
    );
    expect(() => lstPressure(dark, { configurations: [configurations[0], configurations[0]], requests: [] })).toThrow(
      /configurations\[1\]\.id: repeats/,
    );
  });

  it("sums hold for random targets and hours (fast-check)", () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.record({
            ...skyPositionArbitraries(),
            hours: fc.double({ min: 0, max: 50, noNaN: true }),
            configuration: fc.constantFrom("compact", "wide"),
          }),
          { minLength: 1, maxLength: 8 },
        ),
        (targets) => {
          const res = lstPressure(dark, {
            configurations,
            requests: targets.map((t, i) => ({ ...t, proposal: `P${i}`, target: `T${i}` })),
          });
          for (const r of res.requests) {
            expect(sum(r.spreadHours) + r.unplaceableHours).toBeCloseTo(r.hoursRequested, 9);
            expect(r.unplaceableHours === 0 || r.unplaceableHours === r.hoursRequested).toBe(true);
          }
          for (const c of res.configurations) {
            const mine = res.requests.filter((r) => r.configuration === c.configuration);
            expect(c.requestedTotalH).toBeCloseTo(sum(mine.map((r) => r.hoursRequested)), 9);
            expect(sum(c.requestedHours) + c.unplaceableH).toBeCloseTo(c.requestedTotalH, 9);
          }
        },
      ),
      { numRuns: 40 },
    );
  });
});

describe("observability masks without reasons", () => {
  it("agree with assessObservability sample by sample", () => {
    const latRad = rad(site.latitudeDeg);
    const baselines = buildBaselines(
      stationsToEquatorial(STATIONS, latRad),
      STATIONS.map((s) => s.pathOffsetM),
    );
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -12, max: 12, noNaN: true }), { minLength: 1, maxLength: 40 }),
        fc.double({ min: -89, max: 50, noNaN: true }),
        fc.option(fc.double({ min: 1, max: 300, noNaN: true }), { nil: null }),
        fc.option(fc.array(fc.double({ min: -90, max: 0, noNaN: true }), { minLength: 40, maxLength: 40 }), {
          nil: null,
        }),
        (haH, decDeg, strokeM, sunDeg) => {
          const haRad = Float64Array.from(haH, (h) => (h * Math.PI) / 12);
          const el = Float64Array.from(haRad, (h) =>
            Math.asin(
              Math.sin(latRad) * Math.sin(rad(decDeg)) + Math.cos(latRad) * Math.cos(rad(decDeg)) * Math.cos(h),
            ),
          );
          const input = {
            elevationRad: el,
            minElevationRad: rad(30),
            sunAltitudeRad: sunDeg ? Float64Array.from(sunDeg.slice(0, haH.length), rad) : null,
            tracks: computeUvwTracks(baselines, haRad, rad(decDeg)),
            baselines,
            stationNames: STATIONS.map((s) => s.name),
            delayLineStrokeM: strokeM,
          };
          const full = assessObservability(input);
          const masks = observabilityMasks(input);
          expect(Array.from(masks.observable)).toEqual(Array.from(full.observable));
          expect(Array.from(masks.skyOk)).toEqual(Array.from(full.skyOk));
        },
      ),
    );
  });
});
