import { rad } from "@test/angles";
import { demoSite } from "@test/demo-array";
import { CalendarGregorian } from "astronomia/julian";
import { Sunrise } from "astronomia/sunrise";
import { describe, expect, it } from "vitest";
import { computeEphemeris, jdeFromJd, julianDayFromDate, moonPosition, nightEvents } from "~/engine";

const site = demoSite();
const ms = (iso: string | null) => Date.parse(iso as string);

describe("night of date D at a site west of Greenwich", () => {
  const eph = computeEphemeris({ site, date: "2027-03-15" });

  it("begins on the local evening of D and ends on the UT morning of D + 1", () => {
    expect(eph.sunsetUtc?.slice(0, 10)).toBe("2027-03-15"); // ~18h local mean time = ~23h UT
    expect(eph.astronomicalDawnUtc?.slice(0, 10)).toBe("2027-03-16");
    expect(eph.sunriseUtc?.slice(0, 10)).toBe("2027-03-16");
    const order = [
      eph.sunsetUtc,
      eph.civilDuskUtc,
      eph.nauticalDuskUtc,
      eph.astronomicalDuskUtc,
      eph.astronomicalDawnUtc,
      eph.nauticalDawnUtc,
      eph.civilDawnUtc,
      eph.sunriseUtc,
    ].map(ms);
    for (let i = 1; i < order.length; i++) expect(order[i]).toBeGreaterThan(order[i - 1]);
  });

  it("agrees with astronomia's independent sunrise module within a minute", () => {
    // Second opinion: astronomia/sunrise (equation-of-time method, different from our
    // altitude scan). It takes longitude positive WEST and a UT calendar day.
    const evening = new Sunrise(new CalendarGregorian(2027, 3, 15), -31.4, 68.9);
    const morning = new Sunrise(new CalendarGregorian(2027, 3, 16), -31.4, 68.9);
    const t = (c: ReturnType<Sunrise["set"]>) => (c as NonNullable<typeof c>).toDate().getTime();
    expect(Math.abs(ms(eph.sunsetUtc) - t(evening.set()))).toBeLessThan(60_000);
    expect(Math.abs(ms(eph.astronomicalDuskUtc) - t(evening.nightStart()))).toBeLessThan(60_000);
    expect(Math.abs(ms(eph.astronomicalDawnUtc) - t(morning.nightEnd()))).toBeLessThan(60_000);
    expect(Math.abs(ms(eph.sunriseUtc) - t(morning.rise()))).toBeLessThan(60_000);
  });

  it("gives the LST at dusk from an independent GMST formula", () => {
    const jd = julianDayFromDate(new Date(ms(eph.astronomicalDuskUtc)));
    const t = (jd - 2451545) / 36525;
    // Meeus eq. 12.4 (IAU 1982), written out here.
    const gmst = 280.46061837 + 360.98564736629 * (jd - 2451545) + 0.000387933 * t * t - (t * t * t) / 38710000;
    const lstH = ((((gmst + site.longitudeDeg) / 15) % 24) + 24) % 24;
    expect(eph.lstAtDuskH).not.toBeNull();
    expect(Math.abs((eph.lstAtDuskH as number) - lstH)).toBeLessThan(1 / 3600); // the ISO string is rounded to 1 s
  });

  it("reports the Moon at local mean midnight", () => {
    // Local mean midnight = 0h UT of D+1 − longitude/15 = 04:35:36 UT for −68.9°.
    expect(eph.localMidnightUtc).toBe("2027-03-16T04:35:36Z");
    const moon = moonPosition(jdeFromJd(julianDayFromDate(new Date("2027-03-16T04:35:36Z"))));
    expect(eph.moonRaDeg).toBeCloseTo((moon.raRad * 180) / Math.PI, 3);
    expect(eph.moonDecDeg).toBeCloseTo((moon.decRad * 180) / Math.PI, 3);
    expect(eph.moonIlluminatedFraction).toBeGreaterThanOrEqual(0);
    expect(eph.moonIlluminatedFraction).toBeLessThanOrEqual(1);
    // Astronomical night length at 31° S in mid-March is about 9 h (common practice / any almanac).
    expect(eph.darkHours).toBeGreaterThan(8.5);
    expect(eph.darkHours).toBeLessThan(9.5);
  });
});

describe("night events at extreme latitudes", () => {
  it("has no dusk and no dark time in a polar summer", () => {
    const ev = nightEvents({ year: 2027, month: 6, day: 21 }, rad(78), rad(15));
    expect(ev.sunsetJd).toBeNull();
    expect(ev.astronomicalDuskJd).toBeNull();
    expect(ev.darkStartJd).toBeNull();
  });

  it("is dark through the whole window in a polar winter", () => {
    const ev = nightEvents({ year: 2027, month: 12, day: 21 }, rad(85), rad(15));
    expect(ev.sunsetJd).toBeNull();
    expect(ev.darkStartJd).toBe(ev.windowStartJd);
    expect(ev.darkEndJd).toBe(ev.windowEndJd);
  });

  it("handles a site east of Greenwich (evening events on UT date D)", () => {
    const ev = nightEvents({ year: 2027, month: 3, day: 15 }, rad(-31.4), rad(150));
    const sunset = new Date(((ev.sunsetJd as number) - 2440587.5) * 86400000).toISOString();
    expect(sunset.slice(0, 10)).toBe("2027-03-15"); // ~18h local ≈ 08h UT of D
  });
});
