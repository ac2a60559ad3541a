/**
 * Reading the proposal pages' posts through the capped body reader (app/lib/body.server.ts): the
 * science case upload (multipart, at most the PDF limit plus room for the form around it) and the
 * ordinary forms.
 */
import { type FormBody, readFormBody } from "~/lib/body.server";
import { formatBytes } from "~/lib/format";
import { MAX_PDF_BYTES } from "./pdf";

/** Room for the multipart boundaries, part headers and the small text fields beside the file. */
export const MULTIPART_OVERHEAD_BYTES = 64 * 1024;

/** Largest request body an upload may have: the PDF limit plus the overhead. */
export const MAX_UPLOAD_BODY_BYTES = MAX_PDF_BYTES + MULTIPART_OVERHEAD_BYTES;

/** Largest body of an ordinary (URL-encoded) form of the proposal pages. */
export const MAX_FORM_BODY_BYTES = 256 * 1024;

export function isMultipart(request: Request): boolean {
  return /^multipart\/form-data\b/i.test(request.headers.get("Content-Type") ?? "");
}

const FORM_LIMIT = {
  maxBytes: MAX_FORM_BODY_BYTES,
  tooLargeMessage: `The form is larger than ${formatBytes(MAX_FORM_BODY_BYTES)}; shorten the longest text and try again.`,
};

const UPLOAD_LIMIT = {
  maxBytes: MAX_UPLOAD_BODY_BYTES,
  tooLargeMessage: `Science case: the file is larger than the ${formatBytes(MAX_PDF_BYTES)} limit. Please upload a smaller PDF (compress the figures).`,
};

/** An ordinary form of the proposal pages, of at most `MAX_FORM_BODY_BYTES`. */
export function readProposalForm(request: Request): Promise<FormBody> {
  return readFormBody(request, FORM_LIMIT);
}

/** A post that may be an upload, and the field its refusal is about ("document" for an upload). */
export type ProposalPost =
  | { ok: true; form: FormData; multipart: boolean }
  | { ok: false; status: 400 | 413; error: string; field: "form" | "document" };

/**
 * Reads a post of the editor: an upload (multipart) of at most `MAX_UPLOAD_BODY_BYTES`, whose
 * refusals speak of the science case, or an ordinary form. Never reads more than the cap and one
 * chunk: 413 beyond it, 400 for a body that is not a form.
 */
export async function readProposalPost(request: Request): Promise<ProposalPost> {
  const multipart = isMultipart(request);
  const body = await readFormBody(request, multipart ? UPLOAD_LIMIT : FORM_LIMIT);
  if (body.ok) return { ok: true, form: body.form, multipart };
  if (!multipart) return { ...body, field: "form" };
  const error = body.status === 413 ? body.error : `Science case: ${body.error[0].toLowerCase()}${body.error.slice(1)}`;
  return { ...body, error, field: "document" };
}
