import { nightSettings } from "@test/nights";
import { testDb } from "@test/routes";
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { outboxMessages } from "~/db/schema/mail";
import { nightConfigurations, nightPlanBlocks, nightPlans } from "~/db/schema/nights";
import { seedDemoScenario } from "~/db/seed/factories.server";
import { validatePlan } from "~/engine";
import { installRun } from "~/services/nights/calendar.server";
import { planContext, planRequest } from "~/services/nights/candidates";
import {
  autoPlan,
  discardDraft,
  editPlan,
  markBlock,
  replanRest,
  savePlanSettings,
} from "~/services/nights/commands.server";
import { loadNight } from "~/services/nights/night.server";
import { programNights } from "~/services/nights/program.server";
import { publishPlan } from "~/services/nights/publish.server";
import { nightPage, planExport } from "~/services/nights/queries.server";
import { addDays, countRows, createNightsFixture, type NightsFixture } from "./fixture";

// A night in the past, so that its blocks may be marked; the fixture's targets pass near the zenith.
const NIGHT = "2025-05-20";
let fx: NightsFixture;

beforeAll(async () => {
  await seedDemoScenario(testDb());
  fx = await createNightsFixture(testDb(), { night: NIGHT });
});

const run = (first: string, last: string, configurationId: number | null, cycleId = fx.cycle.id) =>
  installRun(testDb(), {
    input: { cycleId, firstNight: first, lastNight: last, configurationId },
    userId: fx.people.scheduler.id,
  });

describe("the configuration calendar", () => {
  it("installs a configuration for a run of nights and clears it again", async () => {
    const ok = await run(addDays(NIGHT, -3), addDays(NIGHT, 3), fx.configurationIds.medium);
    expect(ok).toMatchObject({ ok: true, value: { nights: 7 } });
    const cleared = await run(addDays(NIGHT, 3), addDays(NIGHT, 3), null);
    expect(cleared.ok).toBe(true);
    const rows = await testDb().select().from(nightConfigurations).where(eq(nightConfigurations.cycleId, fx.cycle.id));
    expect(rows.map((r) => r.nightDate).sort()).toEqual([-3, -2, -1, 0, 1, 2].map((d) => addDays(NIGHT, d)));
  });

  it("refuses nights outside the period, a configuration not on offer and an unknown cycle, writing nothing", async () => {
    const before = await countRows(testDb(), nightConfigurations);
    expect(await run(addDays(NIGHT, -11), NIGHT, fx.configurationIds.medium)).toMatchObject({
      ok: false,
      status: 400,
      field: "firstNight",
    });
    expect(await run(NIGHT, addDays(NIGHT, 11), fx.configurationIds.medium)).toMatchObject({
      ok: false,
      status: 400,
      field: "lastNight",
    });
    expect(await run(NIGHT, addDays(NIGHT, -1), fx.configurationIds.medium)).toMatchObject({
      ok: false,
      field: "lastNight",
    });
    expect(await run(NIGHT, NIGHT, 999_999)).toMatchObject({ ok: false, status: 400, field: "configurationId" });
    expect(await run(NIGHT, NIGHT, fx.configurationIds.medium, 999_999)).toMatchObject({ ok: false, status: 404 });
    expect(await countRows(testDb(), nightConfigurations)).toBe(before);
  });
});

describe("building a night", () => {
  it("refuses to plan a night without a configuration", async () => {
    expect(await autoPlan(testDb(), { date: addDays(NIGHT, 5), userId: null })).toMatchObject({
      ok: false,
      status: 409,
    });
    expect(await countRows(testDb(), nightPlans)).toBe(0);
  });

  it("lists the candidates with their hours owed and windows", async () => {
    const page = await nightPage(testDb(), { date: NIGHT });
    expect(page.candidates.map((c) => c.key)).toEqual(["Ardilla 1", "Ardilla 2", "Ardilla 3", "Zorzal 7"]);
    // 3 h granted to the first program, shared by its three targets; 2 h to the second.
    expect(page.candidates.map((c) => c.owedHours)).toEqual([1, 1, 1, 2]);
    expect(page.candidates.map((c) => c.rank)).toEqual([1, 1, 1, 2]);
    for (const c of page.candidates) expect(c.window?.runs.length).toBeGreaterThan(0);
    expect(page.sky?.events.find((e) => e.key === "astronomicalDuskUtc")?.utc).toMatch(/^2025-05-2\dT/);
  });

  it("plans the night automatically with valid calibrator–science–calibrator sequences", async () => {
    const out = await autoPlan(testDb(), { date: NIGHT, userId: fx.people.scheduler.id });
    expect(out.ok).toBe(true);
    const page = await nightPage(testDb(), { date: NIGHT });
    expect(page.plan?.state).toBe("draft");
    expect(page.valid).toBe(true);
    expect(page.blocks.length).toBeGreaterThanOrEqual(9);
    expect(page.blocks.filter((b) => b.kind === "science").every((b) => b.proposalTargetId !== null)).toBe(true);
    // The stored plan replays clean in the engine's own validator (an independent reading of the stored rows).
    const night = await loadNight(testDb(), { date: NIGHT });
    const input = planRequest(night.setting!, night.candidates);
    const refs = night.blocks.map((b) => ({
      kind: b.kind,
      target: b.target,
      object: b.object,
      startUtc: b.startUtc.toISOString().replace(".000Z", "Z"),
      endUtc: b.endUtc.toISOString().replace(".000Z", "Z"),
    }));
    expect(validatePlan(input, refs, { context: planContext(input) }).ok).toBe(true);
    expect(page.canPublish).toBe(true);
  });

  it("shows a violation on a science block moved ahead of its calibrator, and clears it when moved back", async () => {
    const page = await nightPage(testDb(), { date: NIGHT });
    const science = page.blocks.find((b) => b.kind === "science")!;
    const moved = await editPlan(testDb(), { date: NIGHT, op: { intent: "move", blockId: science.id, to: "up" } });
    expect(moved.ok).toBe(true);
    const after = await nightPage(testDb(), { date: NIGHT });
    const flagged = after.blocks.find((b) => b.id === science.id)!;
    expect(flagged.position).toBe(science.position - 1);
    expect(flagged.violations.map((v) => v.rule)).toContain("calibrators");
    expect(after.valid).toBe(false);
    expect(after.canPublish).toBe(false);
    const refused = await publishPlan(testDb(), { date: NIGHT, userId: null, origin: "http://localhost:3000" });
    expect(refused).toMatchObject({ ok: false, status: 409 });
    expect(await countRows(testDb(), outboxMessages)).toBe(0);
    await editPlan(testDb(), { date: NIGHT, op: { intent: "move", blockId: science.id, to: "down" } });
    const back = await nightPage(testDb(), { date: NIGHT });
    expect(back.valid).toBe(true);
    expect(back.blocks.map((b) => [b.id, b.startUtc])).toEqual(page.blocks.map((b) => [b.id, b.startUtc]));
  });

  it("lengthens, inserts and removes blocks, pushing later blocks on", async () => {
    const page = await nightPage(testDb(), { date: NIGHT });
    const first = page.blocks[0];
    const grown = await editPlan(testDb(), { date: NIGHT, op: { intent: "resize", blockId: first.id, lengthMin: 30 } });
    expect(grown.ok).toBe(true);
    let now = await nightPage(testDb(), { date: NIGHT });
    expect(Date.parse(now.blocks[0].endUtc) - Date.parse(now.blocks[0].startUtc)).toBe(30 * 60_000);
    for (let i = 1; i < now.blocks.length; i++)
      expect(Date.parse(now.blocks[i].startUtc)).toBeGreaterThanOrEqual(Date.parse(now.blocks[i - 1].endUtc));
    // Shortened again, the blocks it pushed come back with it: the plan is as it was.
    await editPlan(testDb(), { date: NIGHT, op: { intent: "resize", blockId: first.id, lengthMin: 15 } });
    now = await nightPage(testDb(), { date: NIGHT });
    expect(now.blocks.map((b) => b.startUtc)).toEqual(page.blocks.map((b) => b.startUtc));
    const last = now.blocks[now.blocks.length - 1];
    const target = now.candidates[0];
    const inserted = await editPlan(testDb(), {
      date: NIGHT,
      op: { intent: "insert", object: `${target.proposalTargetId}:cal:1`, after: String(last.id), lengthMin: 10 },
    });
    expect(inserted.ok).toBe(true);
    now = await nightPage(testDb(), { date: NIGHT });
    const added = now.blocks[now.blocks.length - 1];
    expect(added).toMatchObject({ kind: "calibrator", object: target.calibrators[1].name, startUtc: last.endUtc });
    expect(
      await editPlan(testDb(), {
        date: NIGHT,
        op: { intent: "insert", object: "999999:science", after: "start", lengthMin: 10 },
      }),
    ).toMatchObject({
      ok: false,
      status: 400,
      field: "object",
    });
    expect(await editPlan(testDb(), { date: NIGHT, op: { intent: "remove", blockId: 999_999 } })).toMatchObject({
      ok: false,
      status: 404,
    });
    expect((await editPlan(testDb(), { date: NIGHT, op: { intent: "remove", blockId: added.id } })).ok).toBe(true);
    expect((await nightPage(testDb(), { date: NIGHT })).valid).toBe(true);
  });

  it("saves settings of a draft and keeps the other nights' configuration unchanged when a plan exists", async () => {
    const saved = await savePlanSettings(testDb(), {
      date: NIGHT,
      userId: null,
      settings: nightSettings(),
    });
    expect(saved.ok).toBe(true);
    expect(await run(NIGHT, NIGHT, fx.configurationIds.compact)).toMatchObject({ ok: false, status: 409 });
  });
});

describe("publication and after the night", () => {
  it("publishes a valid draft and writes one e-mail per team member", async () => {
    const out = await publishPlan(testDb(), {
      date: NIGHT,
      userId: fx.people.scheduler.id,
      origin: "http://localhost:3000",
    });
    expect(out).toMatchObject({ ok: true, value: { messages: 3 } });
    const mail = await testDb().select().from(outboxMessages);
    expect(mail.map((m) => m.toAddress).sort()).toEqual(
      [fx.people.coi.email, fx.people.other.email, fx.people.pi.email].sort(),
    );
    const toPi = mail.find((m) => m.toAddress === fx.people.pi.email)!;
    expect(toPi.kind).toBe("night-plan");
    expect(toPi.subject).toMatch(/^Night plan 2025-05-20: \d+ blocks for “Winds of the Ardilla stars”$/);
    expect(toPi.text).toContain("Ardilla 2");
    expect(toPi.text).not.toContain("Zorzal 7");
    expect(toPi.html).toContain("/nights/2025-05-20/export/plan.ics");
    expect(await publishPlan(testDb(), { date: NIGHT, userId: null, origin: "http://localhost:3000" })).toMatchObject({
      ok: false,
      status: 409,
    });
    expect(await editPlan(testDb(), { date: NIGHT, op: { intent: "remove", blockId: 1 } })).toMatchObject({
      ok: false,
      status: 409,
    });
    expect(await discardDraft(testDb(), { date: NIGHT })).toMatchObject({ ok: false, status: 409 });
  });

  /** The night's export as a proposer who is not a scheduler sees it. */
  const exportFor = (user: { id: number; email: string }) =>
    planExport(testDb(), { date: NIGHT, viewer: { user, roles: ["proposer"], scheduler: false } });

  it("exports the whole plan to the scheduler and only their own blocks to a program's team", async () => {
    const all = await planExport(testDb(), {
      date: NIGHT,
      viewer: { user: fx.people.scheduler, roles: ["scheduler"], scheduler: true },
    });
    const pi = await exportFor(fx.people.pi);
    const coi = await exportFor(fx.people.coi);
    const other = await exportFor(fx.people.other);
    expect(all?.filtered).toBe(false);
    expect(pi?.blocks.every((b) => b.program?.proposalId === fx.programs.first.id)).toBe(true);
    expect(coi?.blocks.length).toBe(pi?.blocks.length);
    expect(other?.blocks.every((b) => b.target === "Zorzal 7")).toBe(true);
    expect((pi?.blocks.length ?? 0) + (other?.blocks.length ?? 0)).toBe(all?.blocks.length);
    const stranger = await exportFor({ id: 999_999, email: "nobody@nights.example" });
    expect(stranger).toBeNull();
  });

  it("marks blocks once they have begun; executed science lowers the hours owed; all marked → executed", async () => {
    const page = await nightPage(testDb(), { date: NIGHT });
    const science = page.blocks.find((b) => b.kind === "science" && b.target === "Ardilla 2")!;
    const early = new Date(Date.parse(science.startUtc) - 60_000);
    expect(
      await markBlock(testDb(), {
        date: NIGHT,
        blockId: science.id,
        outcome: "executed",
        note: "",
        userId: null,
        now: early,
      }),
    ).toMatchObject({ ok: false, status: 409 });
    const ok = await markBlock(testDb(), {
      date: NIGHT,
      blockId: science.id,
      outcome: "executed",
      note: "good seeing",
      userId: fx.people.scheduler.id,
    });
    expect(ok.ok).toBe(true);
    const tomorrow = await nightPage(testDb(), { date: addDays(NIGHT, 1) });
    const owed = tomorrow.candidates.find((c) => c.key === "Ardilla 2")!.owedHours;
    const hours = (Date.parse(science.endUtc) - Date.parse(science.startUtc)) / 3_600_000;
    expect(owed).toBeCloseTo(1 - hours, 4);
    const nights = await programNights(testDb(), { proposalId: fx.programs.first.id });
    expect(nights.hours).toEqual([
      expect.objectContaining({
        configuration: "medium-4",
        grantedHours: 3,
        executedHours: Math.round(hours * 100) / 100,
      }),
    ]);
    expect(nights.blocks.find((b) => b.id === science.id)).toMatchObject({ outcome: "executed", note: "good seeing" });
    for (const b of page.blocks.filter((x) => x.id !== science.id)) {
      const r = await markBlock(testDb(), {
        date: NIGHT,
        blockId: b.id,
        outcome: "weather",
        note: "cloud",
        userId: null,
      });
      expect(r.ok).toBe(true);
    }
    expect((await nightPage(testDb(), { date: NIGHT })).plan?.state).toBe("executed");
    expect(
      await markBlock(testDb(), { date: NIGHT, blockId: 999_999, outcome: "executed", note: "", userId: null }),
    ).toMatchObject({ status: 404 });
  });

  it("re-plans the rest of a night around what was executed, as a new draft", async () => {
    const page = await nightPage(testDb(), { date: NIGHT });
    const executed = page.blocks.find((b) => b.outcome === "executed")!;
    // Lost blocks after the re-plan time are refused; put them back to planned first.
    const lostLater = page.blocks.find((b) => b.outcome === "weather" && b.startUtc > executed.endUtc)!;
    expect(await replanRest(testDb(), { date: NIGHT, from: new Date(executed.endUtc) })).toMatchObject({
      ok: false,
      status: 409,
    });
    for (const b of page.blocks.filter((x) => x.outcome === "weather")) {
      await markBlock(testDb(), { date: NIGHT, blockId: b.id, outcome: "planned", note: "", userId: null });
    }
    expect(lostLater).toBeDefined();
    const out = await replanRest(testDb(), { date: NIGHT, from: new Date(executed.endUtc) });
    expect(out.ok).toBe(true);
    const after = await nightPage(testDb(), { date: NIGHT });
    expect(after.plan?.state).toBe("draft");
    expect(after.valid).toBe(true);
    expect(after.blocks.find((b) => b.id === executed.id)?.outcome).toBe("executed");
    expect(
      after.blocks.filter((b) => Date.parse(b.startUtc) >= Date.parse(executed.endUtc) && b.id !== executed.id).length,
    ).toBeGreaterThan(0);
    expect(
      await markBlock(testDb(), { date: NIGHT, blockId: executed.id, outcome: "planned", note: "", userId: null }),
    ).toMatchObject({
      ok: false,
      status: 409,
    });
  });

  it("discards a draft with its blocks", async () => {
    expect((await discardDraft(testDb(), { date: NIGHT })).ok).toBe(true);
    expect(await countRows(testDb(), nightPlans)).toBe(0);
    expect(await countRows(testDb(), nightPlanBlocks)).toBe(0);
    expect(await discardDraft(testDb(), { date: NIGHT })).toMatchObject({ ok: false, status: 404 });
  });
});
