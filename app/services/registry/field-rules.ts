/**
 * Field rules of the array registry, written once for the admin forms and the imports alike: a value
 * arrives as form text, a CSV cell or a JSON value, and the rule reads it and names what is wrong
 * with an error fragment ("must be a number"; `sentence()` of lib/form-errors turns it into a line).
 */
import * as v from "valibot";

const NUMBER_TEXT = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

/** Reads a number typed in a form or a file: text or a JSON number; an error fragment otherwise. */
export function readNumber(raw: unknown): { value: number } | { error: string } {
  if (raw === undefined || raw === null) return { error: "is required" };
  if (typeof raw === "number") return Number.isFinite(raw) ? { value: raw } : { error: "must be a finite number" };
  if (typeof raw !== "string") return { error: "must be a number" };
  const text = raw.trim().replace(/\u2212/g, "-");
  if (text === "") return { error: "is required" };
  if (NUMBER_TEXT.test(text)) return { value: Number(text) };
  if (/^[+-]?\d*,\d+$/.test(text))
    return { error: `must be a number with a point for decimals (${text.replace(",", ".")}, not ${text})` };
  return { error: "must be a number" };
}

export type NumberRule = {
  min?: number;
  max?: number;
  above?: number;
  below?: number;
  integer?: boolean;
  unit?: string;
};

const withUnit = (x: number, unit?: string) => (unit ? `${x} ${unit}` : String(x));

/** The first rule a number breaks, as an error fragment; null when it keeps them all. */
function brokenRule(x: number, rule: NumberRule): string | null {
  if (rule.integer && !Number.isInteger(x)) return "must be a whole number";
  if (rule.above !== undefined && !(x > rule.above)) {
    return rule.max !== undefined
      ? `must be greater than ${rule.above} and at most ${withUnit(rule.max, rule.unit)}`
      : `must be greater than ${withUnit(rule.above, rule.unit)}`;
  }
  if (rule.min !== undefined && rule.max !== undefined && (x < rule.min || x > rule.max)) {
    return `must be between ${rule.min} and ${withUnit(rule.max, rule.unit)}`;
  }
  if (rule.min !== undefined && x < rule.min) return `must be at least ${withUnit(rule.min, rule.unit)}`;
  if (rule.max !== undefined && x > rule.max) return `must be at most ${withUnit(rule.max, rule.unit)}`;
  return null;
}

/** A number from a form field, a CSV cell or a JSON value, with a range and an error naming the rule. */
export function numberField(rule: NumberRule) {
  return v.pipe(
    v.unknown(),
    v.rawTransform<unknown, number>(({ dataset, addIssue, NEVER }) => {
      const read = readNumber(dataset.value);
      const message = "error" in read ? read.error : brokenRule(read.value, rule);
      if (message === null && "value" in read) return read.value;
      addIssue({ message: message ?? "must be a number" });
      return NEVER;
    }),
  );
}

type TextRule = { required?: boolean; max: number; pattern?: RegExp; patternMessage?: string };

/** Text from a form field, a CSV cell or a JSON string, trimmed. */
export function textField(rule: TextRule) {
  return v.pipe(
    v.unknown(),
    v.rawTransform<unknown, string>(({ dataset, addIssue, NEVER }) => {
      const raw = dataset.value;
      if (raw !== undefined && raw !== null && typeof raw !== "string") {
        addIssue({ message: "must be text" });
        return NEVER;
      }
      const text = (raw ?? "").trim();
      let message: string | null = null;
      if (rule.required !== false && text === "") message = "is required";
      else if (text.length > rule.max) message = `must be at most ${rule.max} characters`;
      else if (text !== "" && rule.pattern && !rule.pattern.test(text))
        message = rule.patternMessage ?? "has characters that are not allowed";
      if (message === null) return text;
      addIssue({ message });
      return NEVER;
    }),
  );
}

/** A yes/no value: a checkbox ("on" or absent), true/false, yes/no, 1/0. */
export function booleanField(whenMissing: boolean) {
  return v.pipe(
    v.unknown(),
    v.rawTransform<unknown, boolean>(({ dataset, addIssue, NEVER }) => {
      const raw = dataset.value;
      if (raw === undefined || raw === null || raw === "") return whenMissing;
      if (typeof raw === "boolean") return raw;
      if (typeof raw === "string") {
        const t = raw.trim().toLowerCase();
        if (["on", "true", "yes", "1"].includes(t)) return true;
        if (["off", "false", "no", "0"].includes(t)) return false;
      }
      addIssue({ message: "must be true or false" });
      return NEVER;
    }),
  );
}

/** An IANA time zone name (e.g. America/Argentina/San_Juan, or UTC). */
export function isTimeZone(name: string): boolean {
  if (!/^[A-Za-z0-9_+\-/]+$/.test(name)) return false;
  try {
    new Intl.DateTimeFormat("en", { timeZone: name });
    return true;
  } catch {
    return false;
  }
}

export const isRecord = (x: unknown): x is Record<string, unknown> =>
  typeof x === "object" && x !== null && !Array.isArray(x);

/**
 * An object of the given fields where a missing field is reported by the field's own rule ("is
 * required"), not as an unknown key; fields that are not listed are dropped.
 */
export function fields<const TEntries extends v.ObjectEntries>(entries: TEntries) {
  const keys = Object.keys(entries);
  return v.pipe(
    v.unknown(),
    v.transform((input) => (isRecord(input) ? Object.fromEntries(keys.map((k) => [k, input[k]])) : input)),
    v.object(entries),
  );
}
