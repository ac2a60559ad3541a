/**
 * Wire schema of `cli resolve` / `POST /api/resolve`: `{"name": "HD 39801"}`. Failures are one line
 * `field: reason`, as for the other requests.
 */
import * as v from "valibot";
import type { ResolveInput } from "../catalogue/types";
import { formatIssues, type ParseResult } from "./requests";

/** Longest name accepted, characters. */
export const MAX_NAME_LENGTH = 100;

/** A typed star name: trimmed, not empty, at most MAX_NAME_LENGTH characters. */
export const StarNameSchema = v.pipe(
  v.string("must be a string"),
  v.trim(),
  v.minLength(1, "must not be empty"),
  v.maxLength(MAX_NAME_LENGTH, `must be at most ${MAX_NAME_LENGTH} characters`),
);

export const ResolveRequestSchema = v.object({ name: StarNameSchema }, "request must be a JSON object");

type Same<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
const schemaMatchesInput: Same<v.InferOutput<typeof ResolveRequestSchema>, ResolveInput> = true;
void schemaMatchesInput;

/** Validates a resolve request (already parsed from JSON). */
export function parseResolveRequest(json: unknown): ParseResult<ResolveInput> {
  if (typeof json !== "object" || json === null || Array.isArray(json)) {
    return { ok: false, message: "request must be a JSON object", field: null };
  }
  const result = v.safeParse(ResolveRequestSchema, json);
  return result.success ? { ok: true, value: result.output } : { ok: false, ...formatIssues(result.issues) };
}
