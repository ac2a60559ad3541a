/** Reads of the array registry (everyone may read it; edits are the admin's). */
import { and, asc, count, eq, max, ne } from "drizzle-orm";
import type { Database, DbOrTx } from "~/db/client.server";
import { bands, configurationStations, configurations, instruments, sites, stations } from "~/db/schema/array";
import { toId } from "~/lib/not-found";
import { cyclesOfferingConfigurations } from "~/services/cycles/cycles.server";

export async function listSites(db: Database) {
  return db.select().from(sites).orderBy(asc(sites.name));
}

/** A configuration's station list, in order, as the relational query reads it. */
const memberNames = {
  orderBy: asc(configurationStations.position),
  columns: { position: true },
  with: { station: { columns: { name: true } } },
} as const;

/** A configuration row with its station names in order (baseline i–j is station j minus station i). */
function withStationNames<C extends { stations: { station: { name: string } }[] }>({ stations: members, ...row }: C) {
  return { ...row, stationNames: members.map((m) => m.station.name) };
}

/** One site with its stations, configurations (stations in order) and instruments with bands. */
export async function loadSiteRegistry(db: DbOrTx, siteId: number) {
  const found = await db.query.sites.findFirst({
    where: eq(sites.id, siteId),
    with: {
      stations: { orderBy: asc(stations.name) },
      configurations: { orderBy: asc(configurations.name), with: { stations: memberNames } },
      instruments: { orderBy: asc(instruments.name), with: { bands: { orderBy: asc(bands.centralWavelengthM) } } },
    },
  });
  if (!found) return null;
  const { stations: stationRows, configurations: configRows, instruments: instrumentRows, ...site } = found;
  return { site, stations: stationRows, configurations: configRows.map(withStationNames), instruments: instrumentRows };
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
  const row = await db.query.configurations.findFirst({
    where: eq(configurations.id, id),
    with: { stations: memberNames },
  });
  return row ? withStationNames(row) : null;
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
  const row = await db.query.instruments.findFirst({
    where: eq(instruments.id, id),
    with: { bands: { orderBy: asc(bands.centralWavelengthM) } },
  });
  return row ?? null;
}

/** A band with the instrument it belongs to. */
export async function getBand(db: DbOrTx, { id }: { id: number }) {
  const row = await db.query.bands.findFirst({ where: eq(bands.id, id), with: { instrument: true } });
  if (!row) return null;
  const { instrument, ...band } = row;
  return { band, instrument };
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
