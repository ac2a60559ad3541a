/**
 * A reviewer's review: drafts saved as often as wanted, one submission before the review deadline.
 *
 * Optimistic concurrency: every save names the version it was edited from (0 before the first save).
 * The save locks the review's row; when the stored version is not the one named (another tab, another
 * connection saved first) nothing is written and the newer text comes back, so the reviewer sees it
 * instead of overwriting it. The first save inserts with ON CONFLICT DO NOTHING, so two first saves at
 * once also end with one stored and one refused. Saves of different reviews never wait on each other.
 */
import { and, asc, eq, ne } from "drizzle-orm";
import type { Database, DbOrTx } from "~/db/client.server";
import { auditLog } from "~/db/schema/auth";
import { reviewAssignments, reviews } from "~/db/schema/committee";
import { cycles } from "~/db/schema/proposals";
import { users } from "~/db/schema/users";
import { activeAssignment, submittedReview } from "~/lib/conditions.server";
import { reviewerOfAssignment, reviewOfAssignment } from "~/lib/joins.server";
import { scoringClosedBecause } from "~/services/cycles/states";
import { onScale } from "./scale";
import type { ReviewFields } from "./schemas";

export type StoredReview = ReviewFields & { version: number; submittedAt: string | null; updatedAt: string };

export type SaveReviewResult =
  | { ok: true; version: number; submitted: boolean }
  | { ok: false; kind: "stale"; current: StoredReview; message: string }
  | { ok: false; kind: "refused"; message: string };

export function storedReview(r: typeof reviews.$inferSelect): StoredReview {
  return {
    score: r.score,
    commentToPi: r.commentToPi,
    commentToCommittee: r.commentToCommittee,
    confidence: r.confidence,
    version: r.version,
    submittedAt: r.submittedAt?.toISOString() ?? null,
    updatedAt: r.updatedAt.toISOString(),
  };
}

const STALE =
  "Someone saved this review after you opened it (another window or device). Nothing was overwritten: the newer text is shown below; copy what you need and save again.";

/**
 * Saves (or, with `submit`, submits) the review of an assignment by its reviewer. The fields must
 * already be checked (schemas.ts); the scoring window, the assignment and the version are checked here.
 */
export async function saveReview(
  db: Database,
  {
    assignmentId,
    reviewerId,
    baseVersion,
    fields,
    submit,
    now = new Date(),
  }: {
    assignmentId: number;
    reviewerId: number;
    baseVersion: number;
    fields: ReviewFields;
    submit: boolean;
    now?: Date;
  },
): Promise<SaveReviewResult> {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .select({ assignment: reviewAssignments, cycle: cycles })
      .from(reviewAssignments)
      .innerJoin(cycles, eq(cycles.id, reviewAssignments.cycleId))
      .where(eq(reviewAssignments.id, assignmentId));
    if (!row || row.assignment.reviewerId !== reviewerId)
      return { ok: false, kind: "refused", message: "Not your assignment." };
    if (row.assignment.status !== "active")
      return { ok: false, kind: "refused", message: "You declined this assignment; it can no longer be reviewed." };
    const closed = scoringClosedBecause(row.cycle, now);
    if (closed) return { ok: false, kind: "refused", message: closed };
    if (fields.score !== null && !onScale(fields.score, { best: row.cycle.scoreBest, worst: row.cycle.scoreWorst }))
      return { ok: false, kind: "refused", message: "Score: not on the cycle's scale." };
    const values = { ...fields, submittedAt: submit ? now : null, updatedAt: now };

    const [current] = await tx.select().from(reviews).where(eq(reviews.assignmentId, assignmentId)).for("update");
    if (!current) {
      if (baseVersion !== 0) return { ok: false, kind: "refused", message: "This review does not exist yet." };
      const [inserted] = await tx
        .insert(reviews)
        .values({ assignmentId, ...values, version: 1, createdAt: now })
        .onConflictDoNothing()
        .returning();
      if (!inserted) {
        const [winner] = await tx.select().from(reviews).where(eq(reviews.assignmentId, assignmentId));
        return { ok: false, kind: "stale", current: storedReview(winner), message: STALE };
      }
      if (submit) await auditSubmission(tx, row.assignment, now);
      return { ok: true, version: 1, submitted: submit };
    }
    if (current.submittedAt)
      return { ok: false, kind: "refused", message: "This review has been submitted; it can no longer change." };
    if (current.version !== baseVersion)
      return { ok: false, kind: "stale", current: storedReview(current), message: STALE };
    const version = current.version + 1;
    await tx
      .update(reviews)
      .set({ ...values, version })
      .where(and(eq(reviews.id, current.id), eq(reviews.version, baseVersion)));
    if (submit) await auditSubmission(tx, row.assignment, now);
    return { ok: true, version, submitted: submit };
  });
}

async function auditSubmission(tx: DbOrTx, a: typeof reviewAssignments.$inferSelect, now: Date) {
  await tx.insert(auditLog).values({
    actorId: a.reviewerId,
    action: "review.submitted",
    detail: { cycleId: a.cycleId, proposalId: a.proposalId, assignmentId: a.id },
    createdAt: now,
  });
}

/**
 * The other reviewers' submitted reviews of a proposal, without names: "Reviewer A", "Reviewer B", …
 * in the order they were assigned. Only for a reviewer who has submitted (the caller checks).
 */
export async function othersReviews(
  db: DbOrTx,
  { proposalId, reviewerId }: { proposalId: number; reviewerId: number },
) {
  const rows = await db
    .select({ score: reviews.score, confidence: reviews.confidence, commentToCommittee: reviews.commentToCommittee })
    .from(reviews)
    .innerJoin(reviewAssignments, reviewOfAssignment)
    .where(
      and(
        eq(reviewAssignments.proposalId, proposalId),
        ne(reviewAssignments.reviewerId, reviewerId),
        activeAssignment,
        submittedReview,
      ),
    )
    .orderBy(asc(reviewAssignments.id));
  return rows.map((r, i) => ({ label: `Reviewer ${String.fromCharCode(65 + (i % 26))}`, ...r }));
}

/** Every review of a proposal with the reviewer's name: for the chair only. */
export async function allReviews(db: DbOrTx, { proposalId }: { proposalId: number }) {
  return db
    .select({
      reviewer: users.name,
      status: reviewAssignments.status,
      declineReason: reviewAssignments.declineReason,
      score: reviews.score,
      confidence: reviews.confidence,
      commentToPi: reviews.commentToPi,
      commentToCommittee: reviews.commentToCommittee,
      submittedAt: reviews.submittedAt,
    })
    .from(reviewAssignments)
    .innerJoin(users, reviewerOfAssignment)
    .leftJoin(reviews, reviewOfAssignment)
    .where(eq(reviewAssignments.proposalId, proposalId))
    .orderBy(asc(reviewAssignments.id));
}
