/**
 * The computation resource routes (`POST /api/coverage`, `/api/ephemeris`, `/api/triangles`): check
 * who asks, read the JSON body, validate it with the engine's wire schema, run the pure computation,
 * answer JSON. Each route module is its loader and action from here.
 */
import type { ParseResult } from "~/engine";
import { requireApiUser } from "~/lib/guards.server";
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

/** The loader of a computation route: a GET is answered 405 (after the 401 for a stranger). */
export async function computationLoader({ request }: { request: Request }): Promise<Response> {
  await requireApiUser(request);
  return methodNotAllowed();
}

/**
 * The action of a computation route. A session cookie or an API token (Authorization: Bearer) with
 * the "sketch:use" permission; 401 or 403 JSON otherwise.
 */
export function computationAction<T, R>(
  parse: (json: unknown) => ParseResult<T>,
  compute: (value: T) => R,
): (args: { request: Request }) => Promise<Response> {
  return async ({ request }) => {
    await requireApiUser(request, "sketch:use");
    return handleComputation(request, parse, compute);
  };
}
