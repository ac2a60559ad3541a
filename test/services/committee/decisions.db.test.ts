import { committeeCycle, person, registry, submitted, submittedReview } from "@test/committee-world";
import { testDb } from "@test/routes";
import { eq, sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { auditLog } from "~/db/schema/auth";
import { cycleDarkTime } from "~/db/schema/committee";
import { outboxMessages } from "~/db/schema/mail";
import { cycles, proposals } from "~/db/schema/proposals";
import { loadBoard } from "~/services/committee/board.server";
import { releaseDecisions, saveBoardSettings, saveDecisions } from "~/services/committee/decisions.server";
import { acceptedPrograms, decisionForTeam } from "~/services/committee/outcomes.server";

const w = { cycleId: 0, ids: [] as number[], chair: 0, compact: 0, medium: 0, coI: "", reviewerNames: [] as string[] };

beforeAll(async () => {
  const r = await registry();
  w.compact = r.configId["compact-3"];
  w.medium = r.configId["medium-4"];
  const chair = await person("chair", { roles: ["chair"] });
  const pi = await person("pi", { roles: ["proposer"], institute: "Far Away" });
  const coI = await person("coi", { roles: ["proposer"], institute: "Far Away" });
  const r1 = await person("Reviewer Alpha");
  const r2 = await person("Reviewer Beta");
  w.chair = chair.id;
  w.coI = coI.email;
  w.reviewerNames = [r1.name, r2.name];
  const cycle = await committeeCycle("D-cycle", { members: [r1.id, r2.id], configIds: [w.compact, w.medium] });
  w.cycleId = cycle.id;
  const mk = (title: string, hours: Record<number, number>, raDeg: number) =>
    submitted(cycle.id, {
      pi: pi.id,
      coIs: [{ id: coI.id, email: coI.email }],
      title,
      hours,
      bandId: r.bandH.id,
      raDeg,
    });
  w.ids = [await mk("Alpha", { [w.compact]: 4, [w.medium]: 2 }, 150), await mk("Beta", { [w.medium]: 6 }, 200)];
  for (const [i, pid] of w.ids.entries()) {
    for (const [k, rev] of [r1, r2].entries()) {
      await submittedReview(cycle.id, pid, rev.id, {
        score: 1 + i + k,
        commentToPi: `Comment ${i}${k} for the team.`,
        commentToCommittee: "internal",
      });
    }
  }
});

describe("decisions", () => {
  it("records grades and decisions only while the cycle is deciding", async () => {
    const entries = [
      {
        proposalId: w.ids[0],
        finalGrade: 1.5,
        decision: "accept" as const,
        hours: { [w.compact]: 3 },
        message: "Welcome",
      },
    ];
    expect(await saveDecisions(testDb(), { cycleId: w.cycleId, entries, actorId: w.chair })).toMatchObject({
      ok: false,
      message: /only while the cycle is “Decisions in progress”/,
    });
    await testDb().update(cycles).set({ state: "deciding" }).where(eq(cycles.id, w.cycleId));
    expect(await saveDecisions(testDb(), { cycleId: w.cycleId, entries, actorId: w.chair })).toEqual({
      ok: true,
      saved: 1,
    });
    const board = (await loadBoard(testDb(), { cycleId: w.cycleId }))!;
    expect(board.rows[0]).toMatchObject({
      title: "Alpha",
      finalGrade: 1.5,
      decision: { decision: "accept", hoursByConfig: { [w.compact]: 3 } },
    });
    expect(
      await saveBoardSettings(testDb(), {
        cycleId: w.cycleId,
        triageAfter: 1,
        disagreementSpread: 0.2,
        actorId: w.chair,
      }),
    ).toEqual({
      ok: true,
    });
    const after = (await loadBoard(testDb(), { cycleId: w.cycleId }))!;
    expect(after.rows.map((r) => [r.title, r.belowTriage])).toEqual([
      ["Alpha", false],
      ["Beta", true],
    ]);
  });

  it("keeps the cycle's darkness once computed, and recomputes it when the period changes", async () => {
    const [stored] = await testDb().select().from(cycleDarkTime).where(eq(cycleDarkTime.cycleId, w.cycleId));
    const [cycle] = await testDb().select().from(cycles).where(eq(cycles.id, w.cycleId));
    expect(stored.fingerprint).toContain(`|${cycle.observingStart}|${cycle.observingEnd}|24|1`);
    const shorter = new Date(Date.parse(`${cycle.observingEnd}T00:00:00Z`) - 10 * 86_400_000)
      .toISOString()
      .slice(0, 10);
    await testDb().update(cycles).set({ observingEnd: shorter }).where(eq(cycles.id, w.cycleId));
    const board = (await loadBoard(testDb(), { cycleId: w.cycleId }))!;
    const [again] = await testDb().select().from(cycleDarkTime).where(eq(cycleDarkTime.cycleId, w.cycleId));
    expect(again.fingerprint).toContain(`|${shorter}|`);
    expect(board.pressure.periodNights).toBe((stored.darkTime as { periodNights: number }).periodNights - 10);
    await testDb().update(cycles).set({ observingEnd: cycle.observingEnd }).where(eq(cycles.id, w.cycleId));
  });

  it("refuses to release while a proposal has no decision, and changes nothing", async () => {
    const out = await releaseDecisions(testDb(), { cycleId: w.cycleId, actorId: w.chair });
    expect(out).toEqual({ ok: false, message: "1 proposal has no decision yet: “Beta”." });
    const [cycle] = await testDb().select().from(cycles).where(eq(cycles.id, w.cycleId));
    expect(cycle.state).toBe("deciding");
    expect(await decisionForTeam(testDb(), { proposalId: w.ids[0] })).toBeNull();
  });

  it("releases: statuses change, every PI and co-I is mailed the decision, hours and anonymous comments, all audited", async () => {
    await saveDecisions(testDb(), {
      cycleId: w.cycleId,
      entries: [{ proposalId: w.ids[1], finalGrade: 3, decision: "waitlist", hours: {}, message: "Next in line." }],
      actorId: w.chair,
    });
    const mails0 = await testDb().select({ n: sql<number>`count(*)::int` }).from(outboxMessages);
    expect(await releaseDecisions(testDb(), { cycleId: w.cycleId, actorId: w.chair })).toEqual({
      ok: true,
      released: 2,
    });
    const statuses = await testDb().select({ id: proposals.id, status: proposals.status }).from(proposals);
    expect(Object.fromEntries(statuses.map((s) => [s.id, s.status]))).toEqual({
      [w.ids[0]]: "accepted",
      [w.ids[1]]: "waitlisted",
    });
    const [cycle] = await testDb().select().from(cycles).where(eq(cycles.id, w.cycleId));
    expect(cycle.state).toBe("closed");

    const mails = await testDb().select().from(outboxMessages).where(eq(outboxMessages.kind, "decision"));
    expect(mails.length - mails0[0].n).toBe(4); // 2 proposals × (PI + co-I)
    const alpha = mails.filter((m) => m.subject.includes("Alpha"));
    expect(alpha.map((m) => m.toAddress).sort()).toEqual(["coi@world.example", "pi@world.example"]);
    const text = alpha[0].text;
    expect(alpha[0].subject).toBe('Accepted: "Alpha" (D-cycle)');
    expect(text).toContain("compact-3: 3.0 h");
    expect(text).toContain("Reviewer 1:");
    expect(text).toContain("Comment 00 for the team.");
    expect(text).toContain("Welcome");
    // Reviewers' names and their comments to the committee never reach the team.
    for (const name of w.reviewerNames) expect(text).not.toContain(name);
    expect(text).not.toContain("internal");

    const card = await decisionForTeam(testDb(), { proposalId: w.ids[0] });
    expect(card).toMatchObject({
      decision: "accept",
      words: "Accepted",
      totalHours: 3,
      message: "Welcome",
      hours: [{ configuration: "compact-3", hours: 3 }],
    });
    expect(card?.comments.map((c) => c.label)).toEqual(["Reviewer 1", "Reviewer 2"]);

    const audit = await testDb().select().from(auditLog).where(eq(auditLog.action, "decision.released"));
    expect(audit).toHaveLength(2);
    expect(await testDb().select().from(auditLog).where(eq(auditLog.action, "cycle.release"))).toHaveLength(1);

    // The night plans' input: the accepted programme with its target and the hours owed.
    expect(await acceptedPrograms(testDb(), { cycleId: w.cycleId })).toMatchObject([
      {
        title: "Alpha",
        configuration: "compact-3",
        allocatedHours: 3,
        targets: [{ name: "Alpha target", hoursOwed: 3 }],
      },
    ]);
    // A released cycle takes no more decisions.
    expect(await releaseDecisions(testDb(), { cycleId: w.cycleId, actorId: w.chair })).toMatchObject({ ok: false });
  });
});
