/**
 * Building blocks of every wire schema in engine/api: the number, count and name rules with one wording,
 * the one-line issue format and the parse step every request goes through. Pure: no I/O.
 */
import * as v from "valibot";

// ---------------------------------------------------------------- field rules

export const numberMsg = "must be a number";

/** Any finite number. */
export const finiteNumber = () => v.pipe(v.number(numberMsg), v.finite("must be a finite number"));

/** A finite number in [min, max]. */
export const between = (min: number, max: number) =>
  v.pipe(
    finiteNumber(),
    v.minValue(min, `must be between ${min} and ${max}`),
    v.maxValue(max, `must be between ${min} and ${max}`),
  );

/** A finite number above zero. */
export const positive = () => v.pipe(finiteNumber(), v.gtValue(0, "must be positive"));

/** A finite number above zero and at most `max` (the message may name the unit). */
export const positiveUpTo = (max: number, message = `must be at most ${max}`) =>
  v.pipe(positive(), v.maxValue(max, message));

/** A finite number, zero or above. */
export const nonNegative = () => v.pipe(finiteNumber(), v.minValue(0, "must be zero or positive"));

/** A wavelength in metres, above zero and at most `max`. */
export const wavelengthUpTo = (max: number) => positiveUpTo(max, `must be at most ${max} (wavelengths are in metres)`);

/** A whole number in [min, max]. */
export const wholeBetween = (min: number, max: number) =>
  v.pipe(
    v.number(numberMsg),
    v.integer("must be a whole number"),
    v.minValue(min, `must be between ${min} and ${max}`),
    v.maxValue(max, `must be between ${min} and ${max}`),
  );

/** A count from 1 to `max`. */
export const countUpTo = (max: number) =>
  v.pipe(
    v.number(numberMsg),
    v.integer("must be a whole number"),
    v.minValue(1, "must be at least 1"),
    v.maxValue(max, `must be at most ${max}`),
  );

/** A typed name: trimmed, not empty, at most `maxLength` characters. */
export const trimmedName = (maxLength: number) =>
  v.pipe(
    v.string("must be a string"),
    v.trim(),
    v.minLength(1, "must not be empty"),
    v.maxLength(maxLength, `must be at most ${maxLength} characters`),
  );

// ---------------------------------------------------------------- issue formatting and parsing

export type ParseResult<T> = { ok: true; value: T } | { ok: false; message: string; field: string | null };

/** A rule over several fields: the field to change and why, or null when the rule holds. */
export type CrossFieldRule<T> = (value: T) => { message: string; field: string } | null;

/**
 * Dotted path of an issue: object keys joined by ".", array indices in
 * brackets, e.g. `stations[2].name` or `target.model.components[0].flux`;
 * null for the request itself.
 */
export function issuePath(issue: v.BaseIssue<unknown>): string | null {
  if (!issue.path || issue.path.length === 0) return null;
  let out = "";
  for (const item of issue.path) {
    const key = item.key as unknown;
    if (typeof key === "number") out += `[${key}]`;
    else out += out === "" ? String(key) : `.${String(key)}`;
  }
  return out === "" ? null : out;
}

/**
 * One-line message for the first issue of a failed parse:
 * `field.path: message`. A missing required field reads `x: is required`.
 */
export function formatIssues(issues: readonly v.BaseIssue<unknown>[]): { message: string; field: string | null } {
  const issue = issues[0];
  const field = issuePath(issue);
  const missing = issue.input === undefined && issue.kind === "schema" && field !== null;
  const text = (missing ? "is required" : issue.message).replace(/\s+/g, " ");
  return { message: field ? `${field}: ${text}` : text, field };
}

/** Parses without the object check (for bodies the caller wraps itself); failures in the one-line form. */
export function parseValue<S extends v.GenericSchema>(schema: S, input: unknown): ParseResult<v.InferOutput<S>> {
  const result = v.safeParse(schema, input);
  if (!result.success) return { ok: false, ...formatIssues(result.issues) };
  return { ok: true, value: result.output as v.InferOutput<S> };
}

/**
 * Validates a request already parsed from JSON: it must be an object, then match `schema`, then pass
 * `crossField` (the rules over several fields) when given.
 */
export function parseRequest<S extends v.GenericSchema>(
  schema: S,
  input: unknown,
  crossField?: CrossFieldRule<v.InferOutput<S>>,
): ParseResult<v.InferOutput<S>> {
  if (typeof input !== "object" || input === null || Array.isArray(input)) {
    return { ok: false, message: "request must be a JSON object", field: null };
  }
  const parsed = parseValue(schema, input);
  if (!parsed.ok) return parsed;
  const failure = crossField?.(parsed.value);
  if (failure) return { ok: false, message: `${failure.field}: ${failure.message}`, field: failure.field };
  return parsed;
}
