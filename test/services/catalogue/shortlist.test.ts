/**
 * The pure parts of the catalogue pages: the best night of a period for a target, the longest baseline
 * of a station set, the settings' rules, and "already a calibrator".
 */
import { describe, expect, it } from "vitest";
import { longestBaselineM } from "~/engine";
import { alreadyCalibrator } from "~/services/catalogue/proposal.server";
import { readShortlistSettings, shortlistValues } from "~/services/catalogue/schemas";
import { bestNightIn } from "~/services/catalogue/shortlist.server";

const GOOD = {
  target: "Vega",
  ra: "",
  dec: "",
  band: "1",
  config: "2",
  baseline: "",
  date: "2027-06-20",
  minElevation: "30",
  maxDistance: "10",
  minVis2: "0.8",
  maxMagDiff: "",
  bandLimit: "",
  targetMag: "",
  limit: "20",
};

describe("bestNightIn", () => {
  // A star crosses the meridian at local midnight when it stands opposite the Sun; the Sun is at RA 6h
  // at the June solstice and at 18h at the December one (common practice). Sidereal time gains about
  // 4 min a day, so the night is found to a few days.
  it("puts a target at RA 18h near the June solstice, one at 6h near the December one", () => {
    const june = bestNightIn({ start: "2027-03-01", end: "2027-08-31" }, 270, -68.9);
    expect(Math.abs(Date.parse(june) - Date.parse("2027-06-21"))).toBeLessThanOrEqual(4 * 86_400_000);
    const december = bestNightIn({ start: "2027-09-01", end: "2028-02-28" }, 90, -68.9);
    expect(Math.abs(Date.parse(december) - Date.parse("2027-12-21"))).toBeLessThanOrEqual(4 * 86_400_000);
  });

  it("takes the period's nearer end when the best night lies outside it", () => {
    expect(bestNightIn({ start: "2027-03-01", end: "2027-04-30" }, 270, -68.9)).toBe("2027-04-30");
    expect(bestNightIn({ start: "2027-09-01", end: "2027-09-30" }, 270, -68.9)).toBe("2027-09-01");
    expect(bestNightIn({ start: "2027-05-05", end: "2027-05-05" }, 0, 0)).toBe("2027-05-05");
  });
});

describe("longestBaselineM", () => {
  it("is the largest distance between any two stations, heights included (3–4–5 and 2–3–6–7)", () => {
    expect(longestBaselineM([])).toBe(0);
    expect(longestBaselineM([{ eastM: 1, northM: 1, upM: 0 }])).toBe(0);
    const stations = [
      { eastM: 0, northM: 0, upM: 0 },
      { eastM: 3, northM: 4, upM: 0 },
      { eastM: 2, northM: 3, upM: 6 },
    ];
    expect(longestBaselineM(stations)).toBeCloseTo(7, 12);
  });
});

describe("the shortlist settings", () => {
  it("reads good settings, with empty optional fields as null", () => {
    const read = readShortlistSettings(GOOD);
    expect(read.ok).toBe(true);
    if (!read.ok) return;
    expect(read.settings).toMatchObject({
      band: 1,
      config: 2,
      baseline: null,
      minVis2: 0.8,
      maxMagDiff: null,
      limit: 20,
    });
  });

  it.each([
    ["minElevation", "91", "Elevation limit: degrees from 0 to 90"],
    ["minElevation", "", "Elevation limit: required (degrees from 0 to 90)"],
    ["maxDistance", "0", "Within: degrees, above 0 and up to 90"],
    ["minVis2", "lots", "Smallest V²: not a number (from 0 to 1)"],
    ["baseline", "-5", "Longest baseline: metres, above 0 and up to 100000"],
    ["maxMagDiff", "0", "Magnitude range: magnitudes above 0 (or empty for no limit)"],
    ["bandLimit", "40", "Band limit: magnitudes from -30 to 30"],
    ["targetMag", "x", "Target's band magnitude: not a number (from -30 to 30)"],
    ["limit", "2.5", "Entries: a whole number from 1 to 100"],
    ["limit", "101", "Entries: a whole number from 1 to 100"],
    ["date", "10/01/2027", "Night of: use the form YYYY-MM-DD"],
    ["date", "2027-13-01", "Night of: not a real date"],
    ["band", "H", "Band: pick one from the list"],
    ["target", "x".repeat(101), "Target: at most 100 characters"],
  ])("refuses %s = %j with “%s”", (field, value, message) => {
    const read = readShortlistSettings({ ...GOOD, [field]: value });
    expect(read.ok).toBe(false);
    if (read.ok) return;
    expect(read.errors[field]).toBe(message);
  });

  it("takes each field from the address over its default, and a typed minus sign", () => {
    const values = shortlistValues(new URLSearchParams("target=Sirius&bandLimit=%E2%88%921.5&extra=1"), GOOD);
    expect(values).toMatchObject({ target: "Sirius", bandLimit: "−1.5", date: "2027-06-20" });
    expect("extra" in values).toBe(false);
    const read = readShortlistSettings(values);
    expect(read.ok && read.settings.bandLimit).toBe(-1.5);
  });
});

describe("alreadyCalibrator", () => {
  const star = { hip: 27919, name: "HIP 27919", raDeg: 88.6197, decDeg: 8.0543 };
  it("matches the same catalogue star, the same name, or a position within 60″", () => {
    expect(alreadyCalibrator([], star)).toBe(false);
    expect(alreadyCalibrator([{ name: "Other", raDeg: 0, decDeg: 0, hip: 27919 }], star)).toBe(true);
    expect(alreadyCalibrator([{ name: "hip 27919", raDeg: 0, decDeg: 0 }], star)).toBe(true);
    // 50″ north: the same star typed by hand; 90″ north: another.
    expect(alreadyCalibrator([{ name: "Mine", raDeg: 88.6197, decDeg: 8.0543 + 50 / 3600 }], star)).toBe(true);
    expect(alreadyCalibrator([{ name: "Mine", raDeg: 88.6197, decDeg: 8.0543 + 90 / 3600 }], star)).toBe(false);
  });
});

describe("calibratorShortlistHref", () => {
  it("writes an address the shortlist page reads back: the target, band, a typed baseline, the night", async () => {
    const { calibratorShortlistHref } = await import("~/components/catalogue/CalibratorPeek");
    const href = calibratorShortlistHref({
      target: "Test field",
      ra: "11:00:00",
      dec: "-36:00:00",
      band: 3,
      baselineM: 158.027,
      date: "2027-03-15",
    });
    const url = new URL(href, "http://localhost");
    expect(url.pathname).toBe("/catalogue/calibrators");
    const values = shortlistValues(url.searchParams, GOOD);
    expect(values).toMatchObject({
      target: "Test field",
      ra: "11:00:00",
      dec: "-36:00:00",
      band: "3",
      config: "",
      baseline: "158",
      date: "2027-03-15",
    });
    expect(readShortlistSettings(values).ok).toBe(true);
  });
});
