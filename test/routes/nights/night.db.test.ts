import { formPost, routeArgs, settle, testDb } from "@test/routes";
import { beforeAll, describe, expect, it } from "vitest";
import { nightConfigurations, nightPlans } from "~/db/schema/nights";
import { seedDemoScenario } from "~/db/seed/factories.server";
import { action as calendarAction, loader as calendarLoader } from "~/routes/nights/calendar";
import { action as nightAction, loader as nightLoader } from "~/routes/nights/night";
import { addDays, countRows, createNightsFixture, type NightsFixture } from "../../services/nights/fixture";

// Every action of the calendar and of a night page: valid, invalid (400 naming the field, nothing
// written), the wrong role (403, or the sign-in page), and the plan's state guards (409).
const NIGHT = "2025-05-20";
let fx: NightsFixture;

beforeAll(async () => {
  await seedDemoScenario(testDb());
  fx = await createNightsFixture(testDb(), { night: NIGHT });
});

const calendarPost = (fields: Record<string, string>, cookie: string) =>
  settle(() => calendarAction(routeArgs("/nights", formPost(fields, { Cookie: cookie }))));
const nightPost = (fields: Record<string, string>, cookie = fx.cookies.scheduler, date = NIGHT) =>
  settle(() =>
    nightAction(routeArgs(`/nights/${date}`, { ...formPost(fields, { Cookie: cookie }), params: { date } })),
  );
const nightGet = (cookie: string, date = NIGHT) =>
  nightLoader(routeArgs(`/nights/${date}`, { headers: { Cookie: cookie }, params: { date } }));
const runFields = (over: Record<string, string> = {}) => ({
  cycleId: String(fx.cycle.id),
  firstNight: addDays(NIGHT, -2),
  lastNight: addDays(NIGHT, 2),
  configurationId: String(fx.configurationIds.medium),
  ...over,
});

describe("the nights calendar", () => {
  it("opens for the scheduler on the cycle asked for, and refuses others", async () => {
    const page = await calendarLoader(
      routeArgs(`/nights?cycle=${fx.cycle.id}`, { headers: { Cookie: fx.cookies.scheduler } }),
    );
    expect(page.calendar?.cycle.name).toBe("Nights test");
    expect(page.calendar?.nights).toHaveLength(21);
    expect(page.calendar?.offers.map((o) => [o.name, o.nightsOffered, o.nightsInstalled])).toEqual([
      ["compact-3", 7, 0],
      ["extended-6", 7, 0],
      ["medium-4", 7, 0],
    ]);
    const night = page.calendar!.nights.find((n) => n.date === NIGHT)!;
    expect(night.darkHours).toBeGreaterThan(9);
    expect(night.planState).toBe("none");
    expect(
      (await settle(() => calendarLoader(routeArgs("/nights", { headers: { Cookie: fx.cookies.pi } })))).status,
    ).toBe(403);
    expect((await settle(() => calendarLoader(routeArgs("/nights")))).status).toBe(302);
    expect(
      (
        await settle(() =>
          calendarLoader(routeArgs("/nights?cycle=abc", { headers: { Cookie: fx.cookies.scheduler } })),
        )
      ).status,
    ).toBe(404);
  });

  it("installs a run of nights, and names the bad field otherwise", async () => {
    const bad = await calendarPost(runFields({ firstNight: "2025-02-30" }), fx.cookies.scheduler);
    expect(bad.status).toBe(400);
    expect((await bad.json()).errors.firstNight).toBe("First night: not a real date");
    const outside = await calendarPost(runFields({ lastNight: addDays(NIGHT, 30) }), fx.cookies.scheduler);
    expect(outside.status).toBe(400);
    expect((await outside.json()).errors.lastNight).toMatch(/observing period/);
    const notOffered = await calendarPost(runFields({ configurationId: "99999" }), fx.cookies.scheduler);
    expect((await notOffered.json()).errors.configurationId).toMatch(/does not offer/);
    expect(await countRows(testDb(), nightConfigurations)).toBe(0);
    expect((await calendarPost(runFields(), fx.cookies.pi)).status).toBe(403);
    const ok = await calendarPost(runFields(), fx.cookies.scheduler);
    expect(ok.status).toBe(302);
    expect(ok.headers.get("Location")).toBe(`/nights?cycle=${fx.cycle.id}`);
    expect(await countRows(testDb(), nightConfigurations)).toBe(5);
  });
});

describe("a night's page and its actions", () => {
  it("shows the sky, the candidates and no plan yet; a bad date is a 404, a proposer a 403", async () => {
    const page = await nightGet(fx.cookies.scheduler);
    expect(page.installation?.configurationName).toBe("medium-4");
    expect(page.stationNames).toHaveLength(4);
    expect(page.candidates).toHaveLength(4);
    expect(page.plan).toBeNull();
    expect(page.caution).toMatch(/observatory's own safety rules/);
    expect((await settle(() => nightGet(fx.cookies.scheduler, "2025-13-01"))).status).toBe(404);
    expect((await settle(() => nightGet(fx.cookies.pi))).status).toBe(403);
    expect((await nightPost({ intent: "auto" }, fx.cookies.pi)).status).toBe(403);
    expect(await countRows(testDb(), nightPlans)).toBe(0);
  });

  it("refuses bad input with 400 and the field's name, writing nothing", async () => {
    const cases: [Record<string, string>, string][] = [
      [{ intent: "nonsense" }, "intent"],
      [
        {
          intent: "settings",
          minElevationDeg: "high",
          moonMinSeparationDeg: "10",
          sunMinSeparationDeg: "45",
          scienceBlockMin: "40",
          calibratorBlockMin: "15",
        },
        "minElevationDeg",
      ],
      [
        {
          intent: "settings",
          minElevationDeg: "30",
          moonMinSeparationDeg: "10",
          sunMinSeparationDeg: "200",
          scienceBlockMin: "40",
          calibratorBlockMin: "15",
        },
        "sunMinSeparationDeg",
      ],
      [{ intent: "move", blockId: "1", to: "sideways" }, "to"],
      [{ intent: "insert", object: "science", after: "start", lengthMin: "40" }, "object"],
      [{ intent: "resize", blockId: "1", lengthMin: "0" }, "lengthMin"],
      [{ intent: "mark", blockId: "1", outcome: "fine" }, "outcome"],
      [{ intent: "replan", fromUtc: "tonight" }, "fromUtc"],
    ];
    for (const [fields, field] of cases) {
      const res = await nightPost(fields);
      expect(res.status, JSON.stringify(fields)).toBe(400);
      const body = await res.json();
      expect(body.field).toBe(field);
      expect(body.errors[field]).toBeTruthy();
    }
    expect(await countRows(testDb(), nightPlans)).toBe(0);
  });

  it("guards the plan's states: nothing to publish, edit or mark without a plan", async () => {
    expect((await nightPost({ intent: "publish" })).status).toBe(404);
    expect((await nightPost({ intent: "move", blockId: "1", to: "up" })).status).toBe(404);
    expect((await nightPost({ intent: "mark", blockId: "1", outcome: "executed" })).status).toBe(404);
    expect((await nightPost({ intent: "discard" })).status).toBe(404);
    expect((await nightPost({ intent: "auto" }, fx.cookies.scheduler, addDays(NIGHT, 8))).status).toBe(409);
  });

  it("saves settings, plans automatically, edits and publishes; a published plan is not edited", async () => {
    const settings = await nightPost({
      intent: "settings",
      minElevationDeg: "32",
      moonMinSeparationDeg: "12",
      sunMinSeparationDeg: "50",
      scienceBlockMin: "40",
      calibratorBlockMin: "15",
    });
    expect(settings.status).toBe(200);
    expect((await nightGet(fx.cookies.scheduler)).settings).toEqual({
      minElevationDeg: 32,
      moonMinSeparationDeg: 12,
      sunMinSeparationDeg: 50,
      scienceBlockMin: 40,
      calibratorBlockMin: 15,
    });
    const auto = await nightPost({ intent: "auto" });
    expect(auto.status).toBe(200);
    expect((await auto.json()).message).toMatch(/blocks planned for 4 targets/);
    let page = await nightGet(fx.cookies.scheduler);
    expect(page.valid).toBe(true);
    const science = page.blocks.find((b) => b.kind === "science")!;
    expect((await nightPost({ intent: "move", blockId: String(science.id), to: "up" })).status).toBe(200);
    page = await nightGet(fx.cookies.scheduler);
    expect(page.blocks.find((b) => b.id === science.id)?.violations[0]?.rule).toBe("calibrators");
    const refused = await nightPost({ intent: "publish" });
    expect(refused.status).toBe(409);
    expect((await refused.json()).error).toMatch(/breaks a rule/);
    expect((await nightPost({ intent: "move", blockId: String(science.id), to: "down" })).status).toBe(200);
    expect((await nightPost({ intent: "mark", blockId: String(science.id), outcome: "executed" })).status).toBe(409);
    const published = await nightPost({ intent: "publish" });
    expect(published.status).toBe(200);
    expect((await published.json()).message).toMatch(/published; 3 e-mails/);
    expect(
      (
        await nightPost({
          intent: "settings",
          minElevationDeg: "30",
          moonMinSeparationDeg: "10",
          sunMinSeparationDeg: "45",
          scienceBlockMin: "40",
          calibratorBlockMin: "15",
        })
      ).status,
    ).toBe(409);
    expect((await nightPost({ intent: "remove", blockId: String(science.id) })).status).toBe(409);
    expect((await nightPost({ intent: "auto" })).status).toBe(409);
    expect((await nightPost({ intent: "discard" })).status).toBe(409);
    expect((await nightPost({ intent: "publish" })).status).toBe(409);
    const other = await nightPost({ intent: "mark", blockId: "999999", outcome: "executed" });
    expect(other.status).toBe(404);
  });

  it("marks a block with a note and re-plans the rest of the night", async () => {
    const page = await nightGet(fx.cookies.scheduler);
    const science = page.blocks.find((b) => b.kind === "science")!;
    const marked = await nightPost({
      intent: "mark",
      blockId: String(science.id),
      outcome: "executed",
      note: "fringes stable",
    });
    expect(marked.status).toBe(200);
    const after = await nightGet(fx.cookies.scheduler);
    expect(after.blocks.find((b) => b.id === science.id)).toMatchObject({
      outcome: "executed",
      note: "fringes stable",
      locked: true,
    });
    const owed = after.candidates.find((c) => c.key === science.target)!;
    expect(owed.owedHours).toBe(1); // hours owed at the start of this night; the next night owes less
    const tomorrow = await nightGet(fx.cookies.scheduler, addDays(NIGHT, 1));
    expect(tomorrow.candidates.find((c) => c.key === science.target)!.owedHours).toBeCloseTo(1 - 40 / 60, 3);
    const replan = await nightPost({ intent: "replan", fromUtc: science.endUtc.slice(0, 16) });
    expect(replan.status).toBe(200);
    const replanned = await nightGet(fx.cookies.scheduler);
    expect(replanned.plan?.state).toBe("draft");
    expect(replanned.valid).toBe(true);
    expect((await nightPost({ intent: "discard" })).status).toBe(200);
    expect(await countRows(testDb(), nightPlans)).toBe(0);
  });
});
