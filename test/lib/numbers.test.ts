import * as v from "valibot";
import { describe, expect, it } from "vitest";
import { parseNumber, strictNumber } from "~/lib/numbers";

const value = (text: string, rules = {}) => {
  const read = parseNumber(text, rules);
  return read.ok ? read.value : read.message;
};

describe("the strict number reader", () => {
  it("reads plain decimal numbers, with a sign or the Unicode minus", () => {
    expect(value("12")).toBe(12);
    expect(value(" -31.4 ")).toBe(-31.4);
    expect(value("\u221231.4")).toBe(-31.4);
    expect(value("+2.5")).toBe(2.5);
    expect(value(".5")).toBe(0.5);
    expect(value("-0")).toBe(0);
  });

  it("refuses what other readers silently turn into a different number", () => {
    // Number("0x10") is 16 and Number("1e3") is 1000: both were once read as hours.
    for (const text of [
      "0x10",
      "1e3",
      "0b11",
      "0o17",
      "1_000",
      "1 000",
      "12,5",
      "Infinity",
      "NaN",
      "5.",
      "--1",
      "1.2.3",
    ]) {
      const read = parseNumber(text);
      expect(read.ok, text).toBe(false);
      if (!read.ok) expect(read.message).toMatch(/must be a plain number such as 12\.5 \(got “/);
    }
    expect(parseNumber("")).toEqual({ ok: false, message: "is required" });
    expect(parseNumber("   ")).toEqual({ ok: false, message: "is required" });
    expect(parseNumber(undefined)).toEqual({ ok: false, message: "is required" });
  });

  it("accepts scientific notation only where it is asked for", () => {
    expect(value("1.65e-6", { exponent: true })).toBe(1.65e-6);
    expect(value("1.65e-6")).toMatch(/plain number/);
    expect(value("0x10", { exponent: true })).toMatch(/plain number such as 12\.5 or 1\.65e-6/);
    expect(value("1e999", { exponent: true })).toMatch(/too large/);
  });

  it("checks whole numbers and limits, naming the limit and its unit", () => {
    expect(value("3", { integer: true })).toBe(3);
    expect(value("3.5", { integer: true })).toMatch(/whole number/);
    expect(value("99999999999999999999", { integer: true })).toMatch(/too large/);
    expect(value("91", { max: 90, unit: "°" })).toBe("must be at most 90 °");
    expect(value("-1", { min: 0 })).toBe("must be at least 0");
    expect(value("90", { max: 90 })).toBe(90);
  });

  it("gives valibot schemas one issue naming the field", () => {
    const schema = v.object({ hours: strictNumber("Hours", { min: 0, max: 24 }) });
    expect(v.parse(schema, { hours: "2.5" })).toEqual({ hours: 2.5 });
    const bad = v.safeParse(schema, { hours: "0x10" });
    expect(bad.success).toBe(false);
    if (!bad.success) {
      expect(bad.issues).toHaveLength(1);
      expect(bad.issues[0].message).toBe("Hours must be a plain number such as 12.5 (got “0x10”)");
      expect(bad.issues[0].path?.[0].key).toBe("hours");
    }
  });
});
