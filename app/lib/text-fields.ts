/** Valibot rules for typed text in forms, shared by the features' schemas: trimmed, with a length limit. */
import * as v from "valibot";

/** Trimmed text of at most `max` characters, possibly empty; too long reads "<label>: at most N characters". */
export const labelledText = (label: string, max: number) =>
  v.pipe(v.string(), v.trim(), v.maxLength(max, `${label}: at most ${max} characters`));

/** Trimmed text that must not be empty, of at most `max` characters, with the form's own two messages. */
export const requiredText = (max: number, messages: { empty: string; tooLong: string }) =>
  v.pipe(v.string(), v.trim(), v.nonEmpty(messages.empty), v.maxLength(max, messages.tooLong));
