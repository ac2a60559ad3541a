/**
 * Assigning reviewers to the proposals of a cycle, by hand or with the engine's `autoAssign` (N per
 * proposal, balanced load, categories spread, never a conflicted reviewer). A run keeps every active
 * assignment (scored or not) and fills what is missing; a reviewer who declined a proposal, or
 * declared a conflict, is never picked for it. The preview is computed without writing; saving checks
 * every pair again in one transaction and sends each reviewer one notice.
 */
import { and, asc, eq, inArray, type SQL } from "drizzle-orm";
import type { Database, DbOrTx } from "~/db/client.server";
import { auditLog } from "~/db/schema/auth";
import { committeeMembers, reviewAssignments, reviews } from "~/db/schema/committee";
import { cycles, proposals } from "~/db/schema/proposals";
import { users } from "~/db/schema/users";
import { autoAssign, DEFAULT_REVIEWERS_PER_PROPOSAL } from "~/engine";
import { piOfProposal, reviewerOfAssignment, reviewOfAssignment } from "~/lib/joins.server";
import { wakeOutboxSender } from "~/services/mail/sender.server";
import { BOARD_STATUSES } from "./board.server";
import {
  assignmentProposal,
  conflictsOf,
  conflictText,
  declaredConflicts,
  declinedPairs,
  proposalTeams,
} from "./conflicts.server";
import { queueAssignmentNotice } from "./notices.server";
import { scaleText } from "./scale";

export { DEFAULT_REVIEWERS_PER_PROPOSAL };

export type Pair = { proposalId: number; reviewerId: number };

async function cycleWork(db: DbOrTx, cycleId: number) {
  const [cycle] = await db.select().from(cycles).where(eq(cycles.id, cycleId));
  if (!cycle) return null;
  const [members, props, assignments] = await Promise.all([
    db
      .select({ id: users.id, name: users.name, email: users.email, institute: users.institute })
      .from(committeeMembers)
      .innerJoin(users, eq(users.id, committeeMembers.userId))
      .where(eq(committeeMembers.cycleId, cycleId))
      .orderBy(asc(users.name), asc(users.id)),
    db
      .select({ id: proposals.id, title: proposals.title, category: proposals.scienceCategory, pi: users.name })
      .from(proposals)
      .innerJoin(users, piOfProposal)
      .where(and(eq(proposals.cycleId, cycleId), inArray(proposals.status, BOARD_STATUSES)))
      .orderBy(asc(proposals.id)),
    db
      .select({ assignment: reviewAssignments, reviewer: users.name, review: reviews })
      .from(reviewAssignments)
      .innerJoin(users, reviewerOfAssignment)
      .leftJoin(reviews, reviewOfAssignment)
      .where(eq(reviewAssignments.cycleId, cycleId))
      .orderBy(asc(reviewAssignments.id)),
  ]);
  return { cycle, members, proposals: props, assignments };
}

export function reviewProgress(review: typeof reviews.$inferSelect | null): "not started" | "draft" | "submitted" {
  if (!review) return "not started";
  return review.submittedAt ? "submitted" : "draft";
}

/** The chair's assignment page: each proposal with its reviewers, conflicts and who may still be asked. */
export async function assignmentOverview(db: DbOrTx, { cycleId }: { cycleId: number }) {
  const work = await cycleWork(db, cycleId);
  if (!work) return null;
  const conflicts = await conflictsOf(db, { proposals: work.proposals, reviewers: work.members });
  const load = new Map(work.members.map((m) => [m.id, { total: 0, submitted: 0 }]));
  for (const a of work.assignments) {
    if (a.assignment.status !== "active") continue;
    const l = load.get(a.assignment.reviewerId);
    if (!l) continue;
    l.total++;
    if (a.review?.submittedAt) l.submitted++;
  }
  return {
    cycle: work.cycle,
    members: work.members.map((m) => ({ ...m, ...load.get(m.id)! })),
    proposals: work.proposals.map((p) => {
      const mine = work.assignments.filter((a) => a.assignment.proposalId === p.id);
      const taken = new Set(mine.map((a) => a.assignment.reviewerId));
      const conflicted = work.members
        .map((m) => ({ member: m, c: conflicts.get(`${m.id}:${p.id}`) }))
        .filter((x) => x.c)
        .map((x) => ({ reviewerId: x.member.id, name: x.member.name, text: conflictText(x.c!) }));
      const blocked = new Set([...taken, ...conflicted.map((c) => c.reviewerId)]);
      return {
        ...p,
        assignments: mine.map((a) => ({
          id: a.assignment.id,
          reviewerId: a.assignment.reviewerId,
          reviewer: a.reviewer,
          status: a.assignment.status,
          declineReason: a.assignment.declineReason,
          progress: reviewProgress(a.review),
        })),
        active: mine.filter((a) => a.assignment.status === "active").length,
        conflicts: conflicted,
        eligible: work.members.filter((m) => !blocked.has(m.id)).map((m) => ({ id: m.id, name: m.name })),
      };
    }),
  };
}

/** What an auto-assign run would add (nothing is written). */
export async function previewAutoAssign(
  db: DbOrTx,
  { cycleId, perProposal = DEFAULT_REVIEWERS_PER_PROPOSAL }: { cycleId: number; perProposal?: number },
) {
  const work = await cycleWork(db, cycleId);
  if (!work) return null;
  const ids = work.proposals.map((p) => p.id);
  const [teams, declared, declined] = await Promise.all([
    proposalTeams(db, ids),
    declaredConflicts(db, ids),
    declinedPairs(db, ids),
  ]);
  const result = autoAssign({
    proposals: work.proposals.map((p) => assignmentProposal(p.id, p.category, teams.get(p.id)!)),
    reviewers: work.members.map((m) => ({ id: String(m.id), institute: m.institute })),
    conflicts: [
      ...declared.map((d) => ({ reviewer: String(d.reviewerId), proposal: String(d.proposalId), reason: d.reason })),
      ...declined.map((d) => ({ reviewer: String(d.reviewerId), proposal: String(d.proposalId), reason: "declined" })),
    ],
    keep: work.assignments
      .filter((a) => a.assignment.status === "active")
      .map((a) => ({ reviewer: String(a.assignment.reviewerId), proposal: String(a.assignment.proposalId) })),
    reviewersPerProposal: perProposal,
  });
  const title = new Map(work.proposals.map((p) => [p.id, p.title]));
  const name = new Map(work.members.map((m) => [m.id, m.name]));
  return {
    perProposal,
    added: result.assignments
      .filter((a) => !a.kept)
      .map((a) => ({
        proposalId: Number(a.proposal),
        reviewerId: Number(a.reviewer),
        title: title.get(Number(a.proposal)) ?? "?",
        reviewer: name.get(Number(a.reviewer)) ?? "?",
      })),
    loads: result.loads.map((l) => ({
      reviewerId: Number(l.reviewer),
      name: name.get(Number(l.reviewer)) ?? "?",
      total: l.total,
      kept: l.kept,
    })),
    shortfalls: result.shortfalls.map((s) => ({ ...s, title: title.get(Number(s.proposal)) ?? "?" })),
    warnings: result.warnings,
  };
}

export type SaveAssignmentsResult = { ok: true; added: number; notified: number } | { ok: false; message: string };

/**
 * Stores new assignments after checking every pair again (the cycle with the reviewers, a member free of
 * conflicts who has not declined, a proposal under review, not assigned yet); all or nothing. One notice
 * per reviewer lists the proposals given to them.
 */
export async function saveAssignments(
  db: Database,
  {
    cycleId,
    pairs,
    actorId,
    mode,
    now = new Date(),
  }: {
    cycleId: number;
    pairs: Pair[];
    actorId: number;
    mode: "auto" | "by hand";
    now?: Date;
  },
): Promise<SaveAssignmentsResult> {
  const out = await db.transaction(async (tx): Promise<SaveAssignmentsResult> => {
    const [locked] = await tx.select().from(cycles).where(eq(cycles.id, cycleId)).for("update");
    if (!locked) return { ok: false, message: "No cycle with this number." };
    if (locked.state !== "reviewing")
      return { ok: false, message: "Reviewers are assigned while the cycle is with the reviewers." };
    if (pairs.length === 0) return { ok: false, message: "Nothing to assign." };
    const work = (await cycleWork(tx, cycleId))!;
    const member = new Map(work.members.map((m) => [m.id, m]));
    const proposal = new Map(work.proposals.map((p) => [p.id, p]));
    const conflicts = await conflictsOf(tx, { proposals: work.proposals, reviewers: work.members });
    const existing = new Set(work.assignments.map((a) => `${a.assignment.reviewerId}:${a.assignment.proposalId}`));
    const seen = new Set<string>();
    for (const pair of pairs) {
      const key = `${pair.reviewerId}:${pair.proposalId}`;
      const m = member.get(pair.reviewerId);
      const p = proposal.get(pair.proposalId);
      if (!m) return { ok: false, message: "One of the reviewers is not on this cycle's committee." };
      if (!p) return { ok: false, message: "One of the proposals is not under review in this cycle." };
      const c = conflicts.get(key);
      if (c) return { ok: false, message: `${m.name} has a conflict with “${p.title}” (${conflictText(c)}).` };
      if (existing.has(key) || seen.has(key))
        return { ok: false, message: `${m.name} is already assigned to “${p.title}” (or declined it).` };
      seen.add(key);
    }
    await tx.insert(reviewAssignments).values(
      pairs.map((p) => ({
        cycleId,
        proposalId: p.proposalId,
        reviewerId: p.reviewerId,
        assignedById: actorId,
        assignedAt: now,
      })),
    );
    const byReviewer = new Map<number, string[]>();
    for (const p of pairs)
      byReviewer.set(p.reviewerId, [...(byReviewer.get(p.reviewerId) ?? []), proposal.get(p.proposalId)!.title]);
    for (const [reviewerId, titles] of byReviewer) {
      await queueAssignmentNotice(tx, {
        reviewer: member.get(reviewerId)!,
        cycleName: locked.name,
        titles,
        reviewDeadline: locked.reviewDeadline,
        scale: scaleText({ best: locked.scoreBest, worst: locked.scoreWorst }),
      });
    }
    await tx.insert(auditLog).values({
      actorId,
      action: "assignments.saved",
      detail: { cycleId, cycle: locked.name, mode, added: pairs.length, reviewers: byReviewer.size },
      createdAt: now,
    });
    return { ok: true, added: pairs.length, notified: byReviewer.size };
  });
  if (out.ok) wakeOutboxSender();
  return out;
}

/** The assignments `where` picks with their reviews (if written), locked until the transaction ends. */
export function lockAssignments(tx: DbOrTx, where: SQL | undefined) {
  return tx
    .select({ a: reviewAssignments, review: reviews })
    .from(reviewAssignments)
    .leftJoin(reviews, reviewOfAssignment)
    .where(where)
    .for("update", { of: reviewAssignments });
}

/** Takes an assignment back, while nothing has been written in its review. */
export async function removeAssignment(
  db: Database,
  { cycleId, assignmentId, actorId }: { cycleId: number; assignmentId: number; actorId: number },
): Promise<{ ok: true } | { ok: false; message: string }> {
  return db.transaction(async (tx) => {
    const [row] = await lockAssignments(
      tx,
      and(eq(reviewAssignments.id, assignmentId), eq(reviewAssignments.cycleId, cycleId)),
    );
    if (!row) return { ok: false, message: "No such assignment in this cycle." };
    if (row.review) return { ok: false, message: "The reviewer has started this review; it stays." };
    await tx.delete(reviewAssignments).where(eq(reviewAssignments.id, assignmentId));
    await tx.insert(auditLog).values({
      actorId,
      action: "assignment.removed",
      targetUserId: row.a.reviewerId,
      detail: { cycleId, proposalId: row.a.proposalId },
    });
    return { ok: true };
  });
}

/** A reviewer declines an assignment with a reason; the chair sees it and asks someone else. */
export async function declineAssignment(
  db: Database,
  {
    assignmentId,
    reviewerId,
    reason,
    now = new Date(),
  }: { assignmentId: number; reviewerId: number; reason: string; now?: Date },
): Promise<{ ok: true } | { ok: false; message: string }> {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .select({ a: reviewAssignments, review: reviews, cycle: cycles })
      .from(reviewAssignments)
      .innerJoin(cycles, eq(cycles.id, reviewAssignments.cycleId))
      .leftJoin(reviews, reviewOfAssignment)
      .where(eq(reviewAssignments.id, assignmentId))
      .for("update", { of: reviewAssignments });
    if (!row || row.a.reviewerId !== reviewerId) return { ok: false, message: "Not your assignment." };
    if (row.a.status === "declined") return { ok: false, message: "You have declined this assignment already." };
    if (row.cycle.state !== "reviewing") return { ok: false, message: "The review is closed." };
    if (row.review?.submittedAt)
      return { ok: false, message: "You have submitted this review; it can no longer be declined." };
    await tx
      .update(reviewAssignments)
      .set({ status: "declined", declineReason: reason, declinedAt: now })
      .where(eq(reviewAssignments.id, assignmentId));
    await tx.insert(auditLog).values({
      actorId: reviewerId,
      action: "assignment.declined",
      detail: { cycleId: row.a.cycleId, proposalId: row.a.proposalId, reason },
      createdAt: now,
    });
    return { ok: true };
  });
}
