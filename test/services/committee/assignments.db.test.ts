import { committeeCycle, registry } from "@test/committee-world";
import { testDb } from "@test/routes";
import { and, eq, sql } from "drizzle-orm";
import fc from "fast-check";
import { beforeAll, describe, expect, it } from "vitest";
import { reviewAssignments, reviewConflicts, reviews } from "~/db/schema/committee";
import { outboxMessages } from "~/db/schema/mail";
import { cycles, proposalMembers, proposals } from "~/db/schema/proposals";
import { ensureUser } from "~/db/seed/factories.server";
import {
  declineAssignment,
  previewAutoAssign,
  removeAssignment,
  saveAssignments,
} from "~/services/committee/assignments.server";

let configId = 0;
let run = 0;
const CATEGORIES = ["Stellar surfaces and diameters", "Binary and multiple stars", "Circumstellar environments"];
const norm = (s: string) => s.trim().toLowerCase();

beforeAll(async () => {
  configId = (await registry()).configId["compact-3"];
});

type Committee = {
  reviewers: { institute: string }[];
  proposals: { pi: number; coI: number | null; piInstitute: string; category: number }[];
  declared: readonly { reviewer: number; proposal: number }[];
  perProposal: number;
};

/** Writes a random committee: reviewers (people 0..k−1), outsiders as PIs, proposals under review, declarations. */
async function write(c: Committee) {
  run++;
  const db = testDb();
  const reviewers = [];
  for (const [i, r] of c.reviewers.entries())
    reviewers.push(
      await ensureUser(db, {
        email: `r${i}.${run}@prop.example`,
        name: `R${i} ${run}`,
        institute: r.institute,
        roles: ["reviewer"],
      }),
    );
  const cycle = await committeeCycle(`prop-${run}`, { members: reviewers.map((r) => r.id), configIds: [configId] });
  const ids: number[] = [];
  for (const [j, p] of c.proposals.entries()) {
    // pi < k: one of the reviewers is the PI (a team conflict); else an outsider from `piInstitute`.
    const pi =
      p.pi < reviewers.length
        ? reviewers[p.pi]
        : await ensureUser(db, { email: `pi${j}.${run}@prop.example`, name: `PI ${j}`, institute: p.piInstitute });
    const [row] = await db
      .insert(proposals)
      .values({
        cycleId: cycle.id,
        piId: pi.id,
        title: `P${j}`,
        scienceCategory: CATEGORIES[p.category],
        status: "under_review",
        currentVersion: 1,
      })
      .returning();
    if (p.coI !== null && p.coI < reviewers.length)
      await db
        .insert(proposalMembers)
        .values({ proposalId: row.id, email: reviewers[p.coI].email, userId: reviewers[p.coI].id });
    ids.push(row.id);
  }
  for (const d of c.declared)
    if (d.reviewer < reviewers.length && d.proposal < ids.length)
      await db
        .insert(reviewConflicts)
        .values({ proposalId: ids[d.proposal], reviewerId: reviewers[d.reviewer].id, reason: "random" })
        .onConflictDoNothing();
  return { cycleId: cycle.id, reviewers, ids };
}

/** Conflicted, by an independent reading of the rules: on the team, same institute (trimmed, case-blind), declared. */
function conflicted(c: Committee, reviewer: number, proposal: number) {
  const p = c.proposals[proposal];
  const inst = norm(c.reviewers[reviewer].institute);
  const teamInstitutes = [p.pi < c.reviewers.length ? c.reviewers[p.pi].institute : p.piInstitute];
  if (p.coI !== null && p.coI < c.reviewers.length) teamInstitutes.push(c.reviewers[p.coI].institute);
  return (
    p.pi === reviewer ||
    p.coI === reviewer ||
    (inst !== "" && teamInstitutes.map(norm).includes(inst)) ||
    c.declared.some((d) => d.reviewer === reviewer && d.proposal === proposal)
  );
}

const committees = (withConflicts: boolean) =>
  fc.record({
    reviewers: fc.array(
      fc.record({
        institute: withConflicts ? fc.constantFrom("Inst A", " inst a ", "Inst B", "") : fc.constant("Committee Hall"),
      }),
      { minLength: 2, maxLength: 6 },
    ),
    proposals: fc.array(
      fc.record({
        pi: withConflicts ? fc.integer({ min: 0, max: 8 }) : fc.constant(99),
        coI: withConflicts ? fc.option(fc.integer({ min: 0, max: 5 })) : fc.constant(null),
        piInstitute: withConflicts ? fc.constantFrom("Inst A", "Inst C") : fc.constant("Elsewhere"),
        category: fc.integer({ min: 0, max: 2 }),
      }),
      { minLength: 1, maxLength: 7 },
    ),
    declared: withConflicts
      ? fc.array(fc.record({ reviewer: fc.integer({ min: 0, max: 5 }), proposal: fc.integer({ min: 0, max: 6 }) }), {
          maxLength: 4,
        })
      : fc.constant([] as { reviewer: number; proposal: number }[]),
    perProposal: fc.integer({ min: 1, max: 3 }),
  });

async function assignAndRead(c: Committee) {
  const w = await write(c);
  const preview = (await previewAutoAssign(testDb(), { cycleId: w.cycleId, perProposal: c.perProposal }))!;
  if (preview.added.length) {
    const saved = await saveAssignments(testDb(), {
      cycleId: w.cycleId,
      pairs: preview.added,
      actorId: w.reviewers[0].id,
      mode: "auto",
    });
    expect(saved.ok).toBe(true);
  }
  const rows = await testDb().select().from(reviewAssignments).where(eq(reviewAssignments.cycleId, w.cycleId));
  const reviewerIndex = new Map(w.reviewers.map((r, i) => [r.id, i]));
  const proposalIndex = new Map(w.ids.map((id, j) => [id, j]));
  return {
    w,
    rows: rows.map((r) => ({ reviewer: reviewerIndex.get(r.reviewerId)!, proposal: proposalIndex.get(r.proposalId)! })),
  };
}

describe("auto-assign through the committee's service", () => {
  it("never picks a conflicted reviewer and fills each proposal as far as the conflicts allow (random committees)", async () => {
    await fc.assert(
      fc.asyncProperty(committees(true), async (c) => {
        const { rows } = await assignAndRead(c);
        expect(new Set(rows.map((r) => `${r.reviewer}:${r.proposal}`)).size).toBe(rows.length);
        for (const r of rows) expect(conflicted(c, r.reviewer, r.proposal)).toBe(false);
        c.proposals.forEach((_, j) => {
          const free = c.reviewers.filter((_, i) => !conflicted(c, i, j)).length;
          expect(rows.filter((r) => r.proposal === j)).toHaveLength(Math.min(c.perProposal, free));
        });
      }),
      { numRuns: 15 },
    );
  });

  it("balances the load, most and fewest within one, when nobody is conflicted (random committees)", async () => {
    await fc.assert(
      fc.asyncProperty(committees(false), async (c) => {
        const { rows } = await assignAndRead(c);
        const loads = c.reviewers.map((_, i) => rows.filter((r) => r.reviewer === i).length);
        expect(Math.max(...loads) - Math.min(...loads)).toBeLessThanOrEqual(1);
        expect(rows).toHaveLength(c.proposals.length * Math.min(c.perProposal, c.reviewers.length));
      }),
      { numRuns: 12 },
    );
  });

  it("keeps what exists on a re-run, never asks a reviewer who declined, and notifies each reviewer once", async () => {
    const c: Committee = {
      reviewers: [{ institute: "A" }, { institute: "B" }, { institute: "C" }, { institute: "D" }],
      proposals: [0, 1, 2].map(() => ({ pi: 99, coI: null, piInstitute: "Z", category: 0 })),
      declared: [],
      perProposal: 2,
    };
    const before = await testDb().select({ n: sql<number>`count(*)::int` }).from(outboxMessages);
    const { w, rows } = await assignAndRead(c);
    expect(rows).toHaveLength(6);
    const after = await testDb()
      .select({ n: sql<number>`count(*)::int` })
      .from(outboxMessages)
      .where(eq(outboxMessages.kind, "assignment"));
    const notified = new Set(rows.map((r) => r.reviewer)).size;
    expect(after[0].n - before[0].n).toBe(notified);

    const stored = await testDb().select().from(reviewAssignments).where(eq(reviewAssignments.cycleId, w.cycleId));
    // One is scored, one is declined with a reason.
    await testDb().insert(reviews).values({ assignmentId: stored[0].id, score: 2, commentToPi: "x" });
    const decline = await declineAssignment(testDb(), {
      assignmentId: stored[1].id,
      reviewerId: stored[1].reviewerId,
      reason: "not my field",
    });
    expect(decline).toEqual({ ok: true });
    const again = (await previewAutoAssign(testDb(), { cycleId: w.cycleId, perProposal: 2 }))!;
    expect(again.added).toHaveLength(1);
    expect(again.added[0].proposalId).toBe(stored[1].proposalId);
    expect(again.added[0].reviewerId).not.toBe(stored[1].reviewerId);
    expect(again.loads.reduce((s, l) => s + l.kept, 0)).toBe(5);
    // Taking back the scored one is refused; an unstarted one can be.
    expect(
      await removeAssignment(testDb(), { cycleId: w.cycleId, assignmentId: stored[0].id, actorId: 1 }),
    ).toMatchObject({ ok: false });
    expect(await removeAssignment(testDb(), { cycleId: w.cycleId, assignmentId: stored[2].id, actorId: 1 })).toEqual({
      ok: true,
    });
  });

  it("refuses a conflicted or repeated pair and writes nothing; assigns only while the cycle is with the reviewers", async () => {
    const c: Committee = {
      reviewers: [{ institute: "Same" }, { institute: "Other" }],
      proposals: [{ pi: 99, coI: null, piInstitute: "same ", category: 1 }],
      declared: [],
      perProposal: 1,
    };
    const w = await write(c);
    const [p] = w.ids;
    const mixed = await saveAssignments(testDb(), {
      cycleId: w.cycleId,
      pairs: [
        { proposalId: p, reviewerId: w.reviewers[1].id },
        { proposalId: p, reviewerId: w.reviewers[0].id },
      ],
      actorId: w.reviewers[1].id,
      mode: "by hand",
    });
    expect(mixed).toEqual({
      ok: false,
      message: `${w.reviewers[0].name} has a conflict with “P0” (same institute as the team).`,
    });
    expect(await testDb().select().from(reviewAssignments).where(eq(reviewAssignments.cycleId, w.cycleId))).toEqual([]);
    const twice = await saveAssignments(testDb(), {
      cycleId: w.cycleId,
      pairs: [
        { proposalId: p, reviewerId: w.reviewers[1].id },
        { proposalId: p, reviewerId: w.reviewers[1].id },
      ],
      actorId: 1,
      mode: "by hand",
    });
    expect(twice.ok).toBe(false);
    await testDb().update(cycles).set({ state: "deciding" }).where(eq(cycles.id, w.cycleId));
    const closed = await saveAssignments(testDb(), {
      cycleId: w.cycleId,
      pairs: [{ proposalId: p, reviewerId: w.reviewers[1].id }],
      actorId: 1,
      mode: "by hand",
    });
    expect(closed).toEqual({ ok: false, message: "Reviewers are assigned while the cycle is with the reviewers." });
    const rows = await testDb()
      .select()
      .from(reviewAssignments)
      .where(and(eq(reviewAssignments.cycleId, w.cycleId)));
    expect(rows).toEqual([]);
  });
});
