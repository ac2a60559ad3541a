/** Writing observing cycles with their offers and committee, each change in one transaction. */
import { and, eq, isNotNull, sql } from "drizzle-orm";
import type { Database, Transaction } from "~/db/client.server";
import { configurations } from "~/db/schema/array";
import { committeeMembers, reviewAssignments, reviews } from "~/db/schema/committee";
import { type CycleState, cycleConfigurations, cycles, proposalHours, proposals } from "~/db/schema/proposals";
import { users } from "~/db/schema/users";
import { activeAssignment, scopeExcept } from "~/lib/conditions.server";
import type { FieldErrors } from "~/lib/form-errors";
import { configurationOf, reviewerOfAssignment, reviewOfAssignment } from "~/lib/joins.server";
import type { CycleInput } from "./schemas";

/** The cycle's own columns of a checked input (committee fields only where given). */
function cycleColumns(input: CycleInput) {
  const { name, description, observingStart, observingEnd, submissionDeadline } = input;
  const out: Partial<typeof cycles.$inferInsert> = {
    name,
    description,
    observingStart,
    observingEnd,
    submissionDeadline,
  };
  if (input.reviewDeadline !== undefined) out.reviewDeadline = input.reviewDeadline;
  if (input.decisionDate !== undefined) out.decisionDate = input.decisionDate;
  if (input.scoreBest !== undefined) out.scoreBest = input.scoreBest;
  if (input.scoreWorst !== undefined) out.scoreWorst = input.scoreWorst;
  return out;
}

async function writeOffers(tx: Transaction, cycleId: number, offers: CycleInput["offers"]) {
  await tx.delete(cycleConfigurations).where(eq(cycleConfigurations.cycleId, cycleId));
  if (offers.length) {
    await tx
      .insert(cycleConfigurations)
      .values(offers.map((o) => ({ cycleId, configurationId: o.configurationId, nightsAvailable: o.nightsAvailable })));
  }
}

async function writeCommittee(tx: Transaction, cycleId: number, committee: number[] | undefined) {
  if (committee === undefined) return;
  await tx
    .delete(committeeMembers)
    .where(scopeExcept(eq(committeeMembers.cycleId, cycleId), committeeMembers.userId, committee));
  if (committee.length)
    await tx
      .insert(committeeMembers)
      .values(committee.map((userId) => ({ cycleId, userId })))
      .onConflictDoNothing();
}

/**
 * Creates a cycle with its offers and committee (the chair's form and the seed). `state` defaults to
 * the column's default ("open"); the chair's form creates cycles in "draft".
 */
export async function createCycle(
  db: Database,
  input: CycleInput & { state?: CycleState },
  createdById: number | null,
) {
  return db.transaction(async (tx) => {
    const [cycle] = await tx
      .insert(cycles)
      .values({
        ...(cycleColumns(input) as typeof cycles.$inferInsert),
        ...(input.state ? { state: input.state } : {}),
        createdById,
      })
      .returning();
    await writeOffers(tx, cycle.id, input.offers);
    await writeCommittee(tx, cycle.id, input.committee);
    return cycle;
  });
}

/** What an update may not change once the committee has work in the cycle, as field errors. */
async function committeeRefusals(tx: Transaction, cycleId: number, input: CycleInput): Promise<FieldErrors> {
  const errors: FieldErrors = {};
  const [current] = await tx.select().from(cycles).where(eq(cycles.id, cycleId));
  // No submission after the deadline: once the review has started, the deadline cannot move ahead again.
  if (
    current.state !== "draft" &&
    current.state !== "open" &&
    input.submissionDeadline.getTime() > Math.max(Date.now(), current.submissionDeadline.getTime())
  )
    errors.submissionDeadline = "Deadline: the review has started; the submission deadline can no longer move ahead";
  const scaleChanged =
    (input.scoreBest !== undefined && input.scoreBest !== current.scoreBest) ||
    (input.scoreWorst !== undefined && input.scoreWorst !== current.scoreWorst);
  if (scaleChanged) {
    const [scored] = await tx
      .select({ n: sql<number>`count(*)::int` })
      .from(reviews)
      .innerJoin(reviewAssignments, reviewOfAssignment)
      .where(and(eq(reviewAssignments.cycleId, cycleId), isNotNull(reviews.score)));
    if (scored.n > 0)
      errors.scoreWorst = `Score scale: ${scored.n} review${scored.n === 1 ? " has" : "s have"} a score on the current scale; it can no longer change`;
  }
  if (input.committee !== undefined) {
    const busy = await tx
      .selectDistinct({ id: users.id, name: users.name })
      .from(reviewAssignments)
      .innerJoin(users, reviewerOfAssignment)
      .where(and(eq(reviewAssignments.cycleId, cycleId), activeAssignment));
    const leaving = busy.filter((b) => !input.committee!.includes(b.id));
    if (leaving.length)
      errors.committee = `Committee: ${leaving.map((l) => l.name).join(", ")} still ${leaving.length === 1 ? "has" : "have"} assignments; reassign them first`;
  }
  return errors;
}

/**
 * Updates a cycle. A configuration that proposals of this cycle already request cannot be withdrawn
 * from the offer (their names are returned as `blocked`); the score scale cannot change once a review
 * has a score, nor can a member with assignments leave the committee (`errors`).
 */
export async function updateCycle(db: Database, { cycleId, input }: { cycleId: number; input: CycleInput }) {
  return db.transaction(async (tx) => {
    const requested = await tx
      .selectDistinct({ configurationId: proposalHours.configurationId, name: configurations.name })
      .from(proposalHours)
      .innerJoin(proposals, eq(proposals.id, proposalHours.proposalId))
      .innerJoin(configurations, configurationOf(proposalHours.configurationId))
      .where(eq(proposals.cycleId, cycleId));
    const offered = new Set(input.offers.map((o) => o.configurationId));
    const blocked = requested.filter((r) => !offered.has(r.configurationId)).map((r) => r.name);
    if (blocked.length) return { ok: false as const, blocked, errors: {} };
    const errors = await committeeRefusals(tx, cycleId, input);
    if (Object.keys(errors).length) return { ok: false as const, blocked: [], errors };
    await tx.update(cycles).set(cycleColumns(input)).where(eq(cycles.id, cycleId));
    await writeOffers(tx, cycleId, input.offers);
    await writeCommittee(tx, cycleId, input.committee);
    return { ok: true as const, blocked: [], errors: {} };
  });
}
