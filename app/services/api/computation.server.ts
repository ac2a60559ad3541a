/**
 * The computation resource routes (`POST /api/coverage`, `/api/ephemeris`, `/api/triangles`, `/api/plan`, `/api/rank`): check
 * who asks, read the JSON body, validate it with the engine's wire schema (400), check its cost budget
 * (422), run the computation on the worker pool (503 when the pool is full, 429 when the person has
 * too many running), answer JSON. Each route module is its loader and action from here.
 */
import { requireApiUser } from "~/lib/guards.server";
import { type ApiError, jsonResponse, methodNotAllowed, readJsonBody } from "~/lib/json.server";
import { COMPUTATIONS, type ComputationName } from "./computations";
import { computePool } from "./pool.server";

const refusal = (status: number, error: string, field: string | null, headers: Record<string, string> = {}) =>
  jsonResponse({ error, field } satisfies ApiError, status, headers);

/**
 * The whole POST handler of a computation route for one person: method check, body, validation, cost
 * budget, computation on the pool. A RangeError thrown by the computation (an input the schema lets
 * through but the computation cannot use) is answered with 400 as well.
 */
export async function handleComputation(request: Request, name: ComputationName, personId: number): Promise<Response> {
  if (request.method !== "POST") return methodNotAllowed();
  const body = await readJsonBody(request);
  if (!body.ok) return body.response;
  const { parse, budget } = COMPUTATIONS[name];
  const parsed = parse(body.value);
  if (!parsed.ok) return refusal(400, parsed.message, parsed.field);
  const over = budget(parsed.value);
  if (over) return refusal(422, over.message, over.field);
  const answer = await computePool().run(name, parsed.value, personId, request.signal);
  switch (answer.kind) {
    case "done": {
      // The worker's bytes as they are, with the headers every JSON answer carries.
      const headers = jsonResponse(null).headers;
      headers.set("Content-Length", String(answer.json.byteLength));
      return new Response(answer.json as Uint8Array<ArrayBuffer>, { status: 200, headers });
    }
    case "refused":
      return refusal(400, answer.message, null);
    case "too-many":
      return refusal(429, answer.message, null, { "Retry-After": String(answer.retryAfterS) });
    case "busy":
      return refusal(503, answer.message, null, { "Retry-After": String(answer.retryAfterS) });
    case "cancelled":
      return refusal(503, "the computation was cancelled: the connection closed", null);
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
export function computationAction(name: ComputationName): (args: { request: Request }) => Promise<Response> {
  return async ({ request }) => {
    const viewer = await requireApiUser(request, "sketch:use");
    return handleComputation(request, name, viewer.user.id);
  };
}
