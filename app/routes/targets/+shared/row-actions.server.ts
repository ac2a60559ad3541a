/**
 * The posts of a row of My targets: "Add to a proposal" and "Remove". Each reads the target and
 * (for adding) the proposal from the form; a bad or missing field, a missing confirmation, a target
 * not in the list or a proposal the person may not change is answered with a 4xx and the message.
 */
import { data, href } from "react-router";
import type { Database } from "~/db/client.server";
import { redirectWithFlash } from "~/lib/flash.server";
import type { Viewer } from "~/lib/guards.server";
import { toId } from "~/lib/not-found";
import { addToProposal } from "~/services/targets/proposals.server";
import { deleteTarget, getTarget } from "~/services/targets/targets.server";
import type { RowRefusal } from "./RowActions";

const refuse = (rowError: string, status: number, targetId: number | null = null) =>
  data<RowRefusal>({ rowError, targetId }, { status });

const field = (form: FormData, key: string) => {
  const x = form.get(key);
  return typeof x === "string" ? x : "";
};

/** The confirmed row's target, or the refusal to answer. */
async function confirmedTarget(db: Database, viewer: Viewer, form: FormData) {
  if (form.get("confirm") !== "yes") return { refusal: refuse("Confirm the action in the dialog.", 400) };
  const targetId = toId(field(form, "targetId"));
  const target = targetId === null ? null : await getTarget(db, { ownerId: viewer.user.id, targetId });
  if (!target) return { refusal: refuse("Target: that target is not in your list (any more).", 404) };
  return { target };
}

export async function removeRow(db: Database, viewer: Viewer, form: FormData) {
  const { target, refusal } = await confirmedTarget(db, viewer, form);
  if (!target) return refusal;
  await deleteTarget(db, { ownerId: viewer.user.id, targetId: target.id });
  return redirectWithFlash(href("/targets"), { kind: "success", text: `${target.name} removed from My targets.` });
}

export async function addRowToProposal(db: Database, viewer: Viewer, form: FormData) {
  const { target, refusal } = await confirmedTarget(db, viewer, form);
  if (!target) return refusal;
  const proposalId = toId(field(form, "proposalId"));
  if (proposalId === null) return refuse("Proposal: choose one of your draft proposals.", 400, target.id);
  const added = await addToProposal(db, { viewer, proposalId, myTargetId: target.id });
  if (!added.ok) return refuse(`Proposal: ${added.message}`, added.status, target.id);
  return redirectWithFlash(href("/targets"), {
    kind: "success",
    text: `${added.name} added to the proposal. Set its constraints and calibrators in the proposal.`,
  });
}
