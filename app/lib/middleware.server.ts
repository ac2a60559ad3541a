/**
 * The root middleware's checks, shared by every page and resource route (app/root.tsx lists them in
 * order). Each answers a client's mistake or a passing outage with its own 4xx or 503, a readable
 * page for pages and `{error, field}` JSON under /api/, so no route has to repeat them:
 *
 * - `finishResponse` (outermost): the security headers; Retry-After on every 503.
 * - `checkRequest`: NUL characters in the address (400); a body the app server refused or whose
 *   declared length is over what its content type allows (413); a content type the route cannot
 *   read (415); a form with a NUL character in a field (400, naming the field).
 * - `answerFailures` (innermost, around the loaders and actions): a request that failed because the
 *   database did not answer (503), because its body was cut off at the cap (413), or because the
 *   database refused a value the app let through (400), recorded by `handleError`.
 */
import { data, type MiddlewareFunction } from "react-router";
import { bodyRefusalContext, type RequestFailure, requestFailureContext } from "~/context";
import {
  CONTENT_TYPE_MAX_BYTES,
  declaredLength,
  FORM_MEDIA_TYPES,
  formProblem,
  mediaType,
  parseForm,
  REQUEST_BODY_MAX_BYTES,
  readBodyCapped,
} from "./body.server";
import { withSecurityHeaders } from "./security-headers.server";

/** Seconds a client is asked to wait after a 503. */
export const RETRY_AFTER_SECONDS = 30;

const BODYLESS = new Set(["GET", "HEAD", "OPTIONS"]);

function isApi(request: Request): boolean {
  return new URL(request.url).pathname.startsWith("/api/");
}

/** The answer to a refused request: JSON `{error, field}` under /api/, else the error page. */
export function refuse(request: Request, status: number, message: string, headers: Record<string, string> = {}) {
  if (isApi(request)) {
    return Response.json(
      { error: message, field: null },
      { status, headers: { "Cache-Control": "no-store", ...headers } },
    );
  }
  return data(message, { status, headers });
}

const megabytes = (n: number) => `${Math.round((n / (1024 * 1024)) * 10) / 10} MB`;

export const finishResponse: MiddlewareFunction<Response> = async ({ request }, next) => {
  const response = withSecurityHeaders(request, await next());
  if (response.status === 503 && !response.headers.has("Retry-After")) {
    response.headers.set("Retry-After", String(RETRY_AFTER_SECONDS));
  }
  return response;
};

/** True when the request comes with a body to read (a declared non-zero length, or a chunked one). */
function hasBody(request: Request): boolean {
  const length = declaredLength(request);
  if (length !== null) return length > 0;
  return request.headers.has("Transfer-Encoding") || (request.body !== null && request.headers.has("Content-Type"));
}

function acceptedTypes(request: Request): readonly string[] {
  return isApi(request) ? ["application/json"] : FORM_MEDIA_TYPES;
}

export const checkRequest: MiddlewareFunction<Response> = async ({ request, context }, next) => {
  const url = new URL(request.url);
  if (/%00/.test(url.pathname + url.search) || url.pathname.includes("\u0000")) {
    throw refuse(request, 400, "The address contains a NUL character (%00); remove it and try again.");
  }
  if (BODYLESS.has(request.method.toUpperCase())) return next();

  const refusal = context.get(bodyRefusalContext);
  if (refusal) throw refuse(request, 413, `The request is larger than ${megabytes(refusal.limitBytes)}.`);
  if (!hasBody(request)) return next();

  const type = mediaType(request);
  const accepted = acceptedTypes(request);
  if (!accepted.includes(type) && !(isApi(request) && type.endsWith("+json"))) {
    const wanted = accepted.join(" or ");
    throw refuse(request, 415, type ? `This address takes ${wanted}, not ${type}.` : `Send the body as ${wanted}.`);
  }
  const cap = CONTENT_TYPE_MAX_BYTES[type as keyof typeof CONTENT_TYPE_MAX_BYTES] ?? REQUEST_BODY_MAX_BYTES;
  const length = declaredLength(request);
  if (length !== null && length > cap) {
    void request.body?.cancel().catch(() => undefined);
    throw refuse(request, 413, `The request is larger than ${megabytes(cap)}.`);
  }
  if (FORM_MEDIA_TYPES.includes(type)) {
    // A copy of the body, counted against the cap (also when it comes chunked, without a length) and
    // parsed once here, so every form route gets the same checks whoever reads the body later.
    const copy = request.clone();
    const read = await readBodyCapped(copy, cap);
    if (!read.ok) {
      if (read.reason === "too-large" || context.get(bodyRefusalContext)) {
        throw refuse(request, 413, `The request is larger than ${megabytes(cap)}.`);
      }
      throw refuse(request, 400, "The form could not be read; please send it again.");
    }
    const form = await parseForm(copy, read.bytes);
    if (!form) throw refuse(request, 400, "The form could not be read; please send it again.");
    const problem = formProblem(form);
    if (problem) throw refuse(request, 400, problem);
  }
  return next();
};

const FAILURE_ANSWERS: Record<RequestFailure, { status: number; message: string }> = {
  "database-unavailable": {
    status: 503,
    message:
      "Fringe Docket cannot reach its database just now. Nothing was saved half-way; please try again in a minute.",
  },
  "body-too-large": { status: 413, message: `The request is larger than ${megabytes(REQUEST_BODY_MAX_BYTES)}.` },
  "database-refused-input": {
    status: 400,
    message: "A value in the request could not be stored as sent (out of range or malformed); nothing was saved.",
  },
};

export const answerFailures: MiddlewareFunction<Response> = async ({ request, context }, next) => {
  const response = await next();
  const failure: RequestFailure | null = context.get(bodyRefusalContext)
    ? "body-too-large"
    : context.get(requestFailureContext);
  if (!failure) return response;
  void response.body?.cancel().catch(() => undefined);
  const answer = FAILURE_ANSWERS[failure];
  const headers: Record<string, string> = answer.status === 503 ? { "Retry-After": String(RETRY_AFTER_SECONDS) } : {};
  const refused = refuse(request, answer.status, answer.message, headers);
  if (refused instanceof Response) return refused;
  throw refused;
};
