/** The intents of the proposal's course (SubmitCard): submit, withdraw, reopen as a draft. */
import { redirectWithFlash } from "~/lib/flash.server";
import { reopenProposal, submitProposal, withdrawProposal } from "~/services/proposals/commands.server";
import type { IntentArgs } from "./intent.server";

export async function submitIntent({ db, viewer, proposalId, here }: IntentArgs) {
  const { version } = await submitProposal(db, { viewer, proposalId });
  return redirectWithFlash(here, {
    kind: "success",
    text: `Submitted. Version ${version} is frozen for the committee; the team has been sent a notice.`,
  });
}

export async function withdrawIntent({ db, viewer, proposalId, here }: IntentArgs) {
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
