/** A stored PDF (a science case) sent as a download that the browser never sniffs or caches. */
export type StoredPdf = { filename: string; data: Uint8Array; sha256: string };

/**
 * The PDF as an attachment, its name in plain ASCII and in full (RFC 6266 `filename*`); a missing one
 * is a plain-text 404 that says `missing`.
 */
export function pdfAttachment(doc: StoredPdf | null | undefined, missing: string): Response {
  if (!doc)
    throw new Response(missing, {
      status: 404,
      headers: { "Content-Type": "text/plain; charset=utf-8" },
    });
  const ascii = doc.filename.replace(/[^\x20-\x7e]/g, "_").replace(/["\\]/g, "_");
  return new Response(new Uint8Array(doc.data), {
    status: 200,
    headers: {
      "Content-Type": "application/pdf",
      "Content-Length": String(doc.data.length),
      "Content-Disposition": `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(doc.filename)}`,
      "X-Content-Type-Options": "nosniff",
      "Cache-Control": "private, no-store",
      ETag: `"${doc.sha256}"`,
    },
  });
}
