/**
 * Changes to the array registry (administrators only; the routes guard with "registry:edit"):
 * sites, stations, configurations, instruments and bands, and applying an import plan worked out by
 * `registry-io.ts`. Every function that writes more than one statement runs in one transaction.
 */
import { and, asc, count, eq, inArray, max, ne } from "drizzle-orm";
import { data } from "react-router";
import * as v from "valibot";
import type { Database, Transaction } from "~/db/client.server";
import { bands, configurationStations, configurations, instruments, sites, stations } from "~/db/schema/array";
import { parseForm, readBodyCapped } from "~/lib/body.server";
import type {
  BandRecord,
  ConfigurationRecord,
  InstrumentValues,
  RegistryPlan,
  RegistrySnapshot,
  SiteRecord,
  StationPlan,
  StationRecord,
} from "~/services/registry/io";
import { loadSiteRegistry } from "~/services/registry/queries.server";

type Tx = Transaction;
type Db = Database | Tx;

// ---------------------------------------------------------------------------------------------
// Requests

/** The SQLSTATE of a PostgreSQL error, also when the query builder wrapped it. */
export function pgCode(error: unknown): string | undefined {
  for (
    let e = error as { code?: unknown; cause?: unknown } | undefined, depth = 0;
    e && depth < 4;
    e = e.cause as typeof e, depth++
  ) {
    if (typeof e.code === "string" && /^[0-9A-Z]{5}$/.test(e.code)) return e.code;
  }
  return undefined;
}

/** A row id from text (a route parameter or a form field): a whole number that fits the id columns, or null. */
export function toId(raw: unknown): number | null {
  if (typeof raw !== "string" || !/^\d{1,10}$/.test(raw.trim())) return null;
  const id = Number(raw);
  return id >= 1 && id <= 2_147_483_647 ? id : null;
}

/** A row id from a route parameter, or a 404 page. */
export function idParam(raw: string | undefined, what: string): number {
  const id = toId(raw);
  if (id === null) throw data(`There is no ${what} with that number.`, { status: 404 });
  return id;
}

/**
 * The body of a form post, read with a size limit (the Content-Length is not trusted: the body is
 * counted as it arrives). Returns an error message for a body that is too large or malformed.
 */
export async function readForm(
  request: Request,
  limitBytes = 64_000,
  tooLargeMessage = "The form is too large to be a registry entry.",
): Promise<{ form: FormData } | { error: string; status: number }> {
  const read = await readBodyCapped(request, limitBytes);
  if (!read.ok) {
    return read.reason === "too-large"
      ? { error: tooLargeMessage, status: 413 }
      : { error: "The form could not be read; please send it again.", status: 400 };
  }
  const form = await parseForm(request, read.bytes);
  return form ? { form } : { error: "The form could not be read; please send it again.", status: 400 };
}

const EditIntent = v.picklist(["save", "delete"], "Unknown action.");

/** An edit page's post: the form (read with `readForm`) and whether it saves or deletes. */
export async function readEditForm(
  request: Request,
): Promise<{ form: FormData; intent: "save" | "delete" } | { error: string; status: number }> {
  const read = await readForm(request);
  if ("error" in read) return read;
  const intent = v.safeParse(EditIntent, read.form.get("intent"));
  if (!intent.success) return { error: intent.issues[0].message, status: 400 };
  return { form: read.form, intent: intent.output };
}

/** The text fields of a form, as typed, for the schema and for refilling the form. */
export function formValues(form: FormData, keys: readonly string[]): Record<string, string> {
  return Object.fromEntries(keys.map((k) => [k, typeof form.get(k) === "string" ? (form.get(k) as string) : ""]));
}

// ---------------------------------------------------------------------------------------------
// Sites

export async function getSite(db: Db, id: number) {
  const [row] = await db.select().from(sites).where(eq(sites.id, id));
  return row ?? null;
}

/** The site named by `?site=<id>`, or the first site by name; null when there is none (or no such id). */
export async function resolveSite(db: Db, param: string | null) {
  if (param) {
    const id = toId(param);
    return id === null ? null : getSite(db, id);
  }
  const [first] = await db.select().from(sites).orderBy(asc(sites.name)).limit(1);
  return first ?? null;
}

export async function siteNameTaken(db: Db, name: string, exceptId?: number) {
  const rows = await db
    .select({ id: sites.id })
    .from(sites)
    .where(exceptId ? and(eq(sites.name, name), ne(sites.id, exceptId)) : eq(sites.name, name));
  return rows.length > 0;
}

export async function createSite(db: Db, values: SiteRecord) {
  const [row] = await db.insert(sites).values(values).returning();
  return row;
}

export async function updateSite(db: Db, id: number, values: SiteRecord) {
  await db.update(sites).set(values).where(eq(sites.id, id));
}

/** What deleting a site takes with it. */
export async function siteContents(db: Db, siteId: number) {
  const [[s], [c], [i]] = await Promise.all([
    db.select({ n: count() }).from(stations).where(eq(stations.siteId, siteId)),
    db.select({ n: count() }).from(configurations).where(eq(configurations.siteId, siteId)),
    db.select({ n: count() }).from(instruments).where(eq(instruments.siteId, siteId)),
  ]);
  return { stations: s.n, configurations: c.n, instruments: i.n };
}

/** Deletes a site with its configurations, stations, instruments and bands. */
export async function deleteSite(db: Database, siteId: number) {
  await db.transaction(async (tx) => {
    // Configurations first: their station lists hold on to the stations.
    await tx.delete(configurations).where(eq(configurations.siteId, siteId));
    await tx.delete(sites).where(eq(sites.id, siteId));
  });
}

// ---------------------------------------------------------------------------------------------
// Stations

export async function getStation(db: Db, id: number) {
  const [row] = await db.select().from(stations).where(eq(stations.id, id));
  return row ?? null;
}

export async function stationNameTaken(db: Db, siteId: number, name: string, exceptId?: number) {
  const same = and(eq(stations.siteId, siteId), eq(stations.name, name));
  const rows = await db
    .select({ id: stations.id })
    .from(stations)
    .where(exceptId ? and(same, ne(stations.id, exceptId)) : same);
  return rows.length > 0;
}

export async function createStation(db: Db, siteId: number, values: StationRecord) {
  const [row] = await db
    .insert(stations)
    .values({ ...values, siteId })
    .returning();
  return row;
}

export async function updateStation(db: Db, id: number, values: StationRecord) {
  await db.update(stations).set(values).where(eq(stations.id, id));
}

/** Names of the configurations that use a station, in name order. */
export async function configurationsUsingStation(db: Db, stationId: number): Promise<string[]> {
  const rows = await db
    .select({ name: configurations.name })
    .from(configurationStations)
    .innerJoin(configurations, eq(configurations.id, configurationStations.configurationId))
    .where(eq(configurationStations.stationId, stationId))
    .orderBy(asc(configurations.name));
  return rows.map((r) => r.name);
}

/** Deletes a station unless a configuration uses it (then says which ones and deletes nothing). */
export async function deleteStation(
  db: Database,
  stationId: number,
): Promise<{ deleted: true } | { deleted: false; usedBy: string[] }> {
  return db.transaction(async (tx) => {
    const usedBy = await configurationsUsingStation(tx, stationId);
    if (usedBy.length > 0) return { deleted: false as const, usedBy };
    await tx.delete(stations).where(eq(stations.id, stationId));
    return { deleted: true as const };
  });
}

// ---------------------------------------------------------------------------------------------
// Configurations

export async function getConfiguration(db: Db, id: number) {
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

export async function configurationNameTaken(db: Db, siteId: number, name: string, exceptId?: number) {
  const same = and(eq(configurations.siteId, siteId), eq(configurations.name, name));
  const rows = await db
    .select({ id: configurations.id })
    .from(configurations)
    .where(exceptId ? and(same, ne(configurations.id, exceptId)) : same);
  return rows.length > 0;
}

/** The most telescopes any instrument of the site combines (0 without instruments). */
export async function widestInstrument(db: Db, siteId: number): Promise<number> {
  const [row] = await db
    .select({ n: max(instruments.maxTelescopes) })
    .from(instruments)
    .where(eq(instruments.siteId, siteId));
  return row?.n ?? 0;
}

/**
 * Creates (`id` null) or updates a configuration with its ordered stations. Station names that are
 * not at the site are returned and nothing is written.
 */
export async function saveConfiguration(
  db: Database,
  siteId: number,
  id: number | null,
  values: ConfigurationRecord,
): Promise<{ ok: true; id: number } | { ok: false; unknownStations: string[] }> {
  return db.transaction(async (tx) => {
    const found = await tx
      .select({ id: stations.id, name: stations.name })
      .from(stations)
      .where(and(eq(stations.siteId, siteId), inArray(stations.name, values.stations)));
    const byName = new Map(found.map((s) => [s.name, s.id]));
    const unknownStations = values.stations.filter((n) => !byName.has(n));
    if (unknownStations.length > 0) return { ok: false as const, unknownStations };
    const head = { name: values.name, description: values.description, offered: values.offered };
    let configId: number;
    if (id === null) {
      const [row] = await tx
        .insert(configurations)
        .values({ ...head, siteId })
        .returning({ id: configurations.id });
      configId = row.id;
    } else {
      await tx.update(configurations).set(head).where(eq(configurations.id, id));
      await tx.delete(configurationStations).where(eq(configurationStations.configurationId, id));
      configId = id;
    }
    await tx.insert(configurationStations).values(
      values.stations.map((name, position) => ({
        configurationId: configId,
        stationId: byName.get(name)!,
        position,
      })),
    );
    return { ok: true as const, id: configId };
  });
}

export async function deleteConfiguration(db: Db, id: number) {
  await db.delete(configurations).where(eq(configurations.id, id));
}

// ---------------------------------------------------------------------------------------------
// Instruments and bands

export async function getInstrument(db: Db, id: number) {
  const [row] = await db.select().from(instruments).where(eq(instruments.id, id));
  if (!row) return null;
  const bandRows = await db
    .select()
    .from(bands)
    .where(eq(bands.instrumentId, id))
    .orderBy(asc(bands.centralWavelengthM));
  return { ...row, bands: bandRows };
}

/** The instrument a route parameter names, or a 404 page. */
export async function instrumentOr404(db: Db, raw: string | undefined) {
  const instrument = await getInstrument(db, idParam(raw, "instrument"));
  if (!instrument) throw data("There is no instrument with that number.", { status: 404 });
  return instrument;
}

export async function instrumentNameTaken(db: Db, siteId: number, name: string, exceptId?: number) {
  const same = and(eq(instruments.siteId, siteId), eq(instruments.name, name));
  const rows = await db
    .select({ id: instruments.id })
    .from(instruments)
    .where(exceptId ? and(same, ne(instruments.id, exceptId)) : same);
  return rows.length > 0;
}

export async function createInstrument(db: Db, siteId: number, values: InstrumentValues) {
  const [row] = await db
    .insert(instruments)
    .values({ ...values, siteId })
    .returning();
  return row;
}

export async function updateInstrument(db: Db, id: number, values: InstrumentValues) {
  await db.update(instruments).set(values).where(eq(instruments.id, id));
}

/** Deletes an instrument and its bands. */
export async function deleteInstrument(db: Db, id: number) {
  await db.delete(instruments).where(eq(instruments.id, id));
}

/** The largest configuration (stations) of a site, with its name, for the "more than it combines" warning. */
export async function largestConfiguration(db: Db, siteId: number): Promise<{ name: string; size: number } | null> {
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

export async function getBand(db: Db, id: number) {
  const [row] = await db
    .select({ band: bands, instrument: instruments })
    .from(bands)
    .innerJoin(instruments, eq(instruments.id, bands.instrumentId))
    .where(eq(bands.id, id));
  return row ?? null;
}

export async function bandNameTaken(db: Db, instrumentId: number, name: string, exceptId?: number) {
  const same = and(eq(bands.instrumentId, instrumentId), eq(bands.name, name));
  const rows = await db
    .select({ id: bands.id })
    .from(bands)
    .where(exceptId ? and(same, ne(bands.id, exceptId)) : same);
  return rows.length > 0;
}

export async function createBand(db: Db, instrumentId: number, values: BandRecord) {
  const [row] = await db
    .insert(bands)
    .values({ ...values, instrumentId })
    .returning();
  return row;
}

export async function updateBand(db: Db, id: number, values: BandRecord) {
  await db.update(bands).set(values).where(eq(bands.id, id));
}

export async function deleteBand(db: Db, id: number) {
  await db.delete(bands).where(eq(bands.id, id));
}

// ---------------------------------------------------------------------------------------------
// Import

export async function findSiteByName(db: Db, name: string) {
  const [row] = await db.select().from(sites).where(eq(sites.name, name));
  return row ?? null;
}

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
export async function loadSnapshot(db: Db, siteId: number): Promise<RegistrySnapshot | null> {
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
export async function stationUsage(db: Db, siteId: number): Promise<Record<string, string[]>> {
  const rows = await db
    .select({ station: stations.name, configuration: configurations.name })
    .from(configurationStations)
    .innerJoin(stations, eq(stations.id, configurationStations.stationId))
    .innerJoin(configurations, eq(configurations.id, configurationStations.configurationId))
    .where(eq(stations.siteId, siteId))
    .orderBy(asc(configurations.name));
  const out: Record<string, string[]> = {};
  for (const r of rows) (out[r.station] ??= []).push(r.configuration);
  return out;
}

async function writeStations(tx: Tx, siteId: number, lines: StationPlan["lines"]) {
  const existing = await tx
    .select({ id: stations.id, name: stations.name })
    .from(stations)
    .where(eq(stations.siteId, siteId));
  const idOf = new Map(existing.map((s) => [s.name, s.id]));
  const fresh = lines.filter((l) => l.change === "new").map((l) => ({ ...l.after!, siteId }));
  if (fresh.length > 0) await tx.insert(stations).values(fresh);
  for (const l of lines) {
    if (l.change === "updated") {
      const { name: _name, ...values } = l.after!;
      await tx
        .update(stations)
        .set(values)
        .where(eq(stations.id, idOf.get(l.name)!));
    }
  }
}

async function removeStations(tx: Tx, siteId: number, lines: StationPlan["lines"]) {
  const names = lines.filter((l) => l.change === "remove").map((l) => l.name);
  if (names.length > 0)
    await tx.delete(stations).where(and(eq(stations.siteId, siteId), inArray(stations.name, names)));
}

/** Applies a station import plan in one transaction. */
export async function applyStationPlan(db: Database, siteId: number, plan: StationPlan) {
  await db.transaction(async (tx) => {
    await writeStations(tx, siteId, plan.lines);
    await removeStations(tx, siteId, plan.lines);
  });
}

/** Applies a whole-registry plan in one transaction; creates the site when the plan says it is new. Returns the site id. */
export async function applyRegistryPlan(db: Database, plan: RegistryPlan): Promise<number> {
  return db.transaction(async (tx) => {
    const site = plan.site.after!;
    let siteId: number;
    const [existing] = await tx.select({ id: sites.id }).from(sites).where(eq(sites.name, site.name));
    if (existing) {
      siteId = existing.id;
      if (plan.site.change === "updated") await tx.update(sites).set(site).where(eq(sites.id, siteId));
    } else {
      siteId = (await tx.insert(sites).values(site).returning({ id: sites.id }))[0].id;
    }

    await writeStations(tx, siteId, plan.stations);
    const stationRows = await tx
      .select({ id: stations.id, name: stations.name })
      .from(stations)
      .where(eq(stations.siteId, siteId));
    const stationId = new Map(stationRows.map((s) => [s.name, s.id]));

    const configRows = await tx
      .select({ id: configurations.id, name: configurations.name })
      .from(configurations)
      .where(eq(configurations.siteId, siteId));
    const configId = new Map(configRows.map((c) => [c.name, c.id]));
    for (const c of plan.configurations) {
      if (c.change !== "new" && c.change !== "updated") continue;
      const values = c.after!;
      const head = { name: values.name, description: values.description, offered: values.offered };
      let id = configId.get(c.name);
      if (id === undefined)
        id = (
          await tx
            .insert(configurations)
            .values({ ...head, siteId })
            .returning({ id: configurations.id })
        )[0].id;
      else {
        await tx.update(configurations).set(head).where(eq(configurations.id, id));
        await tx.delete(configurationStations).where(eq(configurationStations.configurationId, id));
      }
      await tx
        .insert(configurationStations)
        .values(
          values.stations.map((name, position) => ({ configurationId: id, stationId: stationId.get(name)!, position })),
        );
    }

    const instrumentRows = await tx
      .select({ id: instruments.id, name: instruments.name })
      .from(instruments)
      .where(eq(instruments.siteId, siteId));
    const instrumentId = new Map(instrumentRows.map((i) => [i.name, i.id]));
    for (const i of plan.instruments) {
      if (i.change === "keep") continue;
      let id = instrumentId.get(i.name);
      if (id === undefined)
        id = (
          await tx
            .insert(instruments)
            .values({ ...i.after!, siteId })
            .returning({ id: instruments.id })
        )[0].id;
      else if (i.change === "updated") await tx.update(instruments).set(i.after!).where(eq(instruments.id, id));
      const bandRows = await tx
        .select({ id: bands.id, name: bands.name })
        .from(bands)
        .where(eq(bands.instrumentId, id));
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

    await removeStations(tx, siteId, plan.stations);
    return siteId;
  });
}
