/**
 * The committee's part of the demo story, idempotent:
 *  - the decided cycle: three reviewers per proposal (the app's auto-assignment), every review
 *    submitted, the chair's grades and decisions with hours, released on the decision date;
 *  - the cycle under review: two declared conflicts, three reviewers per proposal, about half the
 *    reviews submitted, some drafts, some not started, and one assignment declined with its reason.
 * Scores follow each proposal's `quality` with a harsher or kinder hand per reviewer. No notices are
 * written (the seed sends no mail).
 */
import { and, asc, eq, sql } from "drizzle-orm";
import type { Database } from "~/db/client.server";
import { configurations } from "~/db/schema/array";
import { auditLog } from "~/db/schema/auth";
import { allocatedHours, proposalDecisions, reviewAssignments, reviewConflicts, reviews } from "~/db/schema/committee";
import { type cycles, proposals } from "~/db/schema/proposals";
import { users } from "~/db/schema/users";
import { previewAutoAssign } from "~/services/committee/assignments.server";
import { DEMO_CHAIR, type DemoCycleKey, type DemoProposal } from "./scenario";

type CycleRow = typeof cycles.$inferSelect;
const DAY_MS = 86_400_000;

/** How much harsher (+) or kinder (−) than the committee each demo reviewer scores. */
const HAND: Record<string, number> = {
  "amara.okafor@harmattan-obs.example": 0,
  "kenji.morrow@tidewater.example": 0.6,
  "dario.petrescu@baltic-stellar.example": -0.5,
  "yusuf.karaca@meseta-roja.example": 0.3,
  "mirela.voinea@carpathian-stellar.example": -0.2,
};

const TO_PI = [
  "A compelling case, clearly argued; the feasibility report supports every hour asked for.",
  "A strong case. Say more about the calibrators and how often they are observed.",
  "A sound idea, but the expected visibilities leave little margin: justify the hours per target.",
  "The science is interesting, but the proposal does not show that the configuration resolves the target.",
  "The case does not address that the target is at the edge of what the array can track.",
];
const TO_COMMITTEE = [
  "Top of my list.",
  "Solid; I would grant it.",
  "Middle of the pack for me.",
  "Weak on feasibility.",
  "Not feasible as proposed.",
];
const CONFIDENCE = ["high", "medium", "high", "low", "medium"] as const;

/** Progress of the review cycle's assignments, by their order: about half submitted. */
const PROGRESS = ["submitted", "submitted", "draft", "submitted", "none", "draft", "submitted", "none"] as const;

/** The declared conflicts of the cycle under review. */
const DECLARED = [
  {
    reviewer: "kenji.morrow@tidewater.example",
    title: "Spotted surface of Salar Veil 44",
    reason: "The PI was my doctoral student until last year.",
  },
  {
    reviewer: "yusuf.karaca@meseta-roja.example",
    title: "Imaging the spots of Brasero 9",
    reason: "I lead a competing programme on the same star.",
  },
];
const DECLINER = "mirela.voinea@carpathian-stellar.example";
const DECLINE_REASON = "Outside my field: I cannot judge the models of this proposal fairly.";
/** One proposal the reviewers split on (a disagreement on the board). */
const SPLIT = "Imaging the spots of Brasero 9";

function scoreOf(quality: number, hand: number, p: number, r: number, title: string): number {
  const noise = [0, -1, 0, 1][(p * 7 + r * 3) % 4] * 0.6;
  const x = title === SPLIT && r % 2 === 1 ? 4 : quality + hand + noise;
  return Math.min(5, Math.max(1, Math.round(x)));
}

async function byEmail(db: Database) {
  const rows = await db.select({ id: users.id, email: users.email }).from(users);
  return new Map(rows.map((r) => [r.email.toLowerCase(), r.id]));
}

async function assignOnce(db: Database, cycle: CycleRow, chairId: number, at: Date) {
  const [{ n }] = await db
    .select({ n: sql<number>`count(*)::int` })
    .from(reviewAssignments)
    .where(eq(reviewAssignments.cycleId, cycle.id));
  if (n > 0) return false;
  const preview = await previewAutoAssign(db, { cycleId: cycle.id, perProposal: 3 });
  if (preview?.added.length)
    await db.insert(reviewAssignments).values(
      preview.added.map((a) => ({
        cycleId: cycle.id,
        proposalId: a.proposalId,
        reviewerId: a.reviewerId,
        assignedById: chairId,
        assignedAt: at,
      })),
    );
  return true;
}

async function writeReviews(
  db: Database,
  { cycle, key, demos, today }: { cycle: CycleRow; key: DemoCycleKey; demos: DemoProposal[]; today: Date },
) {
  const [{ n }] = await db
    .select({ n: sql<number>`count(*)::int` })
    .from(reviews)
    .innerJoin(reviewAssignments, eq(reviewAssignments.id, reviews.assignmentId))
    .where(eq(reviewAssignments.cycleId, cycle.id));
  if (n > 0) return; // written on an earlier run
  const people = await byEmail(db);
  const emailOf = new Map([...people].map(([e, id]) => [id, e]));
  const rows = await db
    .select({ a: reviewAssignments, title: proposals.title })
    .from(reviewAssignments)
    .innerJoin(proposals, eq(proposals.id, reviewAssignments.proposalId))
    .where(and(eq(reviewAssignments.cycleId, cycle.id), eq(reviewAssignments.status, "active")))
    .orderBy(asc(reviewAssignments.id));
  const titles = demos.map((d) => d.title);
  let declined = false;
  for (const [i, { a, title }] of rows.entries()) {
    const demo = demos.find((d) => d.title === title);
    if (!demo?.quality) continue;
    const email = emailOf.get(a.reviewerId) ?? "";
    const progress = key === "current" ? "submitted" : PROGRESS[i % PROGRESS.length];
    if (progress === "none") {
      if (key === "review" && !declined && email === DECLINER) {
        await db
          .update(reviewAssignments)
          .set({
            status: "declined",
            declineReason: DECLINE_REASON,
            declinedAt: new Date(today.getTime() - 3 * DAY_MS),
          })
          .where(eq(reviewAssignments.id, a.id));
        declined = true;
      }
      continue;
    }
    const score = scoreOf(demo.quality, HAND[email] ?? 0, titles.indexOf(title), i, title);
    const submittedAt =
      progress === "submitted"
        ? new Date(
            key === "current"
              ? (cycle.reviewDeadline?.getTime() ?? today.getTime()) - ((i % 7) + 1) * DAY_MS
              : today.getTime() - ((i % 5) + 1) * DAY_MS,
          )
        : null;
    const at = submittedAt ?? new Date(today.getTime() - DAY_MS);
    await db.insert(reviews).values({
      assignmentId: a.id,
      score: progress === "draft" && i % 2 === 0 ? null : score,
      commentToPi: progress === "draft" ? TO_PI[score - 1].split(";")[0] : TO_PI[score - 1],
      commentToCommittee: progress === "draft" ? "" : TO_COMMITTEE[score - 1],
      confidence: progress === "draft" ? null : CONFIDENCE[i % CONFIDENCE.length],
      submittedAt,
      version: progress === "draft" ? 2 : 3,
      createdAt: new Date(at.getTime() - DAY_MS),
      updatedAt: at,
    });
  }
}

async function declareConflicts(db: Database, cycle: CycleRow, today: Date) {
  const people = await byEmail(db);
  for (const d of DECLARED) {
    const [p] = await db
      .select({ id: proposals.id })
      .from(proposals)
      .where(and(eq(proposals.cycleId, cycle.id), eq(proposals.title, d.title)));
    const reviewerId = people.get(d.reviewer);
    if (!p || !reviewerId) continue;
    await db
      .insert(reviewConflicts)
      .values({ proposalId: p.id, reviewerId, reason: d.reason, declaredAt: new Date(today.getTime() - 10 * DAY_MS) })
      .onConflictDoNothing();
  }
}

async function writeDecisions(db: Database, cycle: CycleRow, demos: DemoProposal[], chairId: number) {
  const configs = await db.select({ id: configurations.id, name: configurations.name }).from(configurations);
  const releasedAt = new Date(`${cycle.decisionDate ?? cycle.observingStart}T12:00:00Z`);
  for (const demo of demos) {
    if (!demo.decision) continue;
    const [p] = await db
      .select({ id: proposals.id })
      .from(proposals)
      .where(and(eq(proposals.cycleId, cycle.id), eq(proposals.title, demo.title)));
    if (!p) continue;
    const [written] = await db
      .insert(proposalDecisions)
      .values({
        proposalId: p.id,
        cycleId: cycle.id,
        finalGrade: demo.decision.grade,
        decision: demo.decision.kind,
        message: demo.decision.message,
        decidedById: chairId,
        releasedAt,
        createdAt: releasedAt,
        updatedAt: releasedAt,
      })
      .onConflictDoNothing()
      .returning();
    if (!written) continue;
    const hours = Object.entries(demo.decision.hours ?? {}).map(([name, h]) => ({
      proposalId: p.id,
      configurationId: configs.find((c) => c.name === name)!.id,
      hours: h,
    }));
    if (hours.length) await db.insert(allocatedHours).values(hours);
  }
}

/** The committee's story in the decided cycle and the cycle under review. */
export async function ensureDemoCommittee(
  db: Database,
  { cycles: demoCycles, demos, today }: { cycles: Record<DemoCycleKey, CycleRow>; demos: DemoProposal[]; today: Date },
) {
  const chairId = (await byEmail(db)).get(DEMO_CHAIR)!;
  const { current, review } = demoCycles;
  const review0 = new Date(review.submissionDeadline.getTime() + DAY_MS);
  const current0 = new Date(current.submissionDeadline.getTime() + DAY_MS);
  await declareConflicts(db, review, today);
  const firstTime = await assignOnce(db, review, chairId, review0);
  if (await assignOnce(db, current, chairId, current0)) {
    await db.insert(auditLog).values([
      {
        actorId: chairId,
        action: "cycle.start-review",
        detail: { cycleId: current.id, cycle: current.name },
        createdAt: current0,
      },
      {
        actorId: chairId,
        action: "cycle.release",
        detail: { cycleId: current.id, cycle: current.name, from: "deciding", to: "closed" },
        createdAt: new Date(`${current.decisionDate}T12:00:00Z`),
      },
    ]);
  }
  if (firstTime)
    await db.insert(auditLog).values({
      actorId: chairId,
      action: "cycle.start-review",
      detail: { cycleId: review.id, cycle: review.name, from: "open", to: "reviewing" },
      createdAt: review0,
    });
  await writeReviews(db, { cycle: current, key: "current", demos: demos.filter((d) => d.cycle === "current"), today });
  await writeReviews(db, { cycle: review, key: "review", demos: demos.filter((d) => d.cycle === "review"), today });
  await writeDecisions(
    db,
    current,
    demos.filter((d) => d.cycle === "current"),
    chairId,
  );
}
