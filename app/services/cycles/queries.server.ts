/** Reading observing cycles: their period, deadline and the configurations on offer (with nights). */
import { and, asc, desc, eq, gt, inArray, type SQL } from "drizzle-orm";
import type { DbOrTx } from "~/db/client.server";
import { configurations, sites } from "~/db/schema/array";
import { committeeMembers } from "~/db/schema/committee";
import { cycleConfigurations, cycles } from "~/db/schema/proposals";
import { userRoles, users } from "~/db/schema/users";
import { configurationOf } from "~/lib/joins.server";

/** What a cycle offers: a configuration (and its name) with the nights it is available. */
const offerColumns = {
  cycleId: cycleConfigurations.cycleId,
  configurationId: cycleConfigurations.configurationId,
  nightsAvailable: cycleConfigurations.nightsAvailable,
  name: configurations.name,
};

/** The configurations a cycle offers, with the nights each is available and its site, in name order. */
export async function offersWithSites(db: DbOrTx, { cycleId }: { cycleId: number }) {
  return db
    .select({
      id: configurations.id,
      name: configurations.name,
      nights: cycleConfigurations.nightsAvailable,
      site: sites,
    })
    .from(cycleConfigurations)
    .innerJoin(configurations, configurationOf(cycleConfigurations.configurationId))
    .innerJoin(sites, eq(sites.id, configurations.siteId))
    .where(eq(cycleConfigurations.cycleId, cycleId))
    .orderBy(asc(configurations.name));
}

/** The cycles `where` picks (every cycle without), latest observing period first, with their offers by name. */
async function cyclesWithOffers(db: DbOrTx, where?: SQL) {
  const rows = await db.select().from(cycles).where(where).orderBy(desc(cycles.observingStart));
  const ids = rows.map((c) => c.id);
  const offers = ids.length
    ? await db
        .select(offerColumns)
        .from(cycleConfigurations)
        .innerJoin(configurations, configurationOf(cycleConfigurations.configurationId))
        .where(inArray(cycleConfigurations.cycleId, ids))
        .orderBy(asc(configurations.name))
    : [];
  return rows.map((c) => ({ ...c, offers: offers.filter((o) => o.cycleId === c.id) }));
}

/** Every cycle with its offers, latest observing period first. */
export async function listCycles(db: DbOrTx) {
  return cyclesWithOffers(db);
}

/** One cycle with its offers, or null. */
export async function getCycle(db: DbOrTx, { cycleId }: { cycleId: number }) {
  const [cycle] = await cyclesWithOffers(db, eq(cycles.id, cycleId));
  return cycle ?? null;
}

/** Cycles taking proposals at `now` (open, deadline in the future), soonest deadline first. */
export async function openCycles(db: DbOrTx, now = new Date()) {
  return db
    .select()
    .from(cycles)
    .where(and(eq(cycles.state, "open"), gt(cycles.submissionDeadline, now)))
    .orderBy(asc(cycles.submissionDeadline), asc(cycles.name));
}

export async function findCycleByName(db: DbOrTx, name: string) {
  const [row] = await db.select().from(cycles).where(eq(cycles.name, name));
  return row ?? null;
}

/** For each configuration id, the names of the cycles that offer it, latest cycle first. */
export async function cyclesOfferingConfigurations(db: DbOrTx): Promise<Record<number, string[]>> {
  const rows = await db
    .select({ configurationId: cycleConfigurations.configurationId, name: cycles.name })
    .from(cycleConfigurations)
    .innerJoin(cycles, eq(cycles.id, cycleConfigurations.cycleId))
    .orderBy(desc(cycles.observingStart));
  const out: Record<number, string[]> = {};
  for (const r of rows) {
    out[r.configurationId] ??= [];
    out[r.configurationId].push(r.name);
  }
  return out;
}

/** The members of a cycle's committee, by name. */
export async function committeeOf(db: DbOrTx, { cycleId }: { cycleId: number }) {
  return db
    .select({ id: users.id, name: users.name, email: users.email, institute: users.institute })
    .from(committeeMembers)
    .innerJoin(users, eq(users.id, committeeMembers.userId))
    .where(eq(committeeMembers.cycleId, cycleId))
    .orderBy(asc(users.name), asc(users.id));
}

/** Everyone who may sit on a committee (the reviewer role), by name. */
export async function reviewerChoices(db: DbOrTx) {
  return db
    .select({ id: users.id, name: users.name, institute: users.institute })
    .from(users)
    .innerJoin(userRoles, and(eq(userRoles.userId, users.id), eq(userRoles.role, "reviewer")))
    .where(eq(users.active, true))
    .orderBy(asc(users.name), asc(users.id));
}
