/**
 * Every change to a proposal runs in a transaction that locks the proposal row and asks
 * access.server.ts whether the person may make it now, so a change never slips in after a
 * submission or the deadline. A change refused is a `ProposalRefusal` with the message to show.
 */
import { eq } from "drizzle-orm";
import type { Database, Transaction } from "~/db/client.server";
import { cycles, type ProposalStatus, proposals } from "~/db/schema/proposals";
import { formatUtc, plural } from "~/lib/format";
import {
  abilitiesFor,
  type ProposalAbilities,
  type ProposalViewer,
  proposalNotFound,
  teamMembers,
} from "./access.server";
import { STATUS_WORDS } from "./words";

/**
 * A change the person may not make now, with the message to show and the status to answer:
 * 403 when their place on the team does not allow it, 409 when the proposal's state or the
 * deadline does not, 400 for a problem with what was sent.
 */
export class ProposalRefusal extends Error {
  constructor(
    public readonly status: 400 | 403 | 409,
    message: string,
    /** The form field the message is about, when there is one. */
    public readonly field: string | null = null,
  ) {
    super(message);
  }
}

/** Which proposal, asked by whom, at what instant (now unless told). */
export type ProposalRef = { viewer: ProposalViewer; proposalId: number; now?: Date };

/** What a change needs the viewer to be able to do. */
export type Need = "canEdit" | "canManageTeam" | "canSubmit" | "canWithdraw" | "canReopen" | "canDelete";

function refusalFor(
  need: Need,
  abilities: ProposalAbilities,
  cycle: { name: string; submissionDeadline: Date },
  { status, currentVersion }: { status: ProposalStatus; currentVersion: number },
): ProposalRefusal {
  const deadline = `${cycle.name} deadline (${formatUtc(cycle.submissionDeadline)})`;
  switch (need) {
    case "canManageTeam":
      if (abilities.relation === "co-investigator")
        return new ProposalRefusal(403, "Only the PI adds or removes co-investigators.");
      break;
    case "canWithdraw":
      if (abilities.relation !== "pi") return new ProposalRefusal(403, "Only the PI can withdraw the proposal.");
      return new ProposalRefusal(409, `A proposal that is ${STATUS_WORDS[status].toLowerCase()} cannot be withdrawn.`);
    case "canReopen":
      if (abilities.relation !== "pi") return new ProposalRefusal(403, "Only the PI can reopen the proposal.");
      if (status !== "withdrawn")
        return new ProposalRefusal(409, "Only a withdrawn proposal can be reopened as a draft.");
      return new ProposalRefusal(409, `The ${deadline} has passed: the proposal can no longer be reopened.`);
    case "canDelete":
      if (abilities.relation !== "pi") return new ProposalRefusal(403, "Only the PI can delete the proposal.");
      if (status === "draft")
        return new ProposalRefusal(
          409,
          `This draft was submitted before (${plural(currentVersion, "version")}); it stays on record and cannot be deleted.`,
        );
      return new ProposalRefusal(
        409,
        `Only a draft can be deleted; this proposal is ${STATUS_WORDS[status].toLowerCase()}.`,
      );
    case "canSubmit":
      if (status !== "draft")
        return new ProposalRefusal(409, "This proposal has already been submitted; withdraw it first to change it.");
      if (abilities.deadlinePassed)
        return new ProposalRefusal(409, `Too late: the ${deadline} has passed, so the proposal cannot be submitted.`);
      break;
  }
  if (status !== "draft") return new ProposalRefusal(409, "The proposal is no longer a draft: it is read-only.");
  if (abilities.deadlinePassed)
    return new ProposalRefusal(409, `The ${deadline} has passed: the draft can no longer be changed.`);
  return new ProposalRefusal(403, abilities.lockedBecause ?? "You may not change this proposal.");
}

/**
 * Locks the proposal row for the rest of the transaction and checks that the viewer may do `need`.
 * Throws the 404 when the viewer may not see it, a ProposalRefusal when they may not do it.
 */
async function lockFor(tx: Transaction, viewer: ProposalViewer, proposalId: number, need: Need, now: Date) {
  const [proposal] = await tx.select().from(proposals).where(eq(proposals.id, proposalId)).for("update");
  if (!proposal) proposalNotFound();
  const [cycle] = await tx.select().from(cycles).where(eq(cycles.id, proposal.cycleId));
  const members = await teamMembers(tx, { proposalId });
  const abilities = abilitiesFor(viewer, { ...proposal, members }, cycle, now);
  if (!abilities.canView) proposalNotFound();
  if (!abilities[need]) throw refusalFor(need, abilities, cycle, proposal);
  return { proposal, cycle, members, abilities };
}

export type Locked = Awaited<ReturnType<typeof lockFor>> & { tx: Transaction; now: Date; proposalId: number };

/**
 * Runs `change` in one transaction that holds the proposal's row lock, once the viewer may do
 * `need`; with `touch`, the proposal's last-change time is set afterwards.
 */
export async function changeProposal<T>(
  db: Database,
  ref: ProposalRef,
  need: Need,
  change: (locked: Locked) => Promise<T>,
  options: { touch?: boolean } = {},
): Promise<T> {
  const now = ref.now ?? new Date();
  return db.transaction(async (tx) => {
    const locked = await lockFor(tx, ref.viewer, ref.proposalId, need, now);
    const out = await change({ ...locked, tx, now, proposalId: ref.proposalId });
    if (options.touch)
      await tx.update(proposals).set({ updatedAt: new Date() }).where(eq(proposals.id, ref.proposalId));
    return out;
  });
}

/** `changeProposal` for a change to a draft's content (text, hours, targets, science case), touching it. */
export function editDraft<T>(db: Database, ref: ProposalRef, change: (locked: Locked) => Promise<T>): Promise<T> {
  return changeProposal(db, ref, "canEdit", change, { touch: true });
}
