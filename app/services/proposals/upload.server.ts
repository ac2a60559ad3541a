/**
 * Reading a form or a multipart upload without ever holding more than a fixed number of bytes: a declared
 * Content-Length over the cap is refused before reading anything; otherwise the body stream is read
 * chunk by chunk and abandoned as soon as the total passes the cap. Only then is the (small enough)
 * body handed to the platform's form-data parser.
 */

import { parseForm, readBodyCapped } from "~/lib/body.server";
import { formatBytes, MAX_PDF_BYTES } from "~/services/proposals/pdf";

/** Room for the multipart boundaries, part headers and the small text fields beside the file. */
export const MULTIPART_OVERHEAD_BYTES = 64 * 1024;

/** Largest request body an upload may have: the PDF limit plus the overhead. */
export const MAX_UPLOAD_BODY_BYTES = MAX_PDF_BYTES + MULTIPART_OVERHEAD_BYTES;

/** Largest body of an ordinary (URL-encoded) form of the proposal pages. */
export const MAX_FORM_BODY_BYTES = 256 * 1024;

export type CappedForm = { ok: true; form: FormData } | { ok: false; status: 400 | 413 | 415; message: string };

export function isMultipart(request: Request): boolean {
  return /^multipart\/form-data\b/i.test(request.headers.get("Content-Type") ?? "");
}

const tooLarge = (): CappedForm => ({
  ok: false,
  status: 413,
  message: `Science case: the file is larger than the ${formatBytes(MAX_PDF_BYTES)} limit. Please upload a smaller PDF (compress the figures).`,
});

/**
 * Reads a multipart/form-data body of at most `maxBytes` and parses it. Never reads past
 * `maxBytes` + one chunk; answers 413 beyond it, 415 for another content type, 400 for a body
 * the parser cannot read.
 */
export async function readMultipartCapped(
  request: Request,
  maxBytes: number = MAX_UPLOAD_BODY_BYTES,
): Promise<CappedForm> {
  if (!isMultipart(request))
    return { ok: false, status: 415, message: "Science case: send the file as a form upload (multipart/form-data)." };
  const read = await readCapped(request, maxBytes, tooLarge);
  if (read.ok || read.status === 413) return read;
  return { ...read, message: `Science case: ${read.message[0].toLowerCase()}${read.message.slice(1)}` };
}

/**
 * Reads an ordinary form (URL-encoded or multipart) of at most `maxBytes`: 413 beyond it, 400 for a
 * body that cannot be read as a form.
 */
export async function readFormCapped(request: Request, maxBytes: number = MAX_FORM_BODY_BYTES): Promise<CappedForm> {
  return readCapped(request, maxBytes, () => ({
    ok: false,
    status: 413,
    message: `The form is larger than ${formatBytes(maxBytes)}; shorten the longest text and try again.`,
  }));
}

async function readCapped(request: Request, maxBytes: number, tooBig: () => CappedForm): Promise<CappedForm> {
  const read = await readBodyCapped(request, maxBytes);
  if (!read.ok)
    return read.reason === "too-large"
      ? tooBig()
      : { ok: false, status: 400, message: "The upload was interrupted; please try again." };
  if (read.bytes.byteLength === 0)
    return { ok: false, status: 400, message: "The form arrived empty; please try again." };
  const form = await parseForm(request, read.bytes);
  return form
    ? { ok: true, form }
    : { ok: false, status: 400, message: "The form could not be read; please try again." };
}
