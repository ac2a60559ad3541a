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
    return await new Response(bytes, { headers: { "Content-Type": request.headers.get("Content-Type") ?? "" } }).formData();
  } catch {
    return null;
  }
}
