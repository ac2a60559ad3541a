/** Reads of the array registry (everyone may read it; edits are the admin's). */
import { asc, eq } from "drizzle-orm";
import type { Database, Transaction } from "~/db/client.server";
import { bands, configurationStations, configurations, instruments, sites, stations } from "~/db/schema/array";

export async function listSites(db: Database) {
  return db.select().from(sites).orderBy(asc(sites.name));
}

type Tx = Transaction;

/** One site with its stations, configurations (stations in order) and instruments with bands. */
export async function loadSiteRegistry(db: Database | Tx, siteId: number) {
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

/** The site a station belongs to, or null when there is no such station. */
export async function stationSiteId(db: Database, stationId: number): Promise<number | null> {
  const [row] = await db.select({ siteId: stations.siteId }).from(stations).where(eq(stations.id, stationId));
  return row?.siteId ?? null;
}

export type SiteRegistry = NonNullable<Awaited<ReturnType<typeof loadSiteRegistry>>>;
