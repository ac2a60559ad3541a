/**
 * The cycle's nights: which configuration is installed each night (set by the scheduler in runs of
 * nights), the nights each configuration was offered against those installed, each night's dark hours
 * and Moon phase, and the state of its plan.
 */
import { and, asc, between, desc, eq, gte, inArray, lte } from "drizzle-orm";
import type { Database, DbOrTx } from "~/db/client.server";
import { configurations, sites } from "~/db/schema/array";
import { type NightPlanState, nightConfigurations, nightPlans } from "~/db/schema/nights";
import { cycleConfigurations, cycles } from "~/db/schema/proposals";
import { darkTimeOverPeriod, jdeFromJd, moonIlluminatedFraction, roundTo } from "~/engine";
import { configurationOf } from "~/lib/joins.server";
import { offersWithSites } from "~/services/cycles/queries.server";
import { type CommandResult, done, refuse } from "./result";
import type { RunInput } from "./schemas";
import { windowStartJd } from "./sky";

export type CalendarNight = {
  date: string;
  configurationId: number | null;
  configurationName: string | null;
  darkHours: number;
  moonFraction: number;
  waxing: boolean;
  planState: NightPlanState | "none";
};

/** Every date from `first` to `last`, both included. */
export function datesBetween(first: string, last: string): string[] {
  const out: string[] = [];
  const d = new Date(`${first}T00:00:00Z`);
  const end = Date.parse(`${last}T00:00:00Z`);
  while (d.getTime() <= end) {
    out.push(d.toISOString().slice(0, 10));
    d.setUTCDate(d.getUTCDate() + 1);
  }
  return out;
}

/** The cycle a calendar opens on: the one observing `today`, else the next to observe, else the latest. */
export async function defaultCycleId(db: DbOrTx, { today }: { today: string }): Promise<number | null> {
  const [current] = await db
    .select({ id: cycles.id })
    .from(cycles)
    .where(and(lte(cycles.observingStart, today), gte(cycles.observingEnd, today)))
    .orderBy(desc(cycles.observingStart))
    .limit(1);
  if (current) return current.id;
  const [next] = await db
    .select({ id: cycles.id })
    .from(cycles)
    .where(gte(cycles.observingStart, today))
    .orderBy(asc(cycles.observingStart))
    .limit(1);
  if (next) return next.id;
  const [latest] = await db.select({ id: cycles.id }).from(cycles).orderBy(desc(cycles.observingStart)).limit(1);
  return latest?.id ?? null;
}

/** The calendar of one cycle, or null when there is no such cycle. */
export async function cycleCalendar(db: Database, { cycleId }: { cycleId: number }) {
  const [cycle] = await db.select().from(cycles).where(eq(cycles.id, cycleId));
  if (!cycle) return null;
  const offers = await offersWithSites(db, { cycleId });
  const site = offers[0]?.site ?? (await db.select().from(sites).orderBy(asc(sites.id)).limit(1))[0];
  const installed = await db
    .select({
      date: nightConfigurations.nightDate,
      configurationId: nightConfigurations.configurationId,
      name: configurations.name,
    })
    .from(nightConfigurations)
    .innerJoin(configurations, configurationOf(nightConfigurations.configurationId))
    .where(
      and(
        eq(nightConfigurations.cycleId, cycleId),
        between(nightConfigurations.nightDate, cycle.observingStart, cycle.observingEnd),
      ),
    );
  const plans = await db
    .select({ date: nightPlans.nightDate, state: nightPlans.state })
    .from(nightPlans)
    .where(eq(nightPlans.cycleId, cycleId));
  const byDate = new Map(installed.map((i) => [i.date, i]));
  const stateByDate = new Map(plans.map((p) => [p.date, p.state]));
  const dates = datesBetween(cycle.observingStart, cycle.observingEnd);
  const dark = site
    ? darkTimeOverPeriod(
        { latitudeDeg: site.latitudeDeg, longitudeDeg: site.longitudeDeg, altitudeM: site.altitudeM },
        cycle.observingStart,
        cycle.observingEnd,
        { lstBins: 1 },
      )
    : null;
  const nights: CalendarNight[] = dates.map((date, i) => {
    const midnight = site ? windowStartJd(date, site.longitudeDeg) + 0.5 : 0;
    const fraction = site ? moonIlluminatedFraction(jdeFromJd(midnight)) : 0;
    const inst = byDate.get(date);
    return {
      date,
      configurationId: inst?.configurationId ?? null,
      configurationName: inst?.name ?? null,
      darkHours: dark ? roundTo(dark.nights[i]?.darkHours ?? 0, 2) : 0,
      moonFraction: roundTo(fraction, 3),
      waxing: site ? moonIlluminatedFraction(jdeFromJd(midnight + 1)) > fraction : false,
      planState: stateByDate.get(date) ?? "none",
    };
  });
  const counts = new Map<number, number>();
  for (const n of nights)
    if (n.configurationId) counts.set(n.configurationId, (counts.get(n.configurationId) ?? 0) + 1);
  return {
    cycle: { id: cycle.id, name: cycle.name, observingStart: cycle.observingStart, observingEnd: cycle.observingEnd },
    site: site ? { name: site.name, timeZone: site.timeZone, latitudeDeg: site.latitudeDeg } : null,
    offers: offers.map((o) => ({
      configurationId: o.id,
      name: o.name,
      nightsOffered: o.nights,
      nightsInstalled: counts.get(o.id) ?? 0,
    })),
    nights,
  };
}

/** Every cycle, latest first, for the calendar's picker. */
export async function cycleChoices(db: DbOrTx) {
  return db
    .select({
      id: cycles.id,
      name: cycles.name,
      observingStart: cycles.observingStart,
      observingEnd: cycles.observingEnd,
    })
    .from(cycles)
    .orderBy(desc(cycles.observingStart));
}

/**
 * Installs a configuration (or none) for the nights `firstNight` … `lastNight` of a cycle. Refused
 * for nights outside the cycle, a configuration the cycle does not offer, and nights whose plan was
 * made for another configuration (discard the draft first; a published plan keeps its configuration).
 */
export async function installRun(
  db: Database,
  { input, userId }: { input: RunInput; userId: number | null },
): Promise<CommandResult<{ nights: number }>> {
  const { cycleId, firstNight, lastNight, configurationId } = input;
  return db.transaction(async (tx) => {
    const [cycle] = await tx.select().from(cycles).where(eq(cycles.id, cycleId));
    if (!cycle) return refuse(404, "Cycle: there is no such cycle.", "cycleId");
    if (lastNight < firstNight) return refuse(400, "Last night: must not be before the first night.", "lastNight");
    if (firstNight < cycle.observingStart || firstNight > cycle.observingEnd) {
      return refuse(
        400,
        `First night: must lie in ${cycle.name}'s observing period (${cycle.observingStart} → ${cycle.observingEnd}).`,
        "firstNight",
      );
    }
    if (lastNight > cycle.observingEnd) {
      return refuse(
        400,
        `Last night: must lie in ${cycle.name}'s observing period (${cycle.observingStart} → ${cycle.observingEnd}).`,
        "lastNight",
      );
    }
    let configName = "no configuration";
    if (configurationId !== null) {
      const [offer] = await tx
        .select({ name: configurations.name })
        .from(cycleConfigurations)
        .innerJoin(configurations, configurationOf(cycleConfigurations.configurationId))
        .where(and(eq(cycleConfigurations.cycleId, cycleId), eq(cycleConfigurations.configurationId, configurationId)));
      if (!offer) return refuse(400, `Configuration: ${cycle.name} does not offer it.`, "configurationId");
      configName = offer.name;
    }
    const dates = datesBetween(firstNight, lastNight);
    const planned = await tx
      .select({ date: nightPlans.nightDate, configurationId: nightPlans.configurationId, state: nightPlans.state })
      .from(nightPlans)
      .where(inArray(nightPlans.nightDate, dates));
    const clash = planned.filter((p) => p.configurationId !== configurationId);
    if (clash.length) {
      const list = clash.map((p) => `${p.date} (${p.state})`).join(", ");
      return refuse(
        409,
        `These nights already have a plan for another configuration: ${list}. Discard the draft first; a published plan keeps its configuration.`,
        "firstNight",
      );
    }
    await tx.delete(nightConfigurations).where(inArray(nightConfigurations.nightDate, dates));
    if (configurationId !== null) {
      await tx
        .insert(nightConfigurations)
        .values(dates.map((nightDate) => ({ nightDate, cycleId, configurationId, setById: userId })));
    }
    const what = configurationId === null ? "cleared" : `set to ${configName}`;
    return done(`${dates.length} night${dates.length === 1 ? "" : "s"} (${firstNight} → ${lastNight}) ${what}.`, {
      nights: dates.length,
    });
  });
}
