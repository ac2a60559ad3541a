import { testDb } from "@test/routes";
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { nightConfigurations, nightPlanBlocks, nightPlans } from "~/db/schema/nights";
import { seedDemoScenario } from "~/db/seed/factories.server";
import { DEMO_RUN_NIGHTS, seedDemoNights } from "~/db/seed/nights.server";
import { nightPage } from "~/services/nights/queries.server";
import { addDays, countRows, createNightsFixture, type NightsFixture } from "./fixture";

const TODAY = "2025-05-20";
let fx: NightsFixture;

beforeAll(async () => {
  await seedDemoScenario(testDb());
});

describe("the demo's nights", () => {
  it("writes nothing when no cycle observes on the given day", async () => {
    expect(await seedDemoNights(testDb(), { today: TODAY })).toEqual({
      cycleId: null,
      runs: 0,
      tonight: null,
      planned: false,
    });
    expect(await countRows(testDb(), nightConfigurations)).toBe(0);
    expect(await countRows(testDb(), nightPlans)).toBe(0);
  });

  it("installs the cycle's configurations in weekly runs and drafts tonight's plan", async () => {
    fx = await createNightsFixture(testDb(), { night: TODAY });
    const out = await seedDemoNights(testDb(), { today: TODAY });
    expect(out).toMatchObject({ cycleId: fx.cycle.id, tonight: TODAY, planned: true });
    // 21 nights, runs of 7 centred on today: [−10 … −4], [−3 … +3], [+4 … +10].
    expect(out.runs).toBe(3);
    const nights = await testDb()
      .select()
      .from(nightConfigurations)
      .where(eq(nightConfigurations.cycleId, fx.cycle.id));
    expect(nights).toHaveLength(21);
    const on = (d: number) => nights.find((n) => n.nightDate === addDays(TODAY, d))?.configurationId;
    // Tonight's run has the configuration the accepted programs asked hours for.
    for (const d of [-3, 0, 3]) expect(on(d)).toBe(fx.configurationIds.medium);
    expect(on(-4)).not.toBe(fx.configurationIds.medium);
    expect(on(4)).not.toBe(fx.configurationIds.medium);
    expect(DEMO_RUN_NIGHTS).toBe(7);
    const page = await nightPage(testDb(), { date: TODAY });
    expect(page.plan?.state).toBe("draft");
    expect(page.valid).toBe(true);
    expect(page.blocks.length).toBeGreaterThan(0);
  });

  it("leaves an installed cycle and tonight's plan as they are", async () => {
    const blocks = await countRows(testDb(), nightPlanBlocks);
    expect(await seedDemoNights(testDb(), { today: TODAY })).toMatchObject({ runs: 0, planned: false });
    expect(await countRows(testDb(), nightPlanBlocks)).toBe(blocks);
  });
});
