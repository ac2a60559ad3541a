/** The intents of the proposal's course (SubmitCard): submit, withdraw, reopen as a draft, delete the draft. */
import { href } from "react-router";
import { redirectWithFlash } from "~/lib/flash.server";
import { deleteDraft, reopenProposal, submitProposal, withdrawProposal } from "~/services/proposals/commands.server";
import { type IntentArgs, textOf, unconfirmed } from "./intent.server";

export async function submitIntent(args: IntentArgs) {
  const { db, viewer, proposalId, form, here } = args;
  const refused = unconfirmed(args, "the submission");
  if (refused) return refused;
  const acknowledged = textOf(form, "acknowledge") === "yes";
  const { version } = await submitProposal(db, { viewer, proposalId, acknowledged });
  return redirectWithFlash(here, {
    kind: "success",
    text: `Submitted. Version ${version} is frozen for the committee; the team has been sent a notice.`,
  });
}

export async function withdrawIntent(args: IntentArgs) {
  const { db, viewer, proposalId, here } = args;
  const refused = unconfirmed(args, "the withdrawal");
  if (refused) return refused;
  await withdrawProposal(db, { viewer, proposalId });
  return redirectWithFlash(here, { kind: "success", text: "Proposal withdrawn; the team has been sent a notice." });
}

export async function reopenIntent({ db, viewer, proposalId, here }: IntentArgs) {
  await reopenProposal(db, { viewer, proposalId });
  return redirectWithFlash(here, {
    kind: "success",
    text: "Reopened as a draft. Submit it again before the deadline.",
  });
}

export async function deleteIntent(args: IntentArgs) {
  const { db, viewer, proposalId } = args;
  const refused = unconfirmed(args, "the deletion");
  if (refused) return refused;
  const { title } = await deleteDraft(db, { viewer, proposalId });
  return redirectWithFlash(href("/proposals"), {
    kind: "success",
    text: `Draft "${title || "(untitled)"}" deleted, with its team, hours, targets and science case.`,
  });
}
