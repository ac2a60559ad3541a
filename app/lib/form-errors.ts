/**
 * Validation issues → field errors, one shape for every form: `{ [field]: message }`, the first
 * message per field, keyed by the dotted path of the field ("stations.0.name"), "form" for the whole.
 */
import * as v from "valibot";

export type FieldErrors = Record<string, string>;

/**
 * The first message per field of a failed parse. `depth: 1` keys by the top-level field only (a form
 * whose nested values are shown under one input).
 */
export function fieldErrors(issues: readonly v.BaseIssue<unknown>[], options: { depth?: number } = {}): FieldErrors {
  const out: FieldErrors = {};
  for (const issue of issues) {
    const path = (issue.path ?? []).slice(0, options.depth ?? Number.POSITIVE_INFINITY);
    const key = path.map((p) => String(p.key)).join(".") || "form";
    out[key] ??= issue.message;
  }
  return out;
}

/** "must be a number" → "Must be a number." for display under a field. */
export function sentence(fragment: string): string {
  const s = fragment.charAt(0).toUpperCase() + fragment.slice(1);
  return /[.!?)]$/.test(s) ? s : `${s}.`;
}

/**
 * `schema` for a form field that may be left out of the post: a missing field reads as "", so the
 * field's own rule answers with its own message (valibot would otherwise say "Invalid key").
 */
export function sentField<T extends v.GenericSchema<string, unknown>>(schema: T) {
  return v.pipe(v.optional(v.string(), ""), schema);
}
