/** The intents of the targets list (TargetsCard): copy one of my targets, move a target, remove one. */
import * as v from "valibot";
import { redirectWithFlash } from "~/lib/flash.server";
import { itemIdField, MoveTargetSchema } from "~/services/proposals/schemas";
import { addTargetFromMine, moveTarget, removeTarget } from "~/services/proposals/targets.server";
import { fail, type IntentArgs, textOf } from "./intent.server";

export async function addMyTargetIntent({ db, viewer, proposalId, form, intent, here }: IntentArgs) {
  const values = { myTargetId: textOf(form, "myTargetId") };
  const parsed = v.safeParse(itemIdField, values.myTargetId);
  if (!parsed.success) return fail(intent, { myTargetId: "From my targets: choose one of your targets." }, 400, values);
  const row = await addTargetFromMine(db, { viewer, proposalId, myTargetId: parsed.output });
  return redirectWithFlash(here, {
    kind: "success",
    text: `${row.name} added from your targets. Set its constraints and calibrators with Edit.`,
  });
}

export async function moveTargetIntent({ db, viewer, proposalId, form, intent, here }: IntentArgs) {
  const parsed = v.safeParse(MoveTargetSchema, {
    targetId: textOf(form, "targetId"),
    direction: textOf(form, "direction"),
  });
  if (!parsed.success) return fail(intent, { form: "Unknown target or direction." }, 400);
  await moveTarget(db, { viewer, proposalId, ...parsed.output });
  return redirectWithFlash(here, { kind: "info", text: "Target order changed." });
}

export async function removeTargetIntent({ db, viewer, proposalId, form, intent, here }: IntentArgs) {
  const parsed = v.safeParse(itemIdField, textOf(form, "targetId"));
  if (!parsed.success) return fail(intent, { form: "Unknown target." }, 400);
  const gone = await removeTarget(db, { viewer, proposalId, targetId: parsed.output });
  return redirectWithFlash(here, { kind: "success", text: `${gone.name} removed from the proposal.` });
}
