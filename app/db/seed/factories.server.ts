/**
 * Builders that write rows for the seed and for tests. Each returns what it wrote and is safe to run
 * twice (idempotent by natural key), so `npm run db:seed` can be repeated.
 */
import { and, eq, sql } from "drizzle-orm";
import type { Database } from "../client.server";
import { bands, configurationStations, configurations, instruments, sites, stations } from "../schema/array";
import { type Role, userRoles, users } from "../schema/users";
import { ensureDemoCommittee } from "./committee.server";
import { ensureCycle } from "./cycles.server";
import { ensureDemoProposals } from "./proposals.server";
import {
  DEMO_COMMITTEE,
  DEMO_CONFIGURATIONS,
  DEMO_INSTRUMENTS,
  DEMO_PEOPLE,
  DEMO_PROPOSALS,
  DEMO_SITE,
  DEMO_STATIONS,
  type DemoBand,
  type DemoCycleKey,
  type DemoStation,
  demoCycles,
} from "./scenario";

type SiteInput = typeof sites.$inferInsert;

export async function ensureSite(db: Database, input: SiteInput) {
  await db.insert(sites).values(input).onConflictDoNothing({ target: sites.name });
  const [row] = await db.select().from(sites).where(eq(sites.name, input.name));
  return row;
}

export async function ensureStations(db: Database, siteId: number, list: DemoStation[]) {
  if (list.length > 0) {
    await db
      .insert(stations)
      .values(list.map((s) => ({ ...s, siteId })))
      .onConflictDoNothing({ target: [stations.siteId, stations.name] });
  }
  return db.select().from(stations).where(eq(stations.siteId, siteId)).orderBy(stations.name);
}

/** Creates (or finds) a configuration and attaches the named stations in the given order. */
export async function ensureConfiguration(
  db: Database,
  siteId: number,
  input: { name: string; description?: string; stations: string[]; offered?: boolean },
) {
  return db.transaction(async (tx) => {
    await tx
      .insert(configurations)
      .values({ siteId, name: input.name, description: input.description ?? "", offered: input.offered ?? true })
      .onConflictDoNothing({ target: [configurations.siteId, configurations.name] });
    const [config] = await tx
      .select()
      .from(configurations)
      .where(and(eq(configurations.siteId, siteId), eq(configurations.name, input.name)));
    const siteStations = await tx.select().from(stations).where(eq(stations.siteId, siteId));
    const byName = new Map(siteStations.map((s) => [s.name, s]));
    const rows = input.stations.map((name, position) => {
      const station = byName.get(name);
      if (!station) throw new Error(`configuration ${input.name}: no station named ${name} at this site`);
      return { configurationId: config.id, stationId: station.id, position };
    });
    await tx.insert(configurationStations).values(rows).onConflictDoNothing();
    return config;
  });
}

export async function ensureInstrument(
  db: Database,
  siteId: number,
  input: { name: string; description?: string; maxTelescopes: number; bands: DemoBand[] },
) {
  await db
    .insert(instruments)
    .values({ siteId, name: input.name, description: input.description ?? "", maxTelescopes: input.maxTelescopes })
    .onConflictDoNothing({ target: [instruments.siteId, instruments.name] });
  const [instrument] = await db
    .select()
    .from(instruments)
    .where(and(eq(instruments.siteId, siteId), eq(instruments.name, input.name)));
  if (input.bands.length > 0) {
    await db
      .insert(bands)
      .values(input.bands.map((b) => ({ ...b, instrumentId: instrument.id })))
      .onConflictDoNothing({ target: [bands.instrumentId, bands.name] });
  }
  return instrument;
}

export async function ensureUser(
  db: Database,
  input: { email: string; name: string; institute?: string; roles?: Role[] },
) {
  await db
    .insert(users)
    .values({ email: input.email, name: input.name, institute: input.institute ?? "" })
    .onConflictDoNothing();
  const [user] = await db.select().from(users).where(sql`lower(${users.email}) = lower(${input.email})`);
  if (input.roles && input.roles.length > 0) {
    await db
      .insert(userRoles)
      .values(input.roles.map((role) => ({ userId: user.id, role })))
      .onConflictDoNothing();
  }
  return user;
}

/**
 * Loads the whole demo scenario, its cycles laid out around `today` (the day it is loaded, by default
 * now); returns what is now in the database. Safe to run again.
 */
export async function seedDemoScenario(db: Database, { today = new Date() }: { today?: Date } = {}) {
  const site = await ensureSite(db, { ...DEMO_SITE });
  const siteStations = await ensureStations(db, site.id, DEMO_STATIONS);
  for (const config of DEMO_CONFIGURATIONS) await ensureConfiguration(db, site.id, config);
  for (const instrument of DEMO_INSTRUMENTS) await ensureInstrument(db, site.id, instrument);
  for (const person of DEMO_PEOPLE) await ensureUser(db, person);
  const layout = demoCycles(today);
  const cycles = {} as Record<DemoCycleKey, Awaited<ReturnType<typeof ensureCycle>>>;
  let proposals = 0;
  for (const key of ["current", "review", "open"] as const) {
    const { key: _key, ...demo } = layout[key];
    cycles[key] = await ensureCycle(db, { ...demo, siteId: site.id, committee: key === "open" ? [] : DEMO_COMMITTEE });
    proposals += await ensureDemoProposals(db, {
      cycleId: cycles[key].id,
      list: DEMO_PROPOSALS.filter((p) => p.cycle === key),
      longitudeDeg: site.longitudeDeg,
      today,
    });
  }
  await ensureDemoCommittee(db, { cycles, demos: DEMO_PROPOSALS, today });
  return { site, stations: siteStations.length, cycles, cycle: cycles.open, proposals };
}

/** True when the database holds no site yet (a fresh install): `npm start` then seeds. */
export async function isEmpty(db: Database) {
  const [row] = await db.select({ n: sql<number>`count(*)::int` }).from(sites);
  return row.n === 0;
}
