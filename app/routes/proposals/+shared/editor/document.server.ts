/** The intents of the science case (DocumentCard): upload (or replace) the PDF, remove it. */
import { redirectWithFlash } from "~/lib/flash.server";
import { formatBytes } from "~/lib/format";
import { ProposalRefusal } from "~/services/proposals/lock.server";
import { MAX_PDF_BYTES } from "~/services/proposals/pdf";
import { removeScienceCase, uploadScienceCase } from "~/services/proposals/science-case.server";
import { fail, type IntentArgs } from "./intent.server";

/** Answers the upload's own refusals under the file field, as the upload's form keeps nothing typed. */
export async function uploadDocumentIntent({ db, viewer, proposalId, form, intent, here }: IntentArgs) {
  const file = form.get("document");
  if (!(file instanceof File) || file.size === 0)
    return fail(intent, { document: "Science case: choose a PDF file to upload." }, 400);
  if (file.size > MAX_PDF_BYTES) {
    return fail(
      intent,
      {
        document: `Science case: the file is ${formatBytes(file.size)}, larger than the ${formatBytes(MAX_PDF_BYTES)} limit. Please upload a smaller PDF (compress the figures).`,
      },
      413,
    );
  }
  try {
    const bytes = new Uint8Array(await file.arrayBuffer());
    const stored = await uploadScienceCase(db, { viewer, proposalId, file: { filename: file.name, bytes } });
    return redirectWithFlash(here, {
      kind: "success",
      text: `Science case uploaded: ${stored.filename} (${formatBytes(stored.sizeBytes)}).`,
    });
  } catch (e) {
    if (e instanceof ProposalRefusal) return fail(intent, { [e.field ?? "document"]: e.message }, e.status);
    throw e;
  }
}

export async function removeDocumentIntent({ db, viewer, proposalId, here }: IntentArgs) {
  await removeScienceCase(db, { viewer, proposalId });
  return redirectWithFlash(here, { kind: "success", text: "Science case removed." });
}
