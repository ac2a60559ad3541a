/**
 * Reading the import's post: a CSV file or pasted text, under a size cap. Each failure is the
 * sentence the page shows beside the file chooser.
 */
import { parseForm, readBodyCapped } from "~/lib/body.server";
import { MAX_TARGET_CSV_BYTES } from "~/services/targets/csv";

/** Room for the form fields around the file itself. */
const MAX_REQUEST_BYTES = MAX_TARGET_CSV_BYTES + 64 * 1024;

export type Upload =
  | { ok: true; csv: string; replace: boolean; intent: string | null }
  | { ok: false; message: string };

export async function readUpload(request: Request): Promise<Upload> {
  const read = await readBodyCapped(request, MAX_REQUEST_BYTES);
  if (!read.ok) {
    return read.reason === "too-large"
      ? { ok: false, message: `The file is larger than ${MAX_TARGET_CSV_BYTES / 1024} KB; split the list.` }
      : { ok: false, message: "The upload was interrupted; please choose the file again." };
  }
  const form = await parseForm(request, read.bytes);
  if (!form) return { ok: false, message: "The upload could not be read; please choose the file again." };
  const file = form.get("file");
  const pasted = form.get("csv");
  let csv = typeof pasted === "string" ? pasted : "";
  if (file instanceof File && file.size > 0) {
    try {
      csv = new TextDecoder("utf-8", { fatal: true }).decode(new Uint8Array(await file.arrayBuffer()));
    } catch {
      return { ok: false, message: `${file.name} is not UTF-8 text; save it as CSV (UTF-8) and try again.` };
    }
  }
  const intent = form.get("intent");
  return { ok: true, csv, replace: form.get("replace") === "on", intent: typeof intent === "string" ? intent : null };
}
