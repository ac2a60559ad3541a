/**
 * One strict reader for numbers typed into forms, CSV cells, query strings and the environment. Pure:
 * safe in the browser. It never guesses: "0x10", "1e3" (where a plain number is expected), "12,5",
 * "1 000", "Infinity", "" and "  " are refused with a reason instead of being read as something else.
 *
 * Accepted: an optional sign ("+", "-" or the Unicode minus "−"), digits with at most one decimal
 * point ("12", "-31.4", "0.5", ".5"), and with `exponent: true` a decimal exponent ("1.65e-6").
 * Surrounding spaces are ignored.
 */
import * as v from "valibot";

export type NumberRules = {
  /** Whole numbers only ("3", not "3.5"). */
  integer?: boolean;
  min?: number;
  max?: number;
  /** Also accept scientific notation ("1.65e-6"), for quantities usually written that way. */
  exponent?: boolean;
  /** Shown after limits in messages: "must be at most 90 °". */
  unit?: string;
};

export type NumberRead = { ok: true; value: number } | { ok: false; message: string };

const PLAIN = /^[+-]?(?:\d+(?:\.\d+)?|\.\d+)$/;
const SCIENTIFIC = /^[+-]?(?:\d+(?:\.\d+)?|\.\d+)(?:[eE][+-]?\d+)?$/;

/** Unicode minus signs and dashes people paste from papers, as "-"; full-width plus as "+". */
export function normaliseSign(text: string): string {
  return text.replace(/^[\u2212\u2012\u2013\u2014\uFE63\uFF0D]/, "-").replace(/^\uFF0B/, "+");
}

function withUnit(x: number, unit?: string) {
  return unit ? `${x} ${unit}` : String(x);
}

/** Shows what was typed, shortened, so a message can quote it safely. */
function quoted(text: string): string {
  const t = text.trim();
  return `“${t.length > 24 ? `${t.slice(0, 24)}…` : t}”`;
}

/**
 * Reads `text` as a number under `rules`. The message is a fragment to follow a field's name:
 * "must be a plain number such as 12.5 (got “0x10”)".
 */
export function parseNumber(text: string | null | undefined, rules: NumberRules = {}): NumberRead {
  const raw = typeof text === "string" ? text : "";
  const t = normaliseSign(raw.trim());
  if (t === "") return { ok: false, message: "is required" };
  const example = rules.integer ? "such as 12" : rules.exponent ? "such as 12.5 or 1.65e-6" : "such as 12.5";
  const kind = rules.integer ? "a whole number" : "a plain number";
  if (!(rules.exponent ? SCIENTIFIC : PLAIN).test(t)) {
    return { ok: false, message: `must be ${kind} ${example} (got ${quoted(raw)})` };
  }
  const value = Number(t);
  if (!Number.isFinite(value)) return { ok: false, message: `is too large (got ${quoted(raw)})` };
  if (rules.integer && !Number.isInteger(value)) return { ok: false, message: `must be a whole number ${example}` };
  if (rules.integer && !Number.isSafeInteger(value)) return { ok: false, message: `is too large (got ${quoted(raw)})` };
  if (rules.min !== undefined && value < rules.min) {
    return { ok: false, message: `must be at least ${withUnit(rules.min, rules.unit)}` };
  }
  if (rules.max !== undefined && value > rules.max) {
    return { ok: false, message: `must be at most ${withUnit(rules.max, rules.unit)}` };
  }
  return { ok: true, value: Object.is(value, -0) ? 0 : value };
}

/**
 * The valibot form of `parseNumber`, for form schemas: a string in, a number out, or one issue with
 * `label` and the reason ("Lifetime must be a whole number such as 12").
 */
export function strictNumber(label: string, rules: NumberRules = {}) {
  return v.pipe(
    v.string(`${label} is required`),
    v.rawTransform(({ dataset, addIssue, NEVER }) => {
      const read = parseNumber(dataset.value, rules);
      if (read.ok) return read.value;
      addIssue({ message: `${label} ${read.message}` });
      return NEVER;
    }),
  );
}
