/** Reads of the array registry (everyone may read it; edits are the admin's). */
import { and, asc, count, eq, max, ne } from "drizzle-orm";
import type { Database, DbOrTx } from "~/db/client.server";
import { bands, configurationStations, configurations, instruments, sites, stations } from "~/db/schema/array";
import { toId } from "~/lib/not-found";
import { cyclesOfferingConfigurations } from "~/services/cycles/cycles.server";

export async function listSites(db: Database) {
  return db.select().from(sites).orderBy(asc(sites.name));
}

/** One site with its stations, configurations (stations in order) and instruments with bands. */
export async function loadSiteRegistry(db: DbOrTx, siteId: number) {
  const [site] = await db.select().from(sites).where(eq(sites.id, siteId));
  if (!site) return null;
  const [stationRows, configRows, memberRows, instrumentRows, bandRows] = await Promise.all([
    db.select().from(stations).where(eq(stations.siteId, siteId)).orderBy(asc(stations.name)),
    db.select().from(configurations).where(eq(configurations.siteId, siteId)).orderBy(asc(configurations.name)),
    db
      .select({
        configurationId: configurationStations.configurationId,
        position: configurationStations.position,
        stationName: stations.name,
      })
      .from(configurationStations)
      .innerJoin(stations, eq(stations.id, configurationStations.stationId))
      .where(eq(stations.siteId, siteId))
      .orderBy(asc(configurationStations.position)),
    db.select().from(instruments).where(eq(instruments.siteId, siteId)).orderBy(asc(instruments.name)),
    db
      .select({ band: bands })
      .from(bands)
      .innerJoin(instruments, eq(instruments.id, bands.instrumentId))
      .where(eq(instruments.siteId, siteId))
      .orderBy(asc(bands.centralWavelengthM)),
  ]);
  return {
    site,
    stations: stationRows,
    configurations: configRows.map((c) => ({
      ...c,
      stationNames: memberRows.filter((m) => m.configurationId === c.id).map((m) => m.stationName),
    })),
    instruments: instrumentRows.map((i) => ({
      ...i,
      bands: bandRows.filter((b) => b.band.instrumentId === i.id).map((b) => b.band),
    })),
  };
}

export type SiteRegistry = NonNullable<Awaited<ReturnType<typeof loadSiteRegistry>>>;

/**
 * The registry page: every site (id and name), the one asked for by `?site=<id>` (the first by name
 * otherwise) with its registry and, per configuration id, the cycles that offer it. "no such site"
 * when the id names none; "removed" when the site went while loading.
 */
export async function registryOverview(db: Database, { siteParam }: { siteParam: string | null }) {
  const sites = (await listSites(db)).map((s) => ({ id: s.id, name: s.name }));
  const chosen = siteParam ? sites.find((s) => String(s.id) === siteParam) : sites[0];
  if (siteParam && !chosen) return "no such site" as const;
  if (!chosen) return { sites, registry: null, offeredIn: {} as Record<number, string[]> };
  const [registry, offeredIn] = await Promise.all([loadSiteRegistry(db, chosen.id), cyclesOfferingConfigurations(db)]);
  return registry ? { sites, registry, offeredIn } : ("removed" as const);
}

/** A station with its site's whole registry, or null when there is no such station. */
export async function stationWithRegistry(db: Database, { stationId }: { stationId: number }) {
  const [row] = await db.select({ siteId: stations.siteId }).from(stations).where(eq(stations.id, stationId));
  const registry = row ? await loadSiteRegistry(db, row.siteId) : null;
  const station = registry?.stations.find((s) => s.id === stationId);
  return registry && station ? { registry, station } : null;
}

/** The stations of a site as the site plan draws them, with the site's name. */
export async function siteMap(db: Database, { siteId }: { siteId: number }) {
  const registry = await loadSiteRegistry(db, siteId);
  return {
    siteName: registry?.site.name ?? "",
    stations: (registry?.stations ?? []).map((s) => ({ name: s.name, eastM: s.eastM, northM: s.northM })),
  };
}

export async function getSite(db: DbOrTx, { id }: { id: number }) {
  const [row] = await db.select().from(sites).where(eq(sites.id, id));
  return row ?? null;
}

/** The site named by `?site=<id>`, or the first site by name; null when there is none (or no such id). */
export async function resolveSite(db: DbOrTx, { param }: { param: string | null }) {
  if (param) {
    const id = toId(param);
    return id === null ? null : getSite(db, { id });
  }
  const [first] = await db.select().from(sites).orderBy(asc(sites.name)).limit(1);
  return first ?? null;
}

/** What deleting a site takes with it. */
export async function siteContents(db: DbOrTx, { siteId }: { siteId: number }) {
  const [[s], [c], [i]] = await Promise.all([
    db.select({ n: count() }).from(stations).where(eq(stations.siteId, siteId)),
    db.select({ n: count() }).from(configurations).where(eq(configurations.siteId, siteId)),
    db.select({ n: count() }).from(instruments).where(eq(instruments.siteId, siteId)),
  ]);
  return { stations: s.n, configurations: c.n, instruments: i.n };
}

export async function getStation(db: DbOrTx, { id }: { id: number }) {
  const [row] = await db.select().from(stations).where(eq(stations.id, id));
  return row ?? null;
}

/** Names of the configurations that use a station, in name order. */
export async function configurationsUsingStation(db: DbOrTx, { stationId }: { stationId: number }) {
  const rows = await db
    .select({ name: configurations.name })
    .from(configurationStations)
    .innerJoin(configurations, eq(configurations.id, configurationStations.configurationId))
    .where(eq(configurationStations.stationId, stationId))
    .orderBy(asc(configurations.name));
  return rows.map((r) => r.name);
}

export async function getConfiguration(db: DbOrTx, { id }: { id: number }) {
  const [row] = await db.select().from(configurations).where(eq(configurations.id, id));
  if (!row) return null;
  const members = await db
    .select({ name: stations.name })
    .from(configurationStations)
    .innerJoin(stations, eq(stations.id, configurationStations.stationId))
    .where(eq(configurationStations.configurationId, id))
    .orderBy(asc(configurationStations.position));
  return { ...row, stationNames: members.map((m) => m.name) };
}

/** The most telescopes any instrument of the site combines (0 without instruments). */
export async function widestInstrument(db: DbOrTx, { siteId }: { siteId: number }): Promise<number> {
  const [row] = await db
    .select({ n: max(instruments.maxTelescopes) })
    .from(instruments)
    .where(eq(instruments.siteId, siteId));
  return row?.n ?? 0;
}

/** The largest configuration (stations) of a site, with its name, for the "more than it combines" warning. */
export async function largestConfiguration(db: DbOrTx, { siteId }: { siteId: number }) {
  const rows = await db
    .select({ name: configurations.name, size: count(configurationStations.stationId) })
    .from(configurations)
    .innerJoin(configurationStations, eq(configurationStations.configurationId, configurations.id))
    .where(eq(configurations.siteId, siteId))
    .groupBy(configurations.id, configurations.name);
  return rows.reduce<{ name: string; size: number } | null>(
    (best, r) => (!best || r.size > best.size ? r : best),
    null,
  );
}

export async function getInstrument(db: DbOrTx, { id }: { id: number }) {
  const [row] = await db.select().from(instruments).where(eq(instruments.id, id));
  if (!row) return null;
  const bandRows = await db
    .select()
    .from(bands)
    .where(eq(bands.instrumentId, id))
    .orderBy(asc(bands.centralWavelengthM));
  return { ...row, bands: bandRows };
}

export async function getBand(db: DbOrTx, { id }: { id: number }) {
  const [row] = await db
    .select({ band: bands, instrument: instruments })
    .from(bands)
    .innerJoin(instruments, eq(instruments.id, bands.instrumentId))
    .where(eq(bands.id, id));
  return row ?? null;
}

/** Each registry record is named uniquely within its scope: the site (or, for a band, its instrument). */
const NAMED = {
  site: { table: sites, scope: null },
  station: { table: stations, scope: stations.siteId },
  configuration: { table: configurations, scope: configurations.siteId },
  instrument: { table: instruments, scope: instruments.siteId },
  band: { table: bands, scope: bands.instrumentId },
};
export type RegistryEntity = keyof typeof NAMED;

/** Whether another record of the same kind and scope already has `name` (the one being edited aside). */
export async function nameTaken(
  db: DbOrTx,
  { entity, name, scopeId, exceptId }: { entity: RegistryEntity; name: string; scopeId?: number; exceptId?: number },
): Promise<boolean> {
  // The five tables share the id and name columns this query reads.
  const { table, scope } = NAMED[entity] as unknown as { table: typeof sites; scope: typeof stations.siteId | null };
  const rows = await db
    .select({ id: table.id })
    .from(table)
    .where(
      and(
        eq(table.name, name),
        scope && scopeId !== undefined ? eq(scope, scopeId) : undefined,
        exceptId ? ne(table.id, exceptId) : undefined,
      ),
    )
    .limit(1);
  return rows.length > 0;
}
