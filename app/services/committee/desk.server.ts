/**
 * The Review desk's reads and the reviewer's own changes: the cycles a person sits on with their
 * assignments and progress; the list of a cycle's submitted proposals (titles and abstracts only) on
 * which conflicts are declared; declaring and withdrawing a conflict; the chair's reminders.
 */
import { and, asc, eq, inArray, isNull } from "drizzle-orm";
import type { Database, DbOrTx } from "~/db/client.server";
import { auditLog } from "~/db/schema/auth";
import { committeeMembers, reviewAssignments, reviewConflicts, reviews } from "~/db/schema/committee";
import { cycles, proposals } from "~/db/schema/proposals";
import { users } from "~/db/schema/users";
import { activeAssignment } from "~/lib/conditions.server";
import { proposalOfAssignment, reviewerOfAssignment, reviewOfAssignment } from "~/lib/joins.server";
import { wakeOutboxSender } from "~/services/mail/sender.server";
import { lockAssignments, reviewProgress } from "./assignments.server";
import { BOARD_STATUSES } from "./board.server";
import { conflictsOf, conflictText } from "./conflicts.server";
import { queueReminder } from "./notices.server";

/** The cycles where the person sits on the committee, each with their assignments, newest cycle first. */
export async function myDesk(db: DbOrTx, { userId }: { userId: number }) {
  const seats = await db
    .select({ cycle: cycles })
    .from(committeeMembers)
    .innerJoin(cycles, eq(cycles.id, committeeMembers.cycleId))
    .where(eq(committeeMembers.userId, userId))
    .orderBy(asc(cycles.observingStart));
  const mine = await db
    .select({
      assignment: reviewAssignments,
      review: reviews,
      title: proposals.title,
      category: proposals.scienceCategory,
    })
    .from(reviewAssignments)
    .innerJoin(proposals, proposalOfAssignment)
    .leftJoin(reviews, reviewOfAssignment)
    .where(eq(reviewAssignments.reviewerId, userId))
    .orderBy(asc(proposals.title));
  return seats.reverse().map(({ cycle }) => ({
    cycle,
    assignments: mine
      .filter((a) => a.assignment.cycleId === cycle.id)
      .map((a) => ({
        id: a.assignment.id,
        proposalId: a.assignment.proposalId,
        title: a.title,
        category: a.category,
        status: a.assignment.status,
        declineReason: a.assignment.declineReason,
        progress: reviewProgress(a.review),
        score: a.review?.score ?? null,
        savedAt: a.review?.updatedAt ?? null,
      })),
  }));
}

/** Is the person on the cycle's committee? */
export async function isMember(db: DbOrTx, { cycleId, userId }: { cycleId: number; userId: number }) {
  const [row] = await db
    .select({ userId: committeeMembers.userId })
    .from(committeeMembers)
    .where(and(eq(committeeMembers.cycleId, cycleId), eq(committeeMembers.userId, userId)));
  return Boolean(row);
}

/** The cycle, when the person sits on its committee; null otherwise. */
export async function cycleForMember(db: DbOrTx, { cycleId, userId }: { cycleId: number; userId: number }) {
  const [row] = await db
    .select({ cycle: cycles })
    .from(committeeMembers)
    .innerJoin(cycles, eq(cycles.id, committeeMembers.cycleId))
    .where(and(eq(committeeMembers.cycleId, cycleId), eq(committeeMembers.userId, userId)));
  return row?.cycle ?? null;
}

/** States in which conflicts can be declared: from the first submission to the end of the review. */
export const CONFLICT_STATES = new Set(["open", "reviewing"]);

/**
 * The cycle's submitted proposals as a member sees them to declare conflicts: title and abstract only,
 * with the member's own conflicts (automatic and declared) and whether it is assigned to them.
 */
export async function conflictList(
  db: DbOrTx,
  { cycleId, member }: { cycleId: number; member: { id: number; institute: string } },
) {
  const list = await db
    .select({
      id: proposals.id,
      title: proposals.title,
      abstract: proposals.abstract,
      category: proposals.scienceCategory,
    })
    .from(proposals)
    .where(and(eq(proposals.cycleId, cycleId), inArray(proposals.status, BOARD_STATUSES)))
    .orderBy(asc(proposals.title), asc(proposals.id));
  const conflicts = await conflictsOf(db, { proposals: list, reviewers: [member] });
  const assigned = await db
    .select({ proposalId: reviewAssignments.proposalId, status: reviewAssignments.status })
    .from(reviewAssignments)
    .where(and(eq(reviewAssignments.cycleId, cycleId), eq(reviewAssignments.reviewerId, member.id)));
  return list.map((p) => {
    const c = conflicts.get(`${member.id}:${p.id}`);
    return {
      ...p,
      automatic: c ? c.kinds.filter((k) => k !== "declared").length > 0 : false,
      declared: c?.kinds.includes("declared") ?? false,
      conflict: c ? conflictText(c) : null,
      assignment: assigned.find((a) => a.proposalId === p.id)?.status ?? null,
    };
  });
}

export type ConflictChange = { ok: true; declined: boolean } | { ok: false; message: string };

/**
 * Declares a conflict with a reason. An assignment to that proposal is declined in the same
 * transaction (the chair sees it), unless its review has been submitted: then the declaration is refused.
 */
export async function declareConflict(
  db: Database,
  {
    cycleId,
    proposalId,
    reviewerId,
    reason,
    now = new Date(),
  }: {
    cycleId: number;
    proposalId: number;
    reviewerId: number;
    reason: string;
    now?: Date;
  },
): Promise<ConflictChange> {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .select({ proposal: proposals, cycle: cycles })
      .from(proposals)
      .innerJoin(cycles, eq(cycles.id, proposals.cycleId))
      .where(and(eq(proposals.id, proposalId), eq(proposals.cycleId, cycleId)));
    if (!row || !BOARD_STATUSES.includes(row.proposal.status))
      return { ok: false, message: "Proposal: not one of this cycle's submitted proposals." };
    if (!CONFLICT_STATES.has(row.cycle.state))
      return { ok: false, message: "Conflicts are declared until the review closes." };
    const [a] = await lockAssignments(
      tx,
      and(eq(reviewAssignments.proposalId, proposalId), eq(reviewAssignments.reviewerId, reviewerId)),
    );
    if (a?.review?.submittedAt)
      return { ok: false, message: "You have submitted a review of this proposal; tell the chair about the conflict." };
    await tx
      .insert(reviewConflicts)
      .values({ proposalId, reviewerId, reason, declaredAt: now })
      .onConflictDoUpdate({ target: [reviewConflicts.proposalId, reviewConflicts.reviewerId], set: { reason } });
    let declined = false;
    if (a && a.a.status === "active") {
      await tx
        .update(reviewAssignments)
        .set({ status: "declined", declineReason: `Conflict declared: ${reason}`, declinedAt: now })
        .where(eq(reviewAssignments.id, a.a.id));
      declined = true;
    }
    await tx.insert(auditLog).values({
      actorId: reviewerId,
      action: "conflict.declared",
      detail: { cycleId, proposalId, reason, declinedAssignment: declined },
      createdAt: now,
    });
    return { ok: true, declined };
  });
}

/** Withdraws a declared conflict (an assignment it declined stays declined). */
export async function withdrawConflict(
  db: Database,
  { cycleId, proposalId, reviewerId }: { cycleId: number; proposalId: number; reviewerId: number },
): Promise<ConflictChange> {
  return db.transaction(async (tx) => {
    const [cycle] = await tx.select().from(cycles).where(eq(cycles.id, cycleId));
    if (!cycle || !CONFLICT_STATES.has(cycle.state))
      return { ok: false, message: "Conflicts are declared until the review closes." };
    const gone = await tx
      .delete(reviewConflicts)
      .where(and(eq(reviewConflicts.proposalId, proposalId), eq(reviewConflicts.reviewerId, reviewerId)))
      .returning();
    if (gone.length === 0) return { ok: false, message: "You have not declared a conflict on this proposal." };
    await tx
      .insert(auditLog)
      .values({ actorId: reviewerId, action: "conflict.withdrawn", detail: { cycleId, proposalId } });
    return { ok: true, declined: false };
  });
}

/** Sends one reminder to each member with reviews not yet submitted; returns how many were sent. */
export async function sendReminders(
  db: Database,
  { cycleId, actorId, now = new Date() }: { cycleId: number; actorId: number; now?: Date },
): Promise<{ ok: true; sent: number } | { ok: false; message: string }> {
  const out = await db.transaction(async (tx) => {
    const [cycle] = await tx.select().from(cycles).where(eq(cycles.id, cycleId));
    if (cycle?.state !== "reviewing")
      return { ok: false as const, message: "Reminders go out while the cycle is with the reviewers." };
    const pending = await tx
      .select({ a: reviewAssignments, review: reviews, title: proposals.title, reviewer: users })
      .from(reviewAssignments)
      .innerJoin(proposals, proposalOfAssignment)
      .innerJoin(users, reviewerOfAssignment)
      .leftJoin(reviews, reviewOfAssignment)
      .where(and(eq(reviewAssignments.cycleId, cycleId), activeAssignment, isNull(reviews.submittedAt)))
      .orderBy(asc(users.id), asc(proposals.title));
    const byReviewer = new Map<number, typeof pending>();
    for (const p of pending) byReviewer.set(p.reviewer.id, [...(byReviewer.get(p.reviewer.id) ?? []), p]);
    for (const rows of byReviewer.values()) {
      await queueReminder(tx, {
        reviewer: rows[0].reviewer,
        cycleName: cycle.name,
        reviewDeadline: cycle.reviewDeadline,
        pending: rows.map((r) => ({
          title: r.title,
          progress: r.review ? "draft saved, not submitted" : "not started",
        })),
      });
      await tx
        .update(reviewAssignments)
        .set({ remindedAt: now })
        .where(
          inArray(
            reviewAssignments.id,
            rows.map((r) => r.a.id),
          ),
        );
    }
    await tx.insert(auditLog).values({
      actorId,
      action: "reviews.reminded",
      detail: { cycleId, cycle: cycle.name, reviewers: byReviewer.size },
      createdAt: now,
    });
    return { ok: true as const, sent: byReviewer.size };
  });
  if (out.ok) wakeOutboxSender();
  return out;
}
