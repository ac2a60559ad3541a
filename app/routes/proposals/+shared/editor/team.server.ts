/** The intents of the team (TeamCard): add a co-investigator by e-mail, remove one. */
import * as v from "valibot";
import { redirectWithFlash } from "~/lib/flash.server";
import { coInvestigatorEmailField, itemIdField } from "~/services/proposals/schemas";
import { addCoInvestigator, removeCoInvestigator } from "~/services/proposals/team.server";
import { fail, type IntentArgs, textOf } from "./intent.server";

export async function addMemberIntent({ db, viewer, proposalId, form, intent, here }: IntentArgs) {
  const values = { email: textOf(form, "email") };
  const parsed = v.safeParse(coInvestigatorEmailField, values.email);
  if (!parsed.success) return fail(intent, { email: parsed.issues[0].message }, 400, values);
  const member = await addCoInvestigator(db, { viewer, proposalId, email: parsed.output });
  return redirectWithFlash(here, {
    kind: "success",
    text: `${member.email} is now a co-investigator and has been sent a notice.`,
  });
}

export async function removeMemberIntent({ db, viewer, proposalId, form, intent, here }: IntentArgs) {
  const parsed = v.safeParse(itemIdField, textOf(form, "memberId"));
  if (!parsed.success) return fail(intent, { form: "Unknown co-investigator." }, 400);
  const gone = await removeCoInvestigator(db, { viewer, proposalId, memberId: parsed.output });
  return redirectWithFlash(here, { kind: "success", text: `${gone.email} is no longer on the team.` });
}
