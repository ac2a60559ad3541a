/**
 * Wire schema of `cli resolve` / `POST /api/resolve`: `{"name": "HD 39801"}`. Failures are one line
 * `field: reason`, as for the other requests.
 */
import * as v from "valibot";
import type { ResolveInput } from "../catalogue/types";
import { type ParseResult, parseRequest, trimmedName } from "./blocks";

/** Longest name accepted, characters. */
export const MAX_NAME_LENGTH = 100;

/** A typed star name: trimmed, not empty, at most MAX_NAME_LENGTH characters. */
export const StarNameSchema = trimmedName(MAX_NAME_LENGTH);

export const ResolveRequestSchema = v.object({ name: StarNameSchema }, "request must be a JSON object");

/** Validates a resolve request (already parsed from JSON). */
export function parseResolveRequest(json: unknown): ParseResult<ResolveInput> {
  return parseRequest(ResolveRequestSchema, json);
}
