/**
 * Who may see and change a proposal: the one place these rules live. Route modules and services ask
 * here; nothing else decides.
 *
 *  - Seeing: the PI and the co-investigators (a proposal_members row matched by account, or by
 *    e-mail without regard to case for someone invited before they had an account). Everybody
 *    else is answered 404, so a proposal's existence is not revealed. The committee's rule (a
 *    reviewer assigned to the proposal, the chair of its cycle) belongs in `canViewProposal`.
 *  - Changing (text, hours, targets, science case): PI and co-investigators, only while the
 *    proposal is a draft and the cycle's submission deadline has not passed.
 *  - The team (adding and removing co-investigators): the PI, on an editable draft.
 *  - Submitting: PI or co-investigator, a draft, before the deadline (completeness is checked by
 *    the submission itself).
 *  - Withdrawing: the PI, while the proposal is submitted or under review (the committee has not
 *    decided yet); allowed after the deadline too.
 *  - Reopening a withdrawn proposal as a draft: the PI, before the deadline. A later submission
 *    freezes a new version; the earlier versions stay.
 *  - Deleting: the PI, a draft (before or after the deadline); one that was ever submitted is
 *    refused by the deletion itself, as its versions belong to the committee's record.
 */
import { and, asc, eq, isNull, sql } from "drizzle-orm";
import type { Database, DbOrTx } from "~/db/client.server";
import { cycles, type ProposalStatus, proposalMembers, proposals } from "~/db/schema/proposals";
import type { Role } from "~/db/schema/users";
import { invariantResponse, notFound, toId } from "~/lib/not-found";

/** What the rules need to know about the person asking. */
export type ProposalViewer = { user: { id: number; email: string }; roles: readonly Role[] };

/** What the rules need to know about a proposal. */
export type ProposalAccessSubject = {
  piId: number;
  status: ProposalStatus;
  members: readonly { email: string; userId: number | null }[];
};

export type ProposalRelation = "pi" | "co-investigator";

const sameEmail = (a: string, b: string) => a.trim().toLowerCase() === b.trim().toLowerCase();

/** The member row that stands for the viewer: linked to the account, or unlinked with the same e-mail. */
export function membershipOf<M extends { email: string; userId: number | null }>(
  viewer: ProposalViewer,
  proposal: { members: readonly M[] },
): M | null {
  return (
    proposal.members.find((m) => m.userId === viewer.user.id) ??
    proposal.members.find((m) => m.userId === null && sameEmail(m.email, viewer.user.email)) ??
    null
  );
}

/** The viewer's place on the proposal's team, or null. */
export function relationTo(viewer: ProposalViewer, proposal: ProposalAccessSubject): ProposalRelation | null {
  if (proposal.piId === viewer.user.id) return "pi";
  return membershipOf(viewer, proposal) ? "co-investigator" : null;
}

/**
 * May the viewer see this proposal at all? Today: its team. The committee's rule (an assigned
 * reviewer without a conflict, the chair of its cycle) is added here when the review desk exists.
 */
export function canViewProposal(viewer: ProposalViewer, proposal: ProposalAccessSubject): boolean {
  return relationTo(viewer, proposal) !== null;
}

/** Statuses in which the PI may still pull the proposal back. */
export const WITHDRAWABLE: readonly ProposalStatus[] = ["submitted", "under_review"];

export type ProposalAbilities = {
  relation: ProposalRelation | null;
  canView: boolean;
  /** Text, hours, targets, science case. */
  canEdit: boolean;
  /** Add and remove co-investigators. */
  canManageTeam: boolean;
  canSubmit: boolean;
  canWithdraw: boolean;
  canReopen: boolean;
  /** Delete the draft with everything hanging off it (never one submitted before: its versions stay on record). */
  canDelete: boolean;
  deadlinePassed: boolean;
  /** Why the proposal cannot be edited, in plain words; null when it can. */
  lockedBecause: string | null;
};

/** A team's proposal may be changed while it is a draft and its cycle's deadline is still ahead. */
export function isEditableDraft(status: ProposalStatus, deadline: Date, now: Date): boolean {
  return status === "draft" && now.getTime() < deadline.getTime();
}

/** Every ability at once, for a loader to hand to its page and for the actions to check. */
export function abilitiesFor(
  viewer: ProposalViewer,
  proposal: ProposalAccessSubject & { currentVersion: number },
  cycle: { submissionDeadline: Date },
  now: Date = new Date(),
): ProposalAbilities {
  const relation = relationTo(viewer, proposal);
  const deadlinePassed = now.getTime() >= cycle.submissionDeadline.getTime();
  const onTeam = relation !== null;
  const draft = proposal.status === "draft";
  const canEdit = onTeam && isEditableDraft(proposal.status, cycle.submissionDeadline, now);
  let lockedBecause: string | null = null;
  if (!onTeam) lockedBecause = "You are not on this proposal's team.";
  else if (!draft) lockedBecause = "Only a draft can be changed; this proposal has been submitted or decided.";
  else if (deadlinePassed)
    lockedBecause = "The cycle's submission deadline has passed; the draft can no longer be changed.";
  return {
    relation,
    canView: canViewProposal(viewer, proposal),
    canEdit,
    canManageTeam: canEdit && relation === "pi",
    canSubmit: canEdit,
    canWithdraw: relation === "pi" && WITHDRAWABLE.includes(proposal.status),
    canReopen: relation === "pi" && proposal.status === "withdrawn" && !deadlinePassed,
    canDelete: relation === "pi" && draft && proposal.currentVersion === 0,
    deadlinePassed,
    lockedBecause,
  };
}

const NOT_YOURS = "No proposal of yours has this number.";

/** Thrown for a proposal the viewer may not see (or that does not exist): the same 404 either way. */
export function proposalNotFound(): never {
  notFound(NOT_YOURS);
}

/** Parses a route's proposal id (or another id of its pages); anything else is the same 404. */
export function proposalIdFrom(param: string | null | undefined): number {
  const id = toId(param);
  invariantResponse(id, NOT_YOURS);
  return id;
}

/**
 * Loads a proposal with its cycle and team for the viewer, or throws the 404. A co-investigator
 * invited by e-mail before they had an account is linked to it here, the first time they open it.
 */
export async function loadProposalForViewer(
  db: Database,
  { viewer, proposalId, now = new Date() }: { viewer: ProposalViewer; proposalId: number; now?: Date },
) {
  const [row] = await db
    .select({ proposal: proposals, cycle: cycles })
    .from(proposals)
    .innerJoin(cycles, eq(cycles.id, proposals.cycleId))
    .where(eq(proposals.id, proposalId));
  if (!row) proposalNotFound();
  const members = await teamMembers(db, { proposalId });
  const subject: ProposalAccessSubject = { piId: row.proposal.piId, status: row.proposal.status, members };
  if (!canViewProposal(viewer, subject)) proposalNotFound();
  const mine = membershipOf(viewer, { members });
  if (mine && mine.userId === null) {
    await linkMember(db, mine.id, viewer.user.id);
    mine.userId = viewer.user.id;
  }
  const abilities = abilitiesFor(viewer, { ...subject, currentVersion: row.proposal.currentVersion }, row.cycle, now);
  return { ...row, members, abilities };
}

/** The co-investigators of a proposal in the order they were added, with the name and institute of their account. */
export function teamMembers(db: DbOrTx, { proposalId }: { proposalId: number }) {
  return db.query.proposalMembers.findMany({
    where: eq(proposalMembers.proposalId, proposalId),
    orderBy: asc(proposalMembers.id),
    with: { user: { columns: { name: true, institute: true } } },
  });
}

export type LoadedProposal = Awaited<ReturnType<typeof loadProposalForViewer>>;

async function linkMember(db: DbOrTx, memberId: number, userId: number) {
  await db
    .update(proposalMembers)
    .set({ userId })
    .where(and(eq(proposalMembers.id, memberId), isNull(proposalMembers.userId)));
}

/** SQL condition "the viewer is PI or co-investigator of proposals.id" (for lists). */
export function onTeamCondition(viewer: ProposalViewer) {
  return sql`(${proposals.piId} = ${viewer.user.id} or exists (
    select 1 from ${proposalMembers}
    where ${proposalMembers.proposalId} = ${proposals.id}
      and (${proposalMembers.userId} = ${viewer.user.id}
           or (${proposalMembers.userId} is null and lower(${proposalMembers.email}) = lower(${viewer.user.email})))
  ))`;
}
