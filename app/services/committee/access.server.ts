/**
 * Who on the committee may read a proposal — the one place these rules live:
 *  - a reviewer: an active assignment to it, no conflict (automatic or declared), and the cycle with the
 *    reviewers or past them (reviewing, deciding, closed);
 *  - the chair (the Ranking board's permission): every submitted proposal of every cycle, never a draft
 *    nor a withdrawn one.
 * Anyone else gets the same 404 as for a proposal that does not exist.
 */
import { and, eq } from "drizzle-orm";
import type { DbOrTx } from "~/db/client.server";
import { reviewAssignments, reviews } from "~/db/schema/committee";
import { cycles, proposals } from "~/db/schema/proposals";
import type { Role } from "~/db/schema/users";
import { reviewOfAssignment } from "~/lib/joins.server";
import { invariantResponse, notFound, toId } from "~/lib/not-found";
import type { Permission } from "~/lib/permissions";
import { conflictsOf } from "./conflicts.server";

export type CommitteeViewer = {
  user: { id: number; institute: string };
  roles: readonly Role[];
  permissions: ReadonlySet<Permission>;
};

const NOT_YOURS = "No proposal for you to review has this number.";

export const isChair = (viewer: Pick<CommitteeViewer, "permissions">) => viewer.permissions.has("ranking:board");

export function committeeProposalId(raw: string | undefined): number {
  const id = toId(raw);
  invariantResponse(id, NOT_YOURS);
  return id;
}

/** The states in which assigned reviewers read their proposals. */
const READING_STATES = new Set(["reviewing", "deciding", "closed"]);

/**
 * The proposal with its cycle, the viewer's assignment (and review) if any, and how the viewer reads it:
 * "reviewer" (assigned, may score) or "chair" (reads only). Throws the 404 otherwise.
 */
export async function loadProposalForCommittee(
  db: DbOrTx,
  { viewer, proposalId }: { viewer: CommitteeViewer; proposalId: number },
) {
  const [row] = await db
    .select({ proposal: proposals, cycle: cycles })
    .from(proposals)
    .innerJoin(cycles, eq(cycles.id, proposals.cycleId))
    .where(eq(proposals.id, proposalId));
  if (
    !row ||
    row.proposal.currentVersion === 0 ||
    row.proposal.status === "draft" ||
    row.proposal.status === "withdrawn"
  )
    notFound(NOT_YOURS);
  const [mine] = await db
    .select({ assignment: reviewAssignments, review: reviews })
    .from(reviewAssignments)
    .leftJoin(reviews, reviewOfAssignment)
    .where(and(eq(reviewAssignments.proposalId, proposalId), eq(reviewAssignments.reviewerId, viewer.user.id)));
  const conflicts = await conflictsOf(db, {
    proposals: [{ id: proposalId, category: row.proposal.scienceCategory }],
    reviewers: [{ id: viewer.user.id, institute: viewer.user.institute }],
  });
  const conflict = conflicts.get(`${viewer.user.id}:${proposalId}`) ?? null;
  const assigned =
    mine?.assignment.status === "active" &&
    conflict === null &&
    viewer.permissions.has("review:desk") &&
    READING_STATES.has(row.cycle.state);
  if (!assigned && !isChair(viewer)) notFound(NOT_YOURS);
  return {
    ...row,
    assignment: mine?.assignment ?? null,
    review: mine?.review ?? null,
    conflict,
    mode: assigned ? ("reviewer" as const) : ("chair" as const),
  };
}

export type CommitteeProposal = Awaited<ReturnType<typeof loadProposalForCommittee>>;
