import { data } from "react-router";

/**
 * Reading a request body with a size cap. The Content-Length is checked first, but not trusted: the
 * body is counted as it arrives and reading stops one chunk past the cap, so a lying or missing
 * header cannot make the server buffer more than the cap.
 *
 * Three layers keep every body bounded, whoever reads it:
 * 1. the app server (scripts/app-server.ts) passes on at most `REQUEST_BODY_MAX_BYTES` of any body
 *    and answers a larger one with 413 before the app reads it;
 * 2. the root middleware (`checkRequestBody`) refuses, by its declared length, a body larger than
 *    its content type allows (`CONTENT_TYPE_MAX_BYTES`), and a content type the route cannot read;
 * 3. each action reads through `readFormBody` / `readJsonBody` / `readBodyCapped` with its own cap.
 */
export type CappedBody =
  | { ok: true; bytes: Uint8Array<ArrayBuffer> }
  | { ok: false; reason: "too-large" | "interrupted" };

/**
 * The largest body the app server passes on at all, bytes: at least every route's own cap (the
 * largest is a 10 MB science-case PDF with its form around it).
 */
export const REQUEST_BODY_MAX_BYTES = 11 * 1024 * 1024;

/** Largest plain form post, bytes (uploads pass their own, larger cap). */
export const FORM_MAX_BYTES = 64_000;

/** Largest body by content type, checked from Content-Length before any action runs. */
export const CONTENT_TYPE_MAX_BYTES = {
  "application/x-www-form-urlencoded": 1024 * 1024,
  "multipart/form-data": REQUEST_BODY_MAX_BYTES,
  "application/json": 2 * 1024 * 1024,
} as const;

/** The code the app server's counting stream fails with when a body passes `REQUEST_BODY_MAX_BYTES`. */
export const BODY_TOO_LARGE_CODE = "FD_BODY_TOO_LARGE";

/** True for the error of a body stream cut off at the cap (also when wrapped in a `cause`). */
export function isBodyTooLarge(error: unknown, depth = 0): boolean {
  if (!error || typeof error !== "object" || depth > 4) return false;
  const e = error as { code?: unknown; cause?: unknown };
  return e.code === BODY_TOO_LARGE_CODE || isBodyTooLarge(e.cause, depth + 1);
}

/** The media type of a request, lower case and without parameters ("" when there is none). */
export function mediaType(request: Request): string {
  return (request.headers.get("Content-Type") ?? "").split(";")[0].trim().toLowerCase();
}

/** The declared Content-Length, or null when absent or not a plain number. */
export function declaredLength(request: Request): number | null {
  const raw = request.headers.get("Content-Length");
  return raw !== null && /^\d{1,15}$/.test(raw.trim()) ? Number(raw) : null;
}

export async function readBodyCapped(request: Request, maxBytes: number): Promise<CappedBody> {
  const declared = declaredLength(request);
  // Cancelling is not awaited: for a tee'd body (`request.clone()`) it settles only once both copies are cancelled.
  if (declared !== null && declared > maxBytes) {
    void request.body?.cancel().catch(() => undefined);
    return { ok: false, reason: "too-large" };
  }
  if (!request.body) return { ok: true, bytes: new Uint8Array(0) };
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  try {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      total += value.byteLength;
      if (total > maxBytes) {
        void reader.cancel().catch(() => undefined);
        return { ok: false, reason: "too-large" };
      }
      chunks.push(value);
    }
  } catch (e) {
    return { ok: false, reason: isBodyTooLarge(e) ? "too-large" : "interrupted" };
  }
  const bytes = new Uint8Array(total);
  let at = 0;
  for (const c of chunks) {
    bytes.set(c, at);
    at += c.byteLength;
  }
  return { ok: true, bytes };
}

/** Parses bytes read by `readBodyCapped` as a form of the request's content type; null when it is not one. */
export async function parseForm(request: Request, bytes: Uint8Array<ArrayBuffer>): Promise<FormData | null> {
  try {
    return await new Response(bytes, {
      headers: { "Content-Type": request.headers.get("Content-Type") ?? "" },
    }).formData();
  } catch {
    return null;
  }
}

/** The media types a page's form post may have. */
export const FORM_MEDIA_TYPES: readonly string[] = ["application/x-www-form-urlencoded", "multipart/form-data"];

/**
 * What makes a parsed form impossible to store as sent, naming the field: a NUL character, which
 * PostgreSQL text cannot hold (it is refused, never dropped silently). Null when there is nothing.
 */
export function formProblem(form: FormData): string | null {
  for (const [name, value] of form.entries()) {
    if (typeof value === "string" && value.includes("\u0000")) {
      const field = name.replaceAll("\u0000", "").slice(0, 60) || "(unnamed)";
      return `The field “${field}” contains a NUL character (\\0), which cannot be stored; remove it and send the form again.`;
    }
  }
  return null;
}

export type FormBody = { ok: true; form: FormData } | { ok: false; status: 400 | 413 | 415; error: string };

/**
 * Reads a form post (urlencoded or multipart) through the capped reader. Every action reads its body
 * here or through `readJsonBody`: none calls `request.formData()` on a body of unknown size.
 * Another content type is 415, a body over the cap 413, an unreadable form or a NUL in a field 400.
 */
export async function readFormBody(
  request: Request,
  options: { maxBytes?: number; tooLargeMessage?: string } = {},
): Promise<FormBody> {
  const maxBytes = options.maxBytes ?? FORM_MAX_BYTES;
  const unreadable = { ok: false, status: 400, error: "The form could not be read; please send it again." } as const;
  const type = mediaType(request);
  if (type !== "" && !FORM_MEDIA_TYPES.includes(type)) {
    void request.body?.cancel().catch(() => undefined);
    return { ok: false, status: 415, error: `This page takes a form, not ${type}.` };
  }
  const read = await readBodyCapped(request, maxBytes);
  if (!read.ok) {
    return read.reason === "too-large"
      ? { ok: false, status: 413, error: options.tooLargeMessage ?? tooLargeText(maxBytes) }
      : unreadable;
  }
  if (type === "" && read.bytes.byteLength > 0)
    return { ok: false, status: 415, error: "The form came without its type." };
  const form = await parseForm(request, read.bytes);
  if (!form) return unreadable;
  const problem = formProblem(form);
  return problem ? { ok: false, status: 400, error: problem } : { ok: true, form };
}

/** "The form is larger than 64 KB." */
export function tooLargeText(maxBytes: number): string {
  const size =
    maxBytes >= 1024 * 1024 ? `${Math.round(maxBytes / (1024 * 1024))} MB` : `${Math.round(maxBytes / 1000)} KB`;
  return `The form is larger than ${size}; shorten the longest text and send it again.`;
}

/** `readFormBody` for actions that answer a bad body with the error page: throws `data(error, {status})`. */
export async function requireFormBody(
  request: Request,
  options: { maxBytes?: number; tooLargeMessage?: string } = {},
): Promise<FormData> {
  const body = await readFormBody(request, options);
  if (!body.ok) throw data(body.error, { status: body.status });
  return body.form;
}
