import { describe, expect, it } from "vitest";
import { formatDeclination, formatRightAscension, parseDeclination, parseRightAscension } from "~/lib/coordinates";

function deg(result: ReturnType<typeof parseRightAscension>): number {
  if (!result.ok) throw new Error(`expected a value, got: ${result.message}`);
  return result.deg;
}
function message(result: ReturnType<typeof parseRightAscension>): string {
  if (result.ok) throw new Error(`expected a failure, got ${result.deg}`);
  return result.message;
}

describe("right ascension", () => {
  it("reads the sexagesimal hours of Meeus example 13.b", () => {
    // Meeus, Astronomical Algorithms 2nd ed., ex. 13.b: α = 23h09m16.641s = 347.3193375°
    // (23 + 9/60 + 16.641/3600 = 23.1546225 h × 15).
    for (const text of ["23:09:16.641", "23 09 16.641", "23h09m16.641s", " 23h 09m 16.641s "]) {
      expect(deg(parseRightAscension(text))).toBeCloseTo(347.3193375, 9);
    }
  });

  it("reads the example of the project conventions in both notations", () => {
    // CONVENTIONS.md request example: raDeg 84.05; 84.05° / 15 = 5.60333 h = 05h36m12.0s (common practice: 1 h = 15°).
    expect(deg(parseRightAscension("84.05"))).toBeCloseTo(84.05, 12);
    expect(deg(parseRightAscension("84.05°"))).toBeCloseTo(84.05, 12);
    expect(deg(parseRightAscension("84.05d"))).toBeCloseTo(84.05, 12);
    expect(deg(parseRightAscension("05:36:12"))).toBeCloseTo(84.05, 12);
    expect(deg(parseRightAscension("5.603333333333h"))).toBeCloseTo(84.05, 8);
  });

  it("accepts hours and decimal minutes without seconds", () => {
    // 05h36.2m = 5 + 36.2/60 h = 5.6033 h = 84.05° (common practice).
    expect(deg(parseRightAscension("05:36.2"))).toBeCloseTo(84.05, 10);
    expect(deg(parseRightAscension("0:0:0"))).toBe(0);
  });

  it("refuses out-of-range parts and negative values with messages that name the field", () => {
    expect(message(parseRightAscension("24:00:00"))).toBe("Right ascension: hours must be from 0 to 23 (got 24)");
    expect(message(parseRightAscension("05:75:00"))).toBe("Right ascension: minutes must be below 60 (got 75)");
    expect(message(parseRightAscension("05:36:60"))).toBe("Right ascension: seconds must be below 60 (got 60)");
    expect(message(parseRightAscension("360"))).toBe("Right ascension: must be below 360° (got 360°)");
    expect(message(parseRightAscension("25h"))).toBe("Right ascension: must be below 24 h (got 25 h)");
    expect(message(parseRightAscension("-10"))).toMatch(/^Right ascension: cannot be negative/);
    expect(message(parseRightAscension(""))).toMatch(/^Right ascension: required/);
  });

  it("refuses text it cannot read, quoting it back", () => {
    for (const text of ["abc", "05:3a:00", "05:36:12:00", "05.5:36", "1e3"]) {
      expect(message(parseRightAscension(text))).toMatch(/^Right ascension: could not read/);
    }
  });
});

describe("declination", () => {
  it("reads the declination of Meeus example 13.b in several notations", () => {
    // Meeus ex. 13.b: δ = −6°43′11.61″ = −(6 + 43/60 + 11.61/3600)° = −6.71989167°.
    for (const text of ["-06:43:11.61", "-6 43 11.61", "−06°43′11.61″", "-06d43m11.61s", "-06°43'11.61\""]) {
      expect(deg(parseDeclination(text))).toBeCloseTo(-6.719891667, 8);
    }
  });

  it("keeps the sign of a declination between 0 and -1 degree", () => {
    // A classic slip: parseFloat("-00") is -0, so the sign must come from the text (common practice).
    expect(deg(parseDeclination("-00:30:00"))).toBeCloseTo(-0.5, 12);
    expect(deg(parseDeclination("+00:30:00"))).toBeCloseTo(0.5, 12);
    expect(deg(parseDeclination("-0.5"))).toBeCloseTo(-0.5, 12);
  });

  it("reads decimal degrees and the poles", () => {
    expect(deg(parseDeclination("-1.2"))).toBeCloseTo(-1.2, 12);
    expect(deg(parseDeclination("+90"))).toBe(90);
    expect(deg(parseDeclination("-90:00:00"))).toBe(-90);
  });

  it("refuses impossible values with messages that name the field", () => {
    expect(message(parseDeclination("-95"))).toBe("Declination: must be between -90° and +90° (got -95°)");
    expect(message(parseDeclination("-90:00:01"))).toMatch(/^Declination: must be between -90° and \+90°/);
    expect(message(parseDeclination("10:60:00"))).toBe("Declination: minutes must be below 60 (got 60)");
    expect(message(parseDeclination("12h"))).toMatch(/^Declination: could not read "12h"/);
    expect(message(parseDeclination("north"))).toMatch(/^Declination: could not read/);
    expect(message(parseDeclination("  "))).toMatch(/^Declination: required/);
  });
});

describe("formatting", () => {
  it("writes Meeus example 13.b back in sexagesimal", () => {
    // Meeus ex. 13.b: α = 23h09m16.641s, δ = −6°43′11.61″.
    expect(formatRightAscension(347.3193375, 3)).toBe("23:09:16.641");
    expect(formatDeclination(-6.719891667, 2)).toBe("-06:43:11.61");
  });

  it("carries rounded seconds into minutes and hours", () => {
    // 59.996 s rounds to 60.00 s: the minute and hour carry (common practice).
    expect(formatRightAscension((23 + 59 / 60 + 59.996 / 3600) * 15, 2)).toBe("00:00:00.00");
    expect(formatDeclination(-(1 + 59 / 60 + 59.99 / 3600), 1)).toBe("-02:00:00.0");
  });

  it("round-trips through the parser", () => {
    for (const raDeg of [0, 0.001, 84.05, 180, 359.999]) {
      expect(deg(parseRightAscension(formatRightAscension(raDeg, 4)))).toBeCloseTo(raDeg, 5);
    }
    for (const decDeg of [-90, -45.5, -0.25, 0, 12.3456, 89.9]) {
      expect(deg(parseDeclination(formatDeclination(decDeg, 3)))).toBeCloseTo(decDeg, 5);
    }
  });
});
