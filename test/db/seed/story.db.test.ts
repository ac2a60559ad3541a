import { testDb } from "@test/routes";
import { and, eq, sql } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import {
  committeeMembers,
  proposalDecisions,
  reviewAssignments,
  reviewConflicts,
  reviews,
} from "~/db/schema/committee";
import { cycles, proposals } from "~/db/schema/proposals";
import { seedDemoScenario } from "~/db/seed/factories.server";
import { DEMO_COMMITTEE, demoCycles } from "~/db/seed/scenario";
import { loadBoard } from "~/services/committee/board.server";
import { acceptedPrograms } from "~/services/committee/outcomes.server";

const DAY = 86_400_000;

async function wipe() {
  await testDb().execute(sql`truncate users, sites, cycles, audit_log, outbox_messages restart identity cascade`);
}

async function count(table: string, where = "true") {
  const rows = await testDb().execute(sql.raw(`select count(*)::int as n from ${table} where ${where}`));
  return (rows as unknown as { n: number }[])[0].n;
}

/** The story issue 10 asks for, checked for a given load day. */
async function checkStory(today: Date) {
  const db = testDb();
  await seedDemoScenario(db, { today });
  const layout = demoCycles(today);
  const day = today.toISOString().slice(0, 10);
  const byName = async (name: string) => (await db.select().from(cycles).where(eq(cycles.name, name)))[0];
  const current = await byName(layout.current.name);
  const review = await byName(layout.review.name);
  const open = await byName(layout.open.name);

  // A cycle observing today, decided; one past its deadline under review; one open for proposals.
  expect(current.observingStart <= day && day <= current.observingEnd).toBe(true);
  expect(current.state).toBe("closed");
  expect(review.state).toBe("reviewing");
  expect(review.submissionDeadline.getTime()).toBeLessThan(today.getTime());
  expect(review.reviewDeadline!.getTime()).toBeGreaterThan(today.getTime());
  expect(review.observingStart > day).toBe(true);
  expect(open.state).toBe("open");
  expect(open.submissionDeadline.getTime()).toBeGreaterThan(today.getTime());
  expect(open.observingStart > review.observingEnd).toBe(true);
  for (const c of [current, review, open])
    expect(c.submissionDeadline.getTime()).toBeLessThan(Date.parse(c.observingStart));

  // Nothing was submitted after its cycle's deadline, nor in the future.
  const late = await db.execute(sql`select count(*)::int as n from proposals p join cycles c on c.id = p.cycle_id
    where p.submitted_at > c.submission_deadline or p.submitted_at > ${today.toISOString()}`);
  expect((late as unknown as { n: number }[])[0].n).toBe(0);

  // The cycle under review: ~12 proposals, 5 reviewers, declared conflicts, reviews at every stage.
  const under = await db
    .select({ n: sql<number>`count(*)::int` })
    .from(proposals)
    .where(and(eq(proposals.cycleId, review.id), eq(proposals.status, "under_review")));
  expect(under[0].n).toBeGreaterThanOrEqual(12);
  const members = await db.select().from(committeeMembers).where(eq(committeeMembers.cycleId, review.id));
  expect(members).toHaveLength(DEMO_COMMITTEE.length);
  expect(await count("review_conflicts")).toBe(2);
  const progress = await db
    .select({
      submitted: sql<number>`count(${reviews.submittedAt})::int`,
      drafts: sql<number>`(count(${reviews.id}) - count(${reviews.submittedAt}))::int`,
      none: sql<number>`(count(*) - count(${reviews.id}))::int`,
      declined: sql<number>`count(*) filter (where ${reviewAssignments.status} = 'declined')::int`,
    })
    .from(reviewAssignments)
    .leftJoin(reviews, eq(reviews.assignmentId, reviewAssignments.id))
    .where(eq(reviewAssignments.cycleId, review.id));
  expect(progress[0].submitted).toBeGreaterThan(0);
  expect(progress[0].drafts).toBeGreaterThan(0);
  expect(progress[0].none).toBeGreaterThan(progress[0].declined);
  expect(progress[0].declined).toBe(1);
  // Nobody reviews a proposal they are conflicted with (declared ones here; automatic ones in the assignment tests).
  const clash = await db
    .select({ n: sql<number>`count(*)::int` })
    .from(reviewAssignments)
    .innerJoin(
      reviewConflicts,
      and(
        eq(reviewConflicts.proposalId, reviewAssignments.proposalId),
        eq(reviewConflicts.reviewerId, reviewAssignments.reviewerId),
      ),
    );
  expect(clash[0].n).toBe(0);

  // The decided cycle: every decision released, accepted programmes with hours for the night plans.
  const decided = await db.select().from(proposalDecisions).where(eq(proposalDecisions.cycleId, current.id));
  expect(decided.length).toBe(6);
  expect(decided.every((d) => d.releasedAt !== null && d.releasedAt.getTime() < today.getTime())).toBe(true);
  const programs = await acceptedPrograms(db, { cycleId: current.id });
  expect(programs.length).toBeGreaterThanOrEqual(4);
  for (const p of programs) {
    const owed = p.targets.reduce((s, t) => s + t.hoursOwed, 0);
    expect(owed).toBeCloseTo(p.allocatedHours, 9);
  }

  // Every demo target is observable in its cycle: the boards place every requested hour in LST.
  for (const c of [current, review]) {
    const board = (await loadBoard(db, { cycleId: c.id }))!;
    expect(board.pressure.unplaceable).toEqual([]);
    expect(board.rows.length).toBeGreaterThanOrEqual(6);
  }
  return layout;
}

describe("the demo story, laid out around the load day", () => {
  it("holds on one day and on another, with the cycles moving along", async () => {
    const a = await checkStory(new Date("2027-02-17T10:00:00Z"));
    expect([a.current.name, a.review.name, a.open.name]).toEqual(["2026B", "2027A", "2027B"]);
    await wipe();
    const b = await checkStory(new Date("2028-08-31T23:30:00Z"));
    expect([b.current.name, b.review.name, b.open.name]).toEqual(["2028A", "2028B", "2029A"]);
  });

  it("is idempotent on the same day", async () => {
    await wipe();
    const today = new Date("2027-05-03T08:00:00Z");
    await seedDemoScenario(testDb(), { today });
    const before = [
      await count("proposals"),
      await count("review_assignments"),
      await count("reviews"),
      await count("audit_log"),
    ];
    await seedDemoScenario(testDb(), { today });
    await seedDemoScenario(testDb(), { today: new Date(today.getTime() + 0.2 * DAY) });
    expect([
      await count("proposals"),
      await count("review_assignments"),
      await count("reviews"),
      await count("audit_log"),
    ]).toEqual(before);
  });
});

describe("the demo cycles' dates", () => {
  it("keep their order on every day of a year", () => {
    for (let t = Date.parse("2030-01-01T00:00:00Z"); t < Date.parse("2031-01-01T00:00:00Z"); t += DAY) {
      const today = new Date(t + 13 * 3_600_000);
      const { current, review, open } = demoCycles(today);
      const day = today.toISOString().slice(0, 10);
      expect(current.observingStart <= day && day <= current.observingEnd).toBe(true);
      expect(new Set([current.name, review.name, open.name]).size).toBe(3);
      expect(review.submissionDeadline < today && today < review.reviewDeadline).toBe(true);
      expect(review.decisionDate < review.observingStart).toBe(true);
      expect(open.submissionDeadline > today).toBe(true);
      expect(open.decisionDate < open.observingStart).toBe(true);
      expect(current.decisionDate < current.observingStart).toBe(true);
    }
  });
});
