/**
 * Moving a cycle through the committee's season (states.ts): the guard and the change in one
 * transaction that holds the cycle's row lock, with its entry in the audit log.
 */
import { and, eq, sql } from "drizzle-orm";
import type { Database, DbOrTx } from "~/db/client.server";
import { auditLog } from "~/db/schema/auth";
import { committeeMembers } from "~/db/schema/committee";
import { cycleConfigurations, cycles, proposals } from "~/db/schema/proposals";
import { type CycleForGuards, TRANSITION_SPECS, type Transition, transitionRefusal } from "./states";

/** What the guards need, read inside the caller's transaction. */
export async function guardFacts(db: DbOrTx, cycle: typeof cycles.$inferSelect): Promise<CycleForGuards> {
  const [[offers], [members]] = await Promise.all([
    db
      .select({ n: sql<number>`count(*)::int` })
      .from(cycleConfigurations)
      .where(eq(cycleConfigurations.cycleId, cycle.id)),
    db.select({ n: sql<number>`count(*)::int` }).from(committeeMembers).where(eq(committeeMembers.cycleId, cycle.id)),
  ]);
  return {
    state: cycle.state,
    submissionDeadline: cycle.submissionDeadline,
    reviewDeadline: cycle.reviewDeadline,
    offers: offers.n,
    members: members.n,
  };
}

export type TransitionResult = { ok: true; state: string; moved: number } | { ok: false; refusal: string };

/**
 * Performs `transition` on the cycle when its guard allows it now. Starting the review puts every
 * submitted proposal under review (`moved` counts them); reopening scoring sets the new review deadline.
 */
export async function transitionCycle(
  db: Database,
  {
    cycleId,
    transition,
    actorId,
    now = new Date(),
    newReviewDeadline = null,
  }: { cycleId: number; transition: Transition; actorId: number; now?: Date; newReviewDeadline?: Date | null },
): Promise<TransitionResult> {
  return db.transaction(async (tx) => {
    const [cycle] = await tx.select().from(cycles).where(eq(cycles.id, cycleId)).for("update");
    if (!cycle) return { ok: false, refusal: "No cycle with this number." };
    const refusal = transitionRefusal(await guardFacts(tx, cycle), transition, now, newReviewDeadline);
    if (refusal) return { ok: false, refusal };
    const to = TRANSITION_SPECS[transition].to;
    const set: Partial<typeof cycles.$inferInsert> = { state: to };
    if (transition === "reopen-scoring") set.reviewDeadline = newReviewDeadline;
    await tx.update(cycles).set(set).where(eq(cycles.id, cycleId));
    let moved = 0;
    if (transition === "start-review") {
      const rows = await tx
        .update(proposals)
        .set({ status: "under_review", updatedAt: now })
        .where(and(eq(proposals.cycleId, cycleId), eq(proposals.status, "submitted")))
        .returning({ id: proposals.id });
      moved = rows.length;
    }
    await tx.insert(auditLog).values({
      actorId,
      action: `cycle.${transition}`,
      detail: {
        cycleId,
        cycle: cycle.name,
        from: cycle.state,
        to,
        ...(transition === "start-review" ? { proposalsUnderReview: moved } : {}),
        ...(newReviewDeadline && transition === "reopen-scoring"
          ? { reviewDeadline: newReviewDeadline.toISOString() }
          : {}),
      },
      createdAt: now,
    });
    return { ok: true, state: to, moved };
  });
}
