import { describe, expect, it } from "vitest";
import {
  gastRad,
  gmstHours,
  gmstRad,
  isoUtcFromJulianDay,
  julianDay,
  julianDayFromDate,
  lmstHours,
  parseIsoDate,
} from "~/engine";

const TWO_PI = 2 * Math.PI;
/** Seconds of time of an angle in radians. */
const secondsOfTime = (rad: number) => (rad / TWO_PI) * 86400;

describe("Julian day", () => {
  it("matches Meeus example 7.a (1957 October 4.81 → JD 2436116.31)", () => {
    expect(julianDay(1957, 10, 4.81)).toBeCloseTo(2436116.31, 6); // Meeus, Astronomical Algorithms 2nd ed., ex. 7.a
  });

  it("agrees with the Unix clock (JD 2440587.5 at 1970-01-01T00:00Z)", () => {
    // The JD of the Unix epoch: common practice (USNO / IAU definition of the Julian day).
    expect(julianDayFromDate(new Date(Date.UTC(1970, 0, 1)))).toBe(2440587.5);
    // J2000.0 = 2000 January 1.5 = JD 2451545.0 (Meeus p. 62).
    expect(julianDayFromDate(new Date(Date.UTC(2000, 0, 1, 12)))).toBe(2451545.0);
  });

  it("formats instants as ISO-8601 UTC rounded to the second", () => {
    expect(isoUtcFromJulianDay(2451545.0)).toBe("2000-01-01T12:00:00Z");
    expect(isoUtcFromJulianDay(2451545.0 + 0.4 / 86400)).toBe("2000-01-01T12:00:00Z");
    expect(isoUtcFromJulianDay(2451545.0 + 0.6 / 86400)).toBe("2000-01-01T12:00:01Z");
  });

  it("parses only real YYYY-MM-DD dates", () => {
    expect(parseIsoDate("2028-02-29")).toEqual({ year: 2028, month: 2, day: 29 });
    expect(parseIsoDate("2027-02-29")).toBeNull(); // 2027 is not a leap year
    expect(parseIsoDate("2027-3-5")).toBeNull();
  });
});

describe("sidereal time", () => {
  it("mean sidereal time at 0h UT, Meeus example 12.a: 13h10m46.3668s", () => {
    const jd = 2446895.5; // 1987 April 10, 0h UT (Meeus ex. 12.a)
    const expected = 13 * 3600 + 10 * 60 + 46.3668; // Meeus ex. 12.a, quoted to 0.0001 s
    expect(secondsOfTime(gmstRad(jd))).toBeCloseTo(expected, 3);
  });

  it("apparent sidereal time at 0h UT, Meeus example 12.a: 13h10m46.1351s", () => {
    const jd = 2446895.5;
    const expected = 13 * 3600 + 10 * 60 + 46.1351; // Meeus ex. 12.a (nutation in RA −0.2317 s)
    expect(secondsOfTime(gastRad(jd))).toBeCloseTo(expected, 2);
  });

  it("mean sidereal time at 19h21m UT, Meeus example 12.b: 128.7378734°", () => {
    const jd = julianDay(1987, 4, 10 + (19 + 21 / 60) / 24); // 1987 April 10, 19h21m00s UT
    expect(jd).toBeCloseTo(2446896.30625, 8); // Meeus ex. 12.b
    expect((gmstRad(jd) * 180) / Math.PI).toBeCloseTo(128.7378734, 6); // Meeus ex. 12.b
  });

  it("local sidereal time adds the east longitude", () => {
    const jd = 2446896.30625;
    const lonDeg = -68.9;
    const expected = (((gmstHours(jd) + lonDeg / 15) % 24) + 24) % 24; // definition LST = GST + λ(east)
    expect(lmstHours(jd, (lonDeg * Math.PI) / 180)).toBeCloseTo(expected, 10);
  });
});
