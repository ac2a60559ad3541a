/**
 * Importing into the registry: a file read and planned against the registry as it is (nothing
 * written), then the plan applied in one transaction.
 */
import { and, asc, eq, inArray } from "drizzle-orm";
import type { Database, DbOrTx, Transaction } from "~/db/client.server";
import { bands, configurationStations, configurations, instruments, sites, stations } from "~/db/schema/array";
import { auditRegistryImport } from "./audit.server";
import { stationIds, writeConfiguration } from "./commands.server";
import {
  type Change,
  planRegistry,
  planStations,
  type RegistryPlan,
  type RegistrySnapshot,
  type StationPlan,
} from "./plan";
import { loadSiteRegistry } from "./queries.server";
import { parseRegistryJson, parseStationsFile } from "./registry-json";
import type { SiteRecord } from "./schemas";
import { issueText } from "./upload";

const siteRecord = (s: typeof sites.$inferSelect): SiteRecord => ({
  name: s.name,
  latitudeDeg: s.latitudeDeg,
  longitudeDeg: s.longitudeDeg,
  altitudeM: s.altitudeM,
  minElevationDeg: s.minElevationDeg,
  delayLineStrokeM: s.delayLineStrokeM,
  timeZone: s.timeZone,
});

/** A site's registry as plain records (no ids), the shape the import planner and the exports use. */
export async function loadSnapshot(db: DbOrTx, { siteId }: { siteId: number }): Promise<RegistrySnapshot | null> {
  const registry = await loadSiteRegistry(db, siteId);
  if (!registry) return null;
  return {
    site: siteRecord(registry.site),
    stations: registry.stations.map((s) => ({
      name: s.name,
      eastM: s.eastM,
      northM: s.northM,
      upM: s.upM,
      pathOffsetM: s.pathOffsetM,
    })),
    configurations: registry.configurations.map((c) => ({
      name: c.name,
      description: c.description,
      offered: c.offered,
      stations: c.stationNames,
    })),
    instruments: registry.instruments.map((i) => ({
      name: i.name,
      description: i.description,
      maxTelescopes: i.maxTelescopes,
      bands: i.bands.map((b) => ({
        name: b.name,
        centralWavelengthM: b.centralWavelengthM,
        channels: b.channels,
        bandwidthM: b.bandwidthM,
        limitingMagnitude: b.limitingMagnitude,
      })),
    })),
  };
}

/** For each station name of a site, the configurations that use it. */
export async function stationUsage(db: DbOrTx, { siteId }: { siteId: number }): Promise<Record<string, string[]>> {
  const rows = await db
    .select({ station: stations.name, configuration: configurations.name })
    .from(configurationStations)
    .innerJoin(stations, eq(stations.id, configurationStations.stationId))
    .innerJoin(configurations, eq(configurations.id, configurationStations.configurationId))
    .where(eq(stations.siteId, siteId))
    .orderBy(asc(configurations.name));
  const out: Record<string, string[]> = {};
  for (const r of rows) out[r.station] = [...(out[r.station] ?? []), r.configuration];
  return out;
}

/** What reading and planning a file gave: the plan, or the problems (as lines), and notes either way. */
export type Planned<P> = { ok: true; plan: P; notices: string[] } | { ok: false; errors: string[]; notices: string[] };

/** Reads a station file (CSV or JSON) and plans it against the stations of the site. */
export async function planStationImport(
  db: Database,
  { siteId, text, removeMissing }: { siteId: number; text: string; removeMissing: boolean },
): Promise<Planned<StationPlan>> {
  const parsed = parseStationsFile(text);
  if (parsed.errors.length > 0) return { ok: false, errors: parsed.errors.map(issueText), notices: parsed.notices };
  const [snapshot, usage] = await Promise.all([loadSnapshot(db, { siteId }), stationUsage(db, { siteId })]);
  const plan = planStations(snapshot?.stations ?? [], parsed.stations, { removeMissing, usage });
  return { ok: true, plan, notices: [...parsed.notices, ...plan.notices] };
}

/** Reads a whole-registry file and plans it against the site of the same name (a new one when none has it). */
export async function planRegistryImport(
  db: Database,
  { text, removeMissing }: { text: string; removeMissing: boolean },
): Promise<Planned<RegistryPlan> & { siteId: number | null }> {
  const parsed = parseRegistryJson(text);
  if (!parsed.registry)
    return { ok: false, errors: parsed.errors.map(issueText), notices: parsed.notices, siteId: null };
  const [existing] = await db.select().from(sites).where(eq(sites.name, parsed.registry.site.name));
  const snapshot = existing ? await loadSnapshot(db, { siteId: existing.id }) : null;
  const plan = planRegistry(snapshot, parsed.registry, { removeMissing });
  const notices = [...parsed.notices, ...plan.notices];
  const siteId = existing?.id ?? null;
  if (plan.errors.length > 0) return { ok: false, errors: plan.errors.map(issueText), notices, siteId };
  return { ok: true, plan, notices, siteId };
}

async function writeStations(tx: Transaction, siteId: number, lines: StationPlan["lines"]) {
  const idOf = await stationIds(tx, { siteId });
  const fresh = lines.filter((l) => l.change === "new").map((l) => ({ ...l.after!, siteId }));
  if (fresh.length > 0) await tx.insert(stations).values(fresh);
  for (const l of lines.filter((l) => l.change === "updated")) {
    const { name: _name, ...values } = l.after!;
    await tx
      .update(stations)
      .set(values)
      .where(eq(stations.id, idOf.get(l.name)!));
  }
}

async function removeStations(tx: Transaction, siteId: number, lines: StationPlan["lines"]) {
  const names = lines.filter((l) => l.change === "remove").map((l) => l.name);
  if (names.length > 0)
    await tx.delete(stations).where(and(eq(stations.siteId, siteId), inArray(stations.name, names)));
}

/** Applies a station import plan in one transaction, with its audit_log row. */
export async function applyStationPlan(
  db: Database,
  { actorId, site, plan }: { actorId: number; site: { id: number; name: string }; plan: StationPlan },
) {
  await db.transaction(async (tx) => {
    await writeStations(tx, site.id, plan.lines);
    await removeStations(tx, site.id, plan.lines);
    const summary = stationImportSummary(site.name, plan.counts);
    await auditRegistryImport(tx, { actorId, kind: "stations", siteId: site.id, siteName: site.name, summary });
  });
}

const writes = (change: Change) => change === "new" || change === "updated";

/** Adds and updates the instruments of a plan with their bands. */
async function writeInstruments(tx: Transaction, siteId: number, lines: RegistryPlan["instruments"]) {
  const rows = await tx
    .select({ id: instruments.id, name: instruments.name })
    .from(instruments)
    .where(eq(instruments.siteId, siteId));
  const instrumentId = new Map(rows.map((i) => [i.name, i.id]));
  for (const i of lines.filter((i) => i.change !== "keep")) {
    let id = instrumentId.get(i.name);
    if (id === undefined)
      [{ id }] = await tx
        .insert(instruments)
        .values({ ...i.after!, siteId })
        .returning({ id: instruments.id });
    else if (i.change === "updated") await tx.update(instruments).set(i.after!).where(eq(instruments.id, id));
    const bandRows = await tx.select({ id: bands.id, name: bands.name }).from(bands).where(eq(bands.instrumentId, id));
    const bandId = new Map(bandRows.map((b) => [b.name, b.id]));
    for (const b of i.bands) {
      if (b.change === "new") await tx.insert(bands).values({ ...b.after!, instrumentId: id });
      else if (b.change === "updated")
        await tx
          .update(bands)
          .set(b.after!)
          .where(eq(bands.id, bandId.get(b.name)!));
    }
  }
}

/**
 * Applies a whole-registry plan in one transaction, with its audit_log row; creates the site when the
 * plan says it is new. Returns the site id.
 */
export async function applyRegistryPlan(
  db: Database,
  { actorId, plan }: { actorId: number; plan: RegistryPlan },
): Promise<number> {
  return db.transaction(async (tx) => {
    const site = plan.site.after!;
    const [existing] = await tx.select({ id: sites.id }).from(sites).where(eq(sites.name, site.name));
    const siteId = existing?.id ?? (await tx.insert(sites).values(site).returning({ id: sites.id }))[0].id;
    if (existing && plan.site.change === "updated") await tx.update(sites).set(site).where(eq(sites.id, siteId));

    await writeStations(tx, siteId, plan.stations);
    const stationId = await stationIds(tx, { siteId });
    const configRows = await tx
      .select({ id: configurations.id, name: configurations.name })
      .from(configurations)
      .where(eq(configurations.siteId, siteId));
    const configId = new Map(configRows.map((c) => [c.name, c.id]));
    for (const c of plan.configurations.filter((c) => writes(c.change)))
      await writeConfiguration(tx, { siteId, id: configId.get(c.name), values: c.after!, stationId });
    await writeInstruments(tx, siteId, plan.instruments);
    await removeStations(tx, siteId, plan.stations);
    const summary = registryImportSummary(plan);
    await auditRegistryImport(tx, { actorId, kind: "registry", siteId, siteName: site.name, summary });
    return siteId;
  });
}

/** "stations 1 new, 2 updated" (", 3 removed" when any are). */
const part = (noun: string, c: Record<Change, number>) =>
  `${noun} ${c.new} new, ${c.updated} updated${c.remove ? `, ${c.remove} removed` : ""}`;

/** The flash after a station import. */
export function stationImportSummary(siteName: string, c: Record<Change, number>): string {
  return `Stations imported into ${siteName}: ${c.new} new, ${c.updated} updated, ${c.unchanged} unchanged${c.remove ? `, ${c.remove} removed` : ""}.`;
}

/** The flash after a whole-registry import. */
export function registryImportSummary(plan: RegistryPlan): string {
  const { counts } = plan;
  return `Registry of ${plan.site.name} imported (site ${plan.site.change}): ${[
    part("stations", counts.stations),
    part("configurations", counts.configurations),
    part("instruments", counts.instruments),
    part("bands", counts.bands),
  ].join("; ")}.`;
}
