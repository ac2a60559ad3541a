/**
 * Conflicts of interest. Automatic: the reviewer is on the proposal's team (PI or co-investigator), or
 * shares an institute with someone on it (engine `findConflicts`, institutes compared trimmed and
 * case-blind). Declared: the reviewer said so, with a reason (review_conflicts). A reviewer who declined
 * an assignment is never given that proposal again either.
 */
import { and, eq, inArray, isNotNull } from "drizzle-orm";
import type { DbOrTx } from "~/db/client.server";
import { reviewAssignments, reviewConflicts } from "~/db/schema/committee";
import { proposalMembers, proposals } from "~/db/schema/proposals";
import { users } from "~/db/schema/users";
import { type AssignmentProposal, type Conflict, findConflicts } from "~/engine";
import { piOfProposal } from "~/lib/joins.server";

export type Team = { team: number[]; institutes: string[] };

/** The team (account ids) and the institutes of the team of each proposal. */
export async function proposalTeams(db: DbOrTx, proposalIds: readonly number[]): Promise<Map<number, Team>> {
  const out = new Map<number, Team>();
  if (proposalIds.length === 0) return out;
  const [pis, members] = await Promise.all([
    db
      .select({ proposalId: proposals.id, userId: users.id, institute: users.institute })
      .from(proposals)
      .innerJoin(users, piOfProposal)
      .where(inArray(proposals.id, [...proposalIds])),
    db
      .select({ proposalId: proposalMembers.proposalId, userId: users.id, institute: users.institute })
      .from(proposalMembers)
      .innerJoin(users, eq(users.id, proposalMembers.userId))
      .where(and(inArray(proposalMembers.proposalId, [...proposalIds]), isNotNull(proposalMembers.userId))),
  ]);
  for (const row of [...pis, ...members]) {
    const t = out.get(row.proposalId) ?? { team: [], institutes: [] };
    if (!t.team.includes(row.userId)) t.team.push(row.userId);
    if (row.institute.trim() && !t.institutes.includes(row.institute)) t.institutes.push(row.institute);
    out.set(row.proposalId, t);
  }
  for (const id of proposalIds) if (!out.has(id)) out.set(id, { team: [], institutes: [] });
  return out;
}

export function assignmentProposal(id: number, category: string, team: Team): AssignmentProposal {
  return { id: String(id), category, team: team.team.map(String), institutes: team.institutes };
}

/** Declared conflicts of the given proposals. */
export async function declaredConflicts(db: DbOrTx, proposalIds: readonly number[]) {
  if (proposalIds.length === 0) return [];
  return db
    .select({
      proposalId: reviewConflicts.proposalId,
      reviewerId: reviewConflicts.reviewerId,
      reason: reviewConflicts.reason,
    })
    .from(reviewConflicts)
    .where(inArray(reviewConflicts.proposalId, [...proposalIds]));
}

/** Declined assignments of the given proposals: the reviewer is not asked again. */
export async function declinedPairs(db: DbOrTx, proposalIds: readonly number[]) {
  if (proposalIds.length === 0) return [];
  return db
    .select({ proposalId: reviewAssignments.proposalId, reviewerId: reviewAssignments.reviewerId })
    .from(reviewAssignments)
    .where(and(inArray(reviewAssignments.proposalId, [...proposalIds]), eq(reviewAssignments.status, "declined")));
}

export const CONFLICT_WORDS: Record<Conflict["kinds"][number], string> = {
  team: "on the proposal's team",
  institute: "same institute as the team",
  declared: "declared",
};

/**
 * Every conflict between `reviewers` and `proposals` (automatic and declared), by "reviewer:proposal".
 * Declined assignments are not conflicts here; the assignment code keeps them apart.
 */
export async function conflictsOf(
  db: DbOrTx,
  {
    proposals: list,
    reviewers,
  }: { proposals: { id: number; category: string }[]; reviewers: { id: number; institute: string }[] },
): Promise<Map<string, Conflict>> {
  const ids = list.map((p) => p.id);
  const [teams, declared] = await Promise.all([proposalTeams(db, ids), declaredConflicts(db, ids)]);
  const found = findConflicts(
    list.map((p) => assignmentProposal(p.id, p.category, teams.get(p.id)!)),
    reviewers.map((r) => ({ id: String(r.id), institute: r.institute })),
    declared.map((d) => ({ reviewer: String(d.reviewerId), proposal: String(d.proposalId), reason: d.reason })),
  );
  return new Map(found.map((c) => [`${c.reviewer}:${c.proposal}`, c]));
}

/** The words for a conflict: "on the proposal's team; declared: reason". */
export function conflictText(c: Conflict): string {
  return c.kinds
    .map((k) => (k === "declared" && c.declaredReason ? `declared: ${c.declaredReason}` : CONFLICT_WORDS[k]))
    .join("; ");
}
