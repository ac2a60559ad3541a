/**
 * The demo's nights, written through the Night builder's own commands: in the cycle whose observing
 * period contains `today`, the offered configurations installed over the whole period in runs of a
 * week (the configuration with the most accepted hours on tonight's run), and tonight's draft plan
 * from the automatic planner. Idempotent: an installed cycle or an existing plan for tonight is left
 * as it is. Without such a cycle nothing is written.
 */
import { and, desc, eq, gte, inArray, lte, sql } from "drizzle-orm";
import type { Database } from "~/db/client.server";
import { nightConfigurations, nightPlans } from "~/db/schema/nights";
import { cycleConfigurations, cycles, proposalHours, proposals } from "~/db/schema/proposals";
import { installRun } from "~/services/nights/calendar.server";
import { autoPlan } from "~/services/nights/commands.server";
import { PLANNED_STATUSES } from "~/services/nights/programs.server";

/** Nights in one run of the demo's configuration calendar. */
export const DEMO_RUN_NIGHTS = 7;

const addDays = (date: string, days: number) => {
  const d = new Date(`${date}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + days);
  return d.toISOString().slice(0, 10);
};

export type DemoNightsResult = { cycleId: number | null; runs: number; tonight: string | null; planned: boolean };

export async function seedDemoNights(db: Database, { today }: { today: string }): Promise<DemoNightsResult> {
  const [cycle] = await db
    .select()
    .from(cycles)
    .where(and(lte(cycles.observingStart, today), gte(cycles.observingEnd, today)))
    .orderBy(desc(cycles.observingStart))
    .limit(1);
  if (!cycle) return { cycleId: null, runs: 0, tonight: null, planned: false };

  const offers = await db
    .select({ configurationId: cycleConfigurations.configurationId })
    .from(cycleConfigurations)
    .where(eq(cycleConfigurations.cycleId, cycle.id));
  if (offers.length === 0) return { cycleId: cycle.id, runs: 0, tonight: null, planned: false };
  const demand = await db
    .select({ configurationId: proposalHours.configurationId, hours: sql<number>`sum(${proposalHours.hours})` })
    .from(proposalHours)
    .innerJoin(proposals, eq(proposals.id, proposalHours.proposalId))
    .where(and(eq(proposals.cycleId, cycle.id), inArray(proposals.status, [...PLANNED_STATUSES])))
    .groupBy(proposalHours.configurationId);
  const hoursOf = (id: number) => Number(demand.find((d) => d.configurationId === id)?.hours ?? 0);
  const order = offers.map((o) => o.configurationId).sort((a, b) => hoursOf(b) - hoursOf(a) || a - b);

  let runs = 0;
  const [installed] = await db
    .select({ n: sql<number>`count(*)::int` })
    .from(nightConfigurations)
    .where(eq(nightConfigurations.cycleId, cycle.id));
  if (installed.n === 0) {
    // Tonight's run is centred on today; the runs before and after it take the other configurations in turn.
    const half = Math.floor(DEMO_RUN_NIGHTS / 2);
    const runStart = (k: number) => addDays(today, k * DEMO_RUN_NIGHTS - half);
    let k = 0;
    while (runStart(k) > cycle.observingStart) k--;
    for (; runStart(k) <= cycle.observingEnd; k++) {
      const [first] = [runStart(k), cycle.observingStart].sort().reverse();
      const [last] = [addDays(runStart(k), DEMO_RUN_NIGHTS - 1), cycle.observingEnd].sort();
      const configurationId = order[((k % order.length) + order.length) % order.length];
      const result = await installRun(db, {
        input: { cycleId: cycle.id, firstNight: first, lastNight: last, configurationId },
        userId: null,
      });
      if (!result.ok) throw new Error(`demo nights ${first} → ${last}: ${result.error}`);
      runs++;
    }
  }

  const [plan] = await db.select({ id: nightPlans.id }).from(nightPlans).where(eq(nightPlans.nightDate, today));
  let planned = false;
  if (!plan) {
    // Refused only when tonight has no configuration (the scheduler cleared it): then there is no plan to write.
    planned = (await autoPlan(db, { date: today, userId: null })).ok;
  }
  return { cycleId: cycle.id, runs, tonight: today, planned };
}
