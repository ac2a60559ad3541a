/**
 * Changes to the array registry (administrators only; the routes guard with "registry:edit"):
 * sites, stations, configurations, instruments and bands. Every change runs in one transaction with
 * its audit_log row (audit.server.ts), `actorId` being the administrator who makes it.
 */
import { and, eq, inArray } from "drizzle-orm";
import type { Database, DbOrTx } from "~/db/client.server";
import { bands, configurationStations, configurations, instruments, sites, stations } from "~/db/schema/array";
import { auditRegistryChange } from "./audit.server";
import { configurationsUsingStation, type RegistryEntity } from "./queries.server";
import type { ConfigurationRecord } from "./schemas";

const TABLES = { site: sites, station: stations, configuration: configurations, instrument: instruments, band: bands };
type Insert<E extends RegistryEntity> = (typeof TABLES)[E]["$inferInsert"];
/** The five tables share the id column these statements use. */
const tableOf = (entity: RegistryEntity) => TABLES[entity] as unknown as typeof sites;

/** Adds a site, station, instrument or band (configurations: `saveConfiguration`); its id. */
export async function insertRecord<E extends Exclude<RegistryEntity, "configuration">>(
  db: Database,
  { actorId, entity, values }: { actorId: number; entity: E; values: Insert<E> },
): Promise<number> {
  const table = tableOf(entity);
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(table)
      .values(values as Insert<"site">)
      .returning({ id: table.id, name: table.name });
    await auditRegistryChange(tx, { actorId, change: "created", entity, ...row });
    return row.id;
  });
}

/** Changes the values of a site, station, instrument or band. */
export async function updateRecord<E extends Exclude<RegistryEntity, "configuration">>(
  db: Database,
  { actorId, entity, id, values }: { actorId: number; entity: E; id: number; values: Partial<Insert<E>> },
) {
  const table = tableOf(entity);
  await db.transaction(async (tx) => {
    const rows = await tx
      .update(table)
      .set(values as Partial<Insert<"site">>)
      .where(eq(table.id, id))
      .returning({ id: table.id, name: table.name });
    for (const row of rows) await auditRegistryChange(tx, { actorId, change: "updated", entity, ...row });
  });
}

/** Deletes a configuration, an instrument with its bands, or a band (sites and stations have their own). */
export async function deleteRecord(
  db: Database,
  { actorId, entity, id }: { actorId: number; entity: "configuration" | "instrument" | "band"; id: number },
) {
  const table = tableOf(entity);
  await db.transaction(async (tx) => {
    const rows = await tx.delete(table).where(eq(table.id, id)).returning({ id: table.id, name: table.name });
    for (const row of rows) await auditRegistryChange(tx, { actorId, change: "deleted", entity, ...row });
  });
}

/** Deletes a site with its configurations, stations, instruments and bands. */
export async function deleteSite(db: Database, { actorId, siteId }: { actorId: number; siteId: number }) {
  await db.transaction(async (tx) => {
    // Configurations first: their station lists hold on to the stations.
    await tx.delete(configurations).where(eq(configurations.siteId, siteId));
    const rows = await tx.delete(sites).where(eq(sites.id, siteId)).returning({ id: sites.id, name: sites.name });
    for (const row of rows) await auditRegistryChange(tx, { actorId, change: "deleted", entity: "site", ...row });
  });
}

/** Deletes a station unless a configuration uses it (then says which ones and deletes nothing). */
export async function deleteStation(
  db: Database,
  { actorId, stationId }: { actorId: number; stationId: number },
): Promise<{ deleted: true } | { deleted: false; usedBy: string[] }> {
  return db.transaction(async (tx) => {
    const usedBy = await configurationsUsingStation(tx, { stationId });
    if (usedBy.length > 0) return { deleted: false as const, usedBy };
    const rows = await tx
      .delete(stations)
      .where(eq(stations.id, stationId))
      .returning({ id: stations.id, name: stations.name });
    for (const row of rows) await auditRegistryChange(tx, { actorId, change: "deleted", entity: "station", ...row });
    return { deleted: true as const };
  });
}

/** Station ids of a site by name. */
export async function stationIds(db: DbOrTx, { siteId, names }: { siteId: number; names?: string[] }) {
  const rows = await db
    .select({ id: stations.id, name: stations.name })
    .from(stations)
    .where(names ? and(eq(stations.siteId, siteId), inArray(stations.name, names)) : eq(stations.siteId, siteId));
  return new Map(rows.map((s) => [s.name, s.id]));
}

/**
 * Writes a configuration (a new one when `id` is undefined) with its stations in order, replacing
 * the list it had; `stationId` gives the id of every station it lists. Returns its id.
 */
export async function writeConfiguration(
  tx: DbOrTx,
  {
    siteId,
    id,
    values,
    stationId,
  }: { siteId: number; id?: number; values: ConfigurationRecord; stationId: Map<string, number> },
): Promise<number> {
  const head = { name: values.name, description: values.description, offered: values.offered };
  let configId = id;
  if (configId === undefined) {
    const [row] = await tx
      .insert(configurations)
      .values({ ...head, siteId })
      .returning({ id: configurations.id });
    configId = row.id;
  } else {
    await tx.update(configurations).set(head).where(eq(configurations.id, configId));
    await tx.delete(configurationStations).where(eq(configurationStations.configurationId, configId));
  }
  const members = values.stations.map((name, position) => ({ stationId: stationId.get(name)!, position }));
  await tx.insert(configurationStations).values(members.map((m) => ({ ...m, configurationId: configId })));
  return configId;
}

/**
 * Creates (`id` undefined) or updates a configuration with its ordered stations. Station names that
 * are not at the site are returned and nothing is written.
 */
export async function saveConfiguration(
  db: Database,
  { actorId, siteId, id, values }: { actorId: number; siteId: number; id?: number; values: ConfigurationRecord },
): Promise<{ ok: true; id: number } | { ok: false; unknownStations: string[] }> {
  return db.transaction(async (tx) => {
    const stationId = await stationIds(tx, { siteId, names: values.stations });
    const unknownStations = values.stations.filter((n) => !stationId.has(n));
    if (unknownStations.length > 0) return { ok: false as const, unknownStations };
    const saved = await writeConfiguration(tx, { siteId, id, values, stationId });
    const change = id === undefined ? "created" : "updated";
    await auditRegistryChange(tx, { actorId, change, entity: "configuration", id: saved, name: values.name });
    return { ok: true as const, id: saved };
  });
}
