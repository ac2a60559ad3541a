/**
 * The computation resource routes (`POST /api/coverage`, `/api/ephemeris`, `/api/triangles`): read
 * the JSON body, validate it with the engine's wire schema, run the pure computation, answer JSON.
 */
import type { ParseResult } from "~/engine";
import { type ApiError, jsonResponse, methodNotAllowed, readJsonBody } from "~/lib/json.server";

/**
 * The whole POST handler of a computation route: method check, body, validation,
 * computation. A RangeError thrown by the computation (an input the schema lets
 * through but the computation cannot use) is answered with 400 as well.
 */
export async function handleComputation<T, R>(
  request: Request,
  parse: (json: unknown) => ParseResult<T>,
  compute: (value: T) => R,
): Promise<Response> {
  if (request.method !== "POST") return methodNotAllowed();
  const body = await readJsonBody(request);
  if (!body.ok) return body.response;
  const parsed = parse(body.value);
  if (!parsed.ok) return jsonResponse({ error: parsed.message, field: parsed.field } satisfies ApiError, 400);
  try {
    return jsonResponse(compute(parsed.value), 200);
  } catch (e) {
    if (e instanceof RangeError) return jsonResponse({ error: e.message, field: null } satisfies ApiError, 400);
    throw e;
  }
}
