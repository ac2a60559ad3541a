import { position as moonEcliptic } from "astronomia/moonposition";
import { describe, expect, it } from "vitest";
import { jdeFromJd, julianDayFromDate } from "~/engine";
import { localTime, lstText, moonPhaseText, moonRiseSet, nightSkySummary } from "~/services/nights/sky";

const site = { latitudeDeg: -31.4, longitudeDeg: -68.9, altitudeM: 2450 };
const D2R = Math.PI / 180;

/** Greenwich mean sidereal time, degrees: the IAU 1982 expression, Meeus 1998 eq. 12.4, written out here. */
function gmstDeg(jd: number): number {
  const T = (jd - 2451545.0) / 36525;
  const th = 280.46061837 + 360.98564736629 * (jd - 2451545.0) + 0.000387933 * T * T - (T * T * T) / 38710000;
  return ((th % 360) + 360) % 360;
}

/**
 * The Moon's geocentric altitude by a second route: astronomia's ELP ecliptic place turned equatorial with
 * the mean obliquity (Meeus 1998 eq. 22.2 and 13.3, nutation left out: < 0.005°), mean sidereal time.
 */
function moonAltitudeDeg(jd: number): number {
  const jde = jdeFromJd(jd);
  const p = moonEcliptic(jde);
  const T = (jde - 2451545.0) / 36525;
  const eps = (23.4392911 - 0.0130042 * T) * D2R;
  const ra = Math.atan2(Math.sin(p.lon) * Math.cos(eps) - Math.tan(p.lat) * Math.sin(eps), Math.cos(p.lon));
  const dec = Math.asin(Math.sin(p.lat) * Math.cos(eps) + Math.cos(p.lat) * Math.sin(eps) * Math.sin(p.lon));
  const ha = (gmstDeg(jd) + site.longitudeDeg) * D2R - ra;
  const lat = site.latitudeDeg * D2R;
  return Math.asin(Math.sin(lat) * Math.sin(dec) + Math.cos(lat) * Math.cos(dec) * Math.cos(ha)) / D2R;
}

describe("the sky of a night", () => {
  it("uses a sidereal time that reproduces Meeus 1998 example 12.a", () => {
    // 1987 April 10, 0h UT: mean sidereal time 13h10m46.3668s (Meeus 1998, example 12.a).
    const jd = julianDayFromDate(new Date("1987-04-10T00:00:00Z"));
    expect(gmstDeg(jd) / 15).toBeCloseTo(13 + 10 / 60 + 46.3668 / 3600, 6);
  });

  it("gives each Sun event its LST, agreeing with the IAU 1982 expression to the 1e-4 h it is rounded to", () => {
    const sky = nightSkySummary("2025-05-20", site, "America/Argentina/San_Juan");
    expect(sky.events.map((e) => e.key)).toEqual([
      "sunsetUtc",
      "civilDuskUtc",
      "nauticalDuskUtc",
      "astronomicalDuskUtc",
      "localMidnightUtc",
      "astronomicalDawnUtc",
      "nauticalDawnUtc",
      "civilDawnUtc",
      "sunriseUtc",
    ]);
    for (const e of sky.events) {
      const jd = julianDayFromDate(new Date(e.utc!));
      const lst = ((((gmstDeg(jd) + site.longitudeDeg) % 360) + 360) % 360) / 15;
      const diff = ((e.lstH! - lst + 36) % 24) - 12;
      expect(Math.abs(diff)).toBeLessThan(1e-4);
    }
    // Events in order through the night, and the dark hours between dusk and dawn.
    const times = sky.events.map((e) => Date.parse(e.utc!));
    expect([...times].sort((a, b) => a - b)).toEqual(times);
    const dark = (Date.parse(sky.astronomicalDawnUtc!) - Date.parse(sky.astronomicalDuskUtc!)) / 3_600_000;
    expect(sky.darkHours).toBeCloseTo(dark, 3);
  });

  it("finds moonrise and moonset where the Moon's altitude crosses h₀ = 0.7275π − 34′ (Meeus 1998 ch. 15)", () => {
    for (const date of ["2025-05-20", "2025-06-03", "2026-11-24"]) {
      const { riseUtc, setUtc } = moonRiseSet(date, site);
      expect(riseUtc ?? setUtc).not.toBeNull();
      // h₀ ≈ +0.12°…+0.16° for a horizontal parallax of 0.90°…0.96°; test with the bracket +0.1°…+0.2°.
      for (const [iso, rising] of [
        [riseUtc, true],
        [setUtc, false],
      ] as const) {
        if (!iso) continue;
        const jd = julianDayFromDate(new Date(iso));
        const before = moonAltitudeDeg(jd - 3 / 1440);
        const after = moonAltitudeDeg(jd + 3 / 1440);
        if (rising) {
          expect(before).toBeLessThan(0.2);
          expect(after).toBeGreaterThan(0.1);
        } else {
          expect(before).toBeGreaterThan(0.1);
          expect(after).toBeLessThan(0.2);
        }
        expect(Math.abs(moonAltitudeDeg(jd) - 0.14)).toBeLessThan(0.1);
      }
    }
  });

  it("shows local time with the zone's offset", () => {
    // Argentina keeps UTC−3 all year (no daylight saving since 2009; from memory).
    expect(localTime("2025-05-21T03:00:00Z", "America/Argentina/San_Juan")).toBe("00:00 UTC-3");
    expect(localTime("2025-05-21T03:00:00Z", "UTC")).toBe("03:00 UTC");
  });

  it("writes LST and the Moon's phase in words", () => {
    expect(lstText(7.2091)).toBe("7h 13m");
    expect(lstText(23.999)).toBe("0h 00m");
    expect(moonPhaseText(0.01, true)).toBe("new Moon");
    expect(moonPhaseText(0.3, true)).toBe("waxing crescent, 30 % lit");
    expect(moonPhaseText(0.5, false)).toBe("last quarter, 50 % lit");
    expect(moonPhaseText(0.8, false)).toBe("waning gibbous, 80 % lit");
  });
});
