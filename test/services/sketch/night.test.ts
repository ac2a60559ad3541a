import { rad } from "@test/angles";
import { describe, expect, it } from "vitest";
import { airmassKastenYoung, dateFromJulianDay, deltaTSeconds, elevationRad, gastRad } from "~/engine";
import {
  angularSeparationDeg,
  elevationAtDeg,
  elevationForAirmass,
  lstTicks,
  moonAltitudeCurve,
  nextNightDate,
  observableWindows,
  raTransitingAtMidnight,
  SIDEREAL_PER_SOLAR,
  targetAltitudeCurve,
  twilightBands,
} from "~/services/sketch/night";

describe("the night of a date", () => {
  it("is the local evening's date: before local noon the next night begins this evening", () => {
    // CONVENTIONS.md: the night of date D begins on the local evening of D. At longitude −68.9°
    // local mean time is UTC − 4 h 35.6 min.
    expect(nextNightDate(new Date("2027-03-15T02:00:00Z"), -68.9)).toBe("2027-03-14");
    expect(nextNightDate(new Date("2027-03-15T16:00:00Z"), -68.9)).toBe("2027-03-15");
    expect(nextNightDate(new Date("2027-03-15T23:00:00Z"), 150)).toBe("2027-03-16");
  });
});

describe("a target for tonight", () => {
  it("transits at local midnight: hour angle 0, so elevation 90° − |φ − δ|", () => {
    // Meeus ch. 13: H = θ − α = 0 at transit, where the altitude is 90° − |φ − δ|.
    const ra = raTransitingAtMidnight("2027-03-15", -68.9);
    const midnightJd = Date.UTC(2027, 2, 16) / 86_400_000 + 2440587.5 + 68.9 / 360;
    expect(elevationAtDeg(midnightJd, -31.4, -68.9, ra, -36.4)).toBeCloseTo(90 - 5, 6);
  });
});

describe("altitudes", () => {
  it("reproduces Meeus example 13.b: Venus seen from Washington", () => {
    // Meeus, Astronomical Algorithms 2nd ed., ex. 13.b: 1987 April 10, 19h21m00s UT (JD 2446896.30625),
    // φ = +38°55′17″, L = 77°03′56″ W, α = 23h09m16.641s, δ = −6°43′11.61″ → h = 15.1249°.
    // Meeus uses apparent sidereal time; mean sidereal time differs by < 0.3 s here (< 0.002° in h).
    const h = elevationAtDeg(
      2446896.30625,
      38 + 55 / 60 + 17 / 3600,
      -(77 + 3 / 60 + 56 / 3600),
      347.3193375,
      -6.719891667,
    );
    expect(h).toBeCloseTo(15.1249, 2);
    expect(Math.abs(h - 15.1249)).toBeLessThan(0.005);
  });

  it("gives the Moon's altitude from its position in Meeus example 47.a", () => {
    // Meeus ex. 47.a: 1992 April 12, 0h TD: apparent α = 134.688470°, δ = +13.768368°.
    // Seen from the demo site, the altitude from those coordinates and the apparent sidereal time.
    const jdTd = 2448724.5;
    const jdUt = jdTd - deltaTSeconds(jdTd) / 86400;
    const t = dateFromJulianDay(jdUt).getTime();
    const curve = moonAltitudeCurve({ latDeg: -31.4, lonDeg: -68.9, startMs: t, endMs: t, stepMin: 10 });
    const expected =
      (elevationRad(rad(-31.4), rad(13.768368), gastRad(jdUt) + rad(-68.9) - rad(134.68847)) * 180) / Math.PI;
    expect(curve.altitudeDeg).toHaveLength(1);
    expect(Math.abs(curve.altitudeDeg[0] - expected)).toBeLessThan(0.01);
  });

  it("culminates at the meridian: a target's highest point is 90° − |φ − δ|", () => {
    // Spherical astronomy (e.g. Meeus ch. 13): the maximum altitude of a star is 90° − |φ − δ|.
    const start = Date.parse("2027-03-15T22:00:00Z");
    const c = targetAltitudeCurve({
      latDeg: -31.4,
      lonDeg: -68.9,
      raDeg: 165,
      decDeg: -35,
      startMs: start,
      endMs: start + 12 * 3.6e6,
      stepMin: 1,
    });
    expect(Math.max(...c.elevationDeg)).toBeGreaterThan(90 - 3.6 - 0.2);
    expect(Math.max(...c.elevationDeg)).toBeLessThan(90 - 3.6 + 0.2);
    c.elevationDeg.forEach((e, k) => {
      if (e > 0) expect(c.airmass[k]).toBeCloseTo(airmassKastenYoung(e), 12);
      else expect(c.airmass[k]).toBeNull();
    });
  });

  it("measures separations as in Meeus example 17.a", () => {
    // Meeus ex. 17.a: Arcturus (213.9154°, +19.1825°) and Spica (201.2983°, −11.1614°): d = 32.7930°.
    expect(angularSeparationDeg(213.9154, 19.1825, 201.2983, -11.1614)).toBeCloseTo(32.793, 3);
    expect(angularSeparationDeg(10, 20, 10, 20)).toBe(0);
    expect(angularSeparationDeg(0, 0, 180, 0)).toBeCloseTo(180, 9);
  });
});

describe("axes of the elevation panel", () => {
  it("puts whole sidereal hours where Meeus example 12.b says", () => {
    // Meeus ex. 12.b: 1987 April 10, 19h21m00s UT, mean sidereal time at Greenwich 8h34m57.0896s.
    // The next whole hour (9h) comes (9 − 8.5825249) sidereal hours later, ÷ 1.00273790935 in solar time.
    const start = dateFromJulianDay(2446896.30625).getTime();
    const ticks = lstTicks(start, start + 3 * 3.6e6, 0);
    const lst0 = 8 + 34 / 60 + 57.0896 / 3600;
    expect(ticks.labels.slice(0, 3)).toEqual(["9h", "10h", "11h"]);
    expect(Math.abs(ticks.timesMs[0] - (start + ((9 - lst0) / SIDEREAL_PER_SOLAR) * 3.6e6))).toBeLessThan(1000);
    expect(ticks.timesMs[1] - ticks.timesMs[0]).toBeCloseTo(3.6e6 / SIDEREAL_PER_SOLAR, 0);
  });

  it("inverts the air mass of Kasten & Young", () => {
    // Kasten & Young (1989) is within 0.3 % of sec z at 30°: air mass 2 lies at ≈ 30° (sec 60° = 2).
    expect(elevationForAirmass(2)).toBeGreaterThan(29.8);
    expect(elevationForAirmass(2)).toBeLessThan(30.0);
    for (const x of [1.05, 1.2, 1.5, 2, 3, 10]) expect(airmassKastenYoung(elevationForAirmass(x))).toBeCloseTo(x, 6);
    expect(elevationForAirmass(1)).toBe(90);
  });
});

describe("bands and windows", () => {
  // The ephemeris of docs/cli.md (Sierra Lumbre Array, night of 2027-03-15).
  const night = {
    sunsetUtc: "2027-03-15T22:53:05Z",
    civilDuskUtc: "2027-03-15T23:17:21Z",
    nauticalDuskUtc: "2027-03-15T23:45:43Z",
    astronomicalDuskUtc: "2027-03-16T00:14:25Z",
    astronomicalDawnUtc: "2027-03-16T09:14:44Z",
    nauticalDawnUtc: "2027-03-16T09:43:28Z",
    civilDawnUtc: "2027-03-16T10:11:51Z",
    sunriseUtc: "2027-03-16T10:36:08Z",
  };

  it("shades daylight and the three twilights on both sides of the dark hours", () => {
    // Civil 0°50′–6°, nautical 6°–12°, astronomical 12°–18° below the horizon (CONVENTIONS.md).
    const start = Date.parse("2027-03-15T22:00:00Z");
    const end = Date.parse("2027-03-16T11:30:00Z");
    const bands = twilightBands(night, start, end);
    expect(bands.map((b) => b.kind)).toEqual([
      "day",
      "civil",
      "nautical",
      "astronomical",
      "astronomical",
      "nautical",
      "civil",
      "day",
    ]);
    for (let k = 1; k < bands.length; k++) expect(bands[k].startMs).toBeGreaterThanOrEqual(bands[k - 1].endMs);
    expect(bands[3].endMs).toBe(Date.parse(night.astronomicalDuskUtc));
    expect(bands[4].startMs).toBe(Date.parse(night.astronomicalDawnUtc));
  });

  it("leaves out events that do not happen", () => {
    const polar = { ...night, sunsetUtc: null, civilDuskUtc: null, civilDawnUtc: null, sunriseUtc: null };
    const bands = twilightBands(polar, 0, Date.parse("2027-03-17T00:00:00Z"));
    expect(bands.map((b) => b.kind)).toEqual(["astronomical", "astronomical"]);
  });

  it("groups consecutive observable samples into windows of samples × step", () => {
    const at = (m: number) => new Date(Date.parse("2027-03-16T01:00:00Z") + m * 60_000).toISOString();
    const samples = [0, 10, 20, 30, 40, 50, 60].map((m, k) => ({ utc: at(m), observable: k !== 3 }));
    const w = observableWindows(samples, 10);
    expect(w).toHaveLength(2);
    expect(w[0]).toEqual({ startMs: Date.parse(at(-5)), endMs: Date.parse(at(25)) });
    expect((w[1].endMs - w[1].startMs) / 60_000).toBe(30);
    expect(observableWindows([], 10)).toEqual([]);
  });
});
