/**
 * The shared valibot rules for environment values (lib/env-values.ts) and typed form text
 * (lib/text-fields.ts): what they accept, what they turn it into, and the message of each refusal.
 */
import * as v from "valibot";
import { describe, expect, it } from "vitest";
import { envPort, envWholeNumber } from "~/lib/env-values";
import { labelledText, requiredText } from "~/lib/text-fields";

const message = (schema: v.GenericSchema, input: unknown) => {
  const result = v.safeParse(schema, input);
  return result.success ? null : result.issues[0].message;
};

describe("envWholeNumber", () => {
  const rule = envWholeNumber(2, 900);
  it("reads digits as a number within the range", () => {
    expect(v.parse(rule, "2")).toBe(2);
    expect(v.parse(rule, "900")).toBe(900);
  });
  it.each([
    ["2.5", "must be a whole number"],
    ["-3", "must be a whole number"],
    ["0x10", "must be a whole number"],
    ["1", "must be at least 2"],
    ["901", "must be at most 900"],
  ])("refuses %j: %s", (input, expected) => {
    expect(message(rule, input)).toBe(expected);
  });
  it("names the unit when given one", () => {
    expect(message(envWholeNumber(100, 1000, "of milliseconds"), "1e3")).toBe("must be a whole number of milliseconds");
  });
});

describe("envPort", () => {
  const rule = envPort("2525");
  it("reads a port and falls back to the default when unset", () => {
    expect(v.parse(rule, "465")).toBe(465);
    expect(v.parse(rule, undefined)).toBe(2525);
  });
  it.each(["0", "65536", "123456", "smtp"])("refuses %j", (input) => {
    expect(message(rule, input)).toBe("must be a port number");
  });
});

describe("labelledText and requiredText", () => {
  it("trims, allows empty text and names the field when too long", () => {
    const rule = labelledText("Note", 5);
    expect(v.parse(rule, "  abc  ")).toBe("abc");
    expect(v.parse(rule, "   ")).toBe("");
    expect(message(rule, "abcdef")).toBe("Note: at most 5 characters");
  });
  it("refuses empty or over-long text with the form's own messages", () => {
    const rule = requiredText(3, { empty: "Name: give a name", tooLong: "Name: at most 3 characters" });
    expect(v.parse(rule, " ab ")).toBe("ab");
    expect(message(rule, "  ")).toBe("Name: give a name");
    expect(message(rule, "abcd")).toBe("Name: at most 3 characters");
  });
});
