import { data } from "react-router";

/**
 * Reading a request body with a size cap. The Content-Length is checked first, but not trusted: the
 * body is counted as it arrives and reading stops one chunk past the cap, so a lying or missing
 * header cannot make the server buffer more than the cap.
 */
export type CappedBody =
  | { ok: true; bytes: Uint8Array<ArrayBuffer> }
  | { ok: false; reason: "too-large" | "interrupted" };

export async function readBodyCapped(request: Request, maxBytes: number): Promise<CappedBody> {
  const declared = Number(request.headers.get("Content-Length") ?? "NaN");
  if (Number.isFinite(declared) && declared > maxBytes) {
    await request.body?.cancel().catch(() => undefined);
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
        await reader.cancel().catch(() => undefined);
        return { ok: false, reason: "too-large" };
      }
      chunks.push(value);
    }
  } catch {
    return { ok: false, reason: "interrupted" };
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

/** Largest plain form post, bytes (uploads pass their own, larger cap). */
export const FORM_MAX_BYTES = 64_000;

export type FormBody = { ok: true; form: FormData } | { ok: false; status: 400 | 413; error: string };

/**
 * Reads a form post (urlencoded or multipart) through the capped reader. Every action reads its body
 * here or through `readJsonBody`: none calls `request.formData()` on a body of unknown size.
 */
export async function readFormBody(
  request: Request,
  options: { maxBytes?: number; tooLargeMessage?: string } = {},
): Promise<FormBody> {
  const maxBytes = options.maxBytes ?? FORM_MAX_BYTES;
  const unreadable = { ok: false, status: 400, error: "The form could not be read; please send it again." } as const;
  const read = await readBodyCapped(request, maxBytes);
  if (!read.ok) {
    return read.reason === "too-large"
      ? { ok: false, status: 413, error: options.tooLargeMessage ?? "The form is too large." }
      : unreadable;
  }
  const form = await parseForm(request, read.bytes);
  return form ? { ok: true, form } : unreadable;
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
