/**
 * The star-catalogue resource routes: `POST /api/resolve` and `POST /api/calibrators` take the bodies of
 * `cli resolve` and `cli calibrators` (docs/cli-catalogue.md) and answer the same JSON; a refusal the
 * command line prints as `error: <field>: <reason>` is a 400 `{error: "<field>: <reason>", field}`.
 * `GET /api/stars?q=…` serves the name field's suggestions as one types.
 */
import {
  type CalibratorsResponse,
  type ParseResult,
  parseCalibratorsRequest,
  parseResolveRequest,
  type ResolveResponse,
} from "~/engine";
import { requireApiUser } from "~/lib/guards.server";
import { type ApiError, jsonResponse, methodNotAllowed, readJsonBody } from "~/lib/json.server";
import { resolveName, starSuggestions } from "~/services/catalogue/lookup.server";
import { parseSuggestionQuery } from "~/services/catalogue/schemas";
import { shortlistForRequest } from "~/services/catalogue/shortlist.server";

type Refusable<R> = { ok: true; value: R } | { ok: false; field: string; message: string };

/** A POST route whose computation may refuse a valid request (an unknown name), naming the field. */
function refusableAction<T, R>(parse: (json: unknown) => ParseResult<T>, compute: (value: T) => Refusable<R>) {
  return async ({ request }: { request: Request }): Promise<Response> => {
    await requireApiUser(request, "sketch:use");
    if (request.method !== "POST") return methodNotAllowed();
    const body = await readJsonBody(request);
    if (!body.ok) return body.response;
    const parsed = parse(body.value);
    if (!parsed.ok) return jsonResponse({ error: parsed.message, field: parsed.field } satisfies ApiError, 400);
    const result = compute(parsed.value);
    if (!result.ok) {
      return jsonResponse({ error: `${result.field}: ${result.message}`, field: result.field } satisfies ApiError, 400);
    }
    return jsonResponse(result.value, 200);
  };
}

export const resolveAction = refusableAction(parseResolveRequest, ({ name }): Refusable<ResolveResponse> => {
  const r = resolveName(name);
  return r.ok ? { ok: true, value: r.star } : { ok: false, field: "name", message: r.message };
});

export const calibratorsAction = refusableAction(
  parseCalibratorsRequest,
  (input): Refusable<CalibratorsResponse> => shortlistForRequest(input),
);

/** `GET /api/stars?q=…`: the star the text names and the names to offer (StarSuggestions). */
export async function starsLoader({ request }: { request: Request }): Promise<Response> {
  await requireApiUser(request, "sketch:use");
  const query = parseSuggestionQuery(new URL(request.url).searchParams);
  if (!query.ok) return jsonResponse({ error: query.message, field: query.field } satisfies ApiError, 400);
  return jsonResponse(starSuggestions(query.value.q, query.value.limit), 200, {
    "Cache-Control": "private, max-age=60",
  });
}
