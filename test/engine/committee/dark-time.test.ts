import { rad } from "@test/angles";
import { demoSite } from "@test/demo-array";
import { sum } from "@test/sum";
import { describe, expect, it } from "vitest";
import {
  addDarkIntervalToLst,
  darkTimeOverPeriod,
  jdeFromJd,
  julianDayFromDate,
  SIDEREAL_PER_SOLAR,
  sunPosition,
} from "~/engine";

const site = demoSite();

/** LMST in hours from Meeus eq. 12.4 (IAU 1982), written out here as an independent second method. */
function meeusLstH(jd: number, lonDeg: number): number {
  const t = (jd - 2451545) / 36525;
  const gmst = 280.46061837 + 360.98564736629 * (jd - 2451545) + 0.000387933 * t * t - (t * t * t) / 38710000;
  return ((((gmst + lonDeg) / 15) % 24) + 24) % 24;
}

describe("dark interval over LST bins", () => {
  it("splits an interval across 0 h LST (hand-worked)", () => {
    // 1 solar hour from LST 23.5 h covers 1.0027379 sidereal hours: 0.5 of them in bin 23, 0.5027379 in
    // bin 0. In solar hours: 0.5/1.0027379 = 0.4986348 and 1 − 0.4986348 = 0.5013652.
    const out = new Float64Array(24);
    addDarkIntervalToLst(23.5, 1, out);
    expect(out[23]).toBeCloseTo(0.4986348, 6);
    expect(out[0]).toBeCloseTo(0.5013652, 6);
    expect(sum(out)).toBeCloseTo(1, 12);
  });

  it("uses the sidereal rate of Meeus eq. 12.4 (360.98564736629° per day)", () => {
    expect(SIDEREAL_PER_SOLAR).toBeCloseTo(1.0027379093508, 12);
  });
});

describe("dark time over a period", () => {
  const march = darkTimeOverPeriod(site, "2027-03-18", "2027-03-22");

  it("bins of each night sum to that night's dark hours", () => {
    expect(march.periodNights).toBe(5);
    expect(march.nights.map((n) => n.date)).toEqual([
      "2027-03-18",
      "2027-03-19",
      "2027-03-20",
      "2027-03-21",
      "2027-03-22",
    ]);
    march.nights.forEach((n, i) => {
      expect(n.weight).toBe(1);
      expect(sum(march.hoursPerBin.subarray(i * 24, (i + 1) * 24))).toBeCloseTo(n.darkHours, 9);
    });
    expect(sum(march.meanDarkHoursPerBin)).toBeCloseTo(march.meanDarkHoursPerNight, 9);
  });

  it("matches the equinox night length from the hour angle of the −18° crossing (Meeus eq. 15.1)", () => {
    // cos H₀ = (sin h₀ − sin φ sin δ)/(cos φ cos δ) with h₀ = −18°: the Sun is below −18° for
    // (360° − 2H₀)/15° hours. δ is the Sun's at local midnight; it drifts ~0.2° over the night and the
    // equation of time ~20 s, hence a 1-minute tolerance (the difference found is ~6 s).
    const night = march.nights[2]; // 2027-03-20, the equinox
    const midnightJd = 2461484.5 + 1 - site.longitudeDeg / 360; // 0h UT of 2027-03-20 is JD 2461484.5
    const dec = sunPosition(jdeFromJd(midnightJd)).decRad;
    const cosH0 =
      (Math.sin(rad(-18)) - Math.sin(rad(site.latitudeDeg)) * Math.sin(dec)) /
      (Math.cos(rad(site.latitudeDeg)) * Math.cos(dec));
    const h0Deg = (Math.acos(cosH0) * 180) / Math.PI;
    expect(Math.abs(night.darkHours - (360 - 2 * h0Deg) / 15)).toBeLessThan(1 / 60);
    expect(night.darkHours).toBeCloseTo(9.17, 1); // δ = 0: cos H₀ = −0.3090/0.8535 → H₀ = 111.2°, 9.17 h
  });

  it("puts each night's hours on the LST bins as a fine time sampling does", () => {
    // Independent method: step through the dark interval every 10 s, LMST from Meeus 12.4 at each step.
    const n = march.nights[0];
    const t0 = julianDayFromDate(new Date(n.darkStartUtc!));
    const t1 = julianDayFromDate(new Date(n.darkEndUtc!));
    const stepD = 10 / 86400;
    const sampled = new Float64Array(24);
    for (let jd = t0 + stepD / 2; jd < t1; jd += stepD)
      sampled[Math.floor(meeusLstH(jd, site.longitudeDeg))] += 10 / 3600;
    for (let b = 0; b < 24; b++) expect(Math.abs(march.hoursPerBin[b] - sampled[b])).toBeLessThan(1.5 / 60);
    expect(n.lstAtDarkStartH).toBeCloseTo(meeusLstH(t0, site.longitudeDeg), 3);
  });

  it("samples the middle night of each block of k nights, weighted by the block", () => {
    // 10 nights, k = 4: blocks of nights 0–3, 4–7, 8–9 → middle nights 1, 5, 8; weights 4, 4, 2.
    const d = darkTimeOverPeriod(site, "2027-05-01", "2027-05-10", { everyNights: 4 });
    expect(d.nights.map((n) => [n.date, n.weight])).toEqual([
      ["2027-05-02", 4],
      ["2027-05-06", 4],
      ["2027-05-09", 2],
    ]);
    const mean = (4 * d.nights[0].darkHours + 4 * d.nights[1].darkHours + 2 * d.nights[2].darkHours) / 10;
    expect(d.meanDarkHoursPerNight).toBeCloseTo(mean, 12);
  });

  it("weekly sampling of a 180-night cycle agrees with every night", { timeout: 30_000 }, () => {
    const every = darkTimeOverPeriod(site, "2027-03-01", "2027-08-27");
    const weekly = darkTimeOverPeriod(site, "2027-03-01", "2027-08-27", { everyNights: 7 });
    expect(every.periodNights).toBe(180);
    expect(every.nights).toHaveLength(180);
    expect(weekly.nights).toHaveLength(26);
    expect(sum(weekly.nights.map((n) => n.weight))).toBe(180);
    expect(Math.abs(weekly.meanDarkHoursPerNight - every.meanDarkHoursPerNight)).toBeLessThan(0.01);
    for (let b = 0; b < 24; b++)
      expect(Math.abs(weekly.meanDarkHoursPerBin[b] - every.meanDarkHoursPerBin[b])).toBeLessThan(0.01);
    // Southern autumn to winter at −31°: long nights, from ~9 h in March to ~10.5 h in June (common
    // practice; the equinox value is checked above).
    expect(every.meanDarkHoursPerNight).toBeGreaterThan(9);
    expect(every.meanDarkHoursPerNight).toBeLessThan(10.5);
  });

  it("reports no darkness where the Sun stays above −18° all night", () => {
    // At 60° N on the June solstice the Sun's lowest altitude is φ + δ − 90° = 60 + 23.44 − 90 = −6.6°
    // (lower culmination, Meeus eq. 13.6 with H = 180°).
    const d = darkTimeOverPeriod({ latitudeDeg: 60, longitudeDeg: 10, altitudeM: 0 }, "2027-06-21", "2027-06-21");
    expect(d.nights[0]).toMatchObject({ darkHours: 0, darkStartUtc: null, darkEndUtc: null, lstAtDarkStartH: null });
    expect(sum(d.hoursPerBin)).toBe(0);
  });

  it("bins of other widths", () => {
    const d = darkTimeOverPeriod(site, "2027-03-20", "2027-03-20", { lstBins: 48 });
    expect(d.binWidthH).toBe(0.5);
    expect(d.hoursPerBin).toHaveLength(48);
    expect(sum(d.hoursPerBin)).toBeCloseTo(d.nights[0].darkHours, 9);
  });

  it("refuses a period that ends before it begins, and bad options", () => {
    expect(() => darkTimeOverPeriod(site, "2027-03-20", "2027-03-19")).toThrow(/lastNight: must not be before/);
    expect(() => darkTimeOverPeriod(site, "2027-02-30", "2027-03-19")).toThrow(/firstNight/);
    expect(() => darkTimeOverPeriod(site, "2027-03-01", "2027-03-19", { lstBins: 0 })).toThrow(/lstBins/);
    expect(() => darkTimeOverPeriod(site, "2027-03-01", "2027-03-19", { everyNights: 1.5 })).toThrow(/everyNights/);
  });
});
