/**
 * JSON plumbing for resource routes: read a JSON body with a size cap and answer with JSON.
 *
 * Status codes: 200 result; 400 `{error, field}` for an empty body, invalid
 * UTF-8, bad JSON or a validation failure (field names the failing path, null
 * for the body itself); 405 for any method but POST; 413 for a body over 2 MB.
 * A bad request never produces a 500.
 */
import { readBodyCapped } from "./body.server";

/** Largest accepted request body, bytes. */
export const MAX_BODY_BYTES = 2 * 1024 * 1024;

export interface ApiError {
  error: string;
  field: string | null;
}

/** A JSON response with the given status. */
export function jsonResponse(body: unknown, status = 200, headers: Record<string, string> = {}): Response {
  return new Response(JSON.stringify(body), {
    status,
    headers: { "Content-Type": "application/json; charset=utf-8", "Cache-Control": "no-store", ...headers },
  });
}

/** 405 answer for methods other than POST. */
export function methodNotAllowed(): Response {
  return jsonResponse({ error: "method not allowed: use POST with a JSON body", field: null } satisfies ApiError, 405, {
    Allow: "POST",
  });
}

export type JsonBody = { ok: true; value: unknown } | { ok: false; response: Response };

/**
 * Reads and parses a JSON body, refusing more than `limitBytes` (checked from
 * Content-Length first, then while streaming, so a lying header cannot force
 * a large read).
 */
export async function readJsonBody(request: Request, limitBytes = MAX_BODY_BYTES): Promise<JsonBody> {
  const tooLarge = (): JsonBody => ({
    ok: false,
    response: jsonResponse(
      { error: `request body larger than ${limitBytes / (1024 * 1024)} MB`, field: null } satisfies ApiError,
      413,
    ),
  });
  const bad = (error: string): JsonBody => ({
    ok: false,
    response: jsonResponse({ error, field: null } satisfies ApiError, 400),
  });

  const read = await readBodyCapped(request, limitBytes);
  if (!read.ok) return read.reason === "too-large" ? tooLarge() : bad("request body could not be read");
  if (read.bytes.byteLength === 0) return bad("request body is empty: send a JSON object");
  const bytes = read.bytes;
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    return bad("request body is not valid UTF-8");
  }
  try {
    return { ok: true, value: JSON.parse(text) };
  } catch (e) {
    const detail = e instanceof Error ? e.message.split("\n")[0] : "parse error";
    return bad(`request body is not valid JSON: ${detail}`);
  }
}
