/** The "save" and "autosave" intents of the proposal text (DetailsCard). */
import * as v from "valibot";
import { redirectWithFlash } from "~/lib/flash.server";
import { fieldErrors } from "~/lib/form-errors";
import { saveDetails } from "~/services/proposals/commands.server";
import { DetailsSchema } from "~/services/proposals/schemas";
import { fail, type IntentArgs, textOf } from "./intent.server";
import type { ActionResult } from "./result";

export async function saveDetailsIntent({ db, viewer, proposalId, form, intent, here }: IntentArgs) {
  const values = {
    title: textOf(form, "title"),
    abstract: textOf(form, "abstract"),
    scienceCategory: textOf(form, "scienceCategory"),
    bandId: textOf(form, "bandId"),
  };
  const parsed = v.safeParse(DetailsSchema, values);
  if (!parsed.success) return fail(intent, fieldErrors(parsed.issues, { depth: 1 }), 400, values);
  const row = await saveDetails(db, { viewer, proposalId, input: parsed.output });
  if (intent === "autosave") return { intent, errors: {}, savedAt: row.updatedAt.toISOString() } satisfies ActionResult;
  return redirectWithFlash(here, { kind: "success", text: "Proposal text saved." });
}
