/**
 * Stations and whole registries as JSON.
 *
 * - Stations as JSON: a list of station objects, or an object with a "stations" list (so both the
 *   station export and the whole-registry export can be read back).
 * - The whole registry as JSON: the format of the registry export ({site, stations, configurations,
 *   instruments}); every item is checked here, references between them by the planner.
 */
import * as v from "valibot";
import { isRecord } from "./field-rules";
import {
  BandFileSchema,
  type BandRecord,
  type ConfigurationRecord,
  ConfigurationSchema,
  type InstrumentRecord,
  InstrumentSchema,
  type SiteRecord,
  SiteSchema,
  STATION_COLUMNS,
  StationSchema,
} from "./schemas";
import {
  type ParsedStations,
  parseStationsCsv,
  repeatedStations,
  type StationRow,
  tooManyStations,
} from "./stations-csv";
import {
  detectFormat,
  fileIssue,
  type ImportIssue,
  type ImportSection,
  MAX_IMPORT_ITEMS,
  MAX_IMPORT_STATIONS,
  parseJson,
  repeatedNames,
  rowIssues,
} from "./upload";

export const REGISTRY_FORMAT = "fringe-docket-registry";
export const REGISTRY_FORMAT_VERSION = 1;

/** Validates a list of station objects; rows counted from 1. */
function stationsFromList(
  list: unknown[],
  section: ImportSection | null,
  notices: string[],
): { stations: StationRow[]; errors: ImportIssue[] } {
  const stations: StationRow[] = [];
  const errors: ImportIssue[] = [];
  const extra = new Set<string>();
  list.forEach((item, i) => {
    const row = i + 1;
    if (!isRecord(item)) {
      errors.push({ section, row, column: null, message: `must be an object with ${STATION_COLUMNS.join(", ")}` });
      return;
    }
    for (const k of Object.keys(item)) if (!(STATION_COLUMNS as readonly string[]).includes(k)) extra.add(k);
    const out = v.safeParse(StationSchema, item);
    if (out.success) stations.push({ ...out.output, row });
    else errors.push(...rowIssues(out.issues, { section, row }));
  });
  errors.push(...repeatedStations(stations, section));
  if (extra.size > 0)
    notices.push(
      `Not used and ignored${section ? ` in ${section}` : ""}: the field${extra.size > 1 ? "s" : ""} ${[...extra].map((k) => `“${k}”`).join(", ")}.`,
    );
  return { stations, errors };
}

/** The station list of JSON text, or the one problem that stops it being read. */
function stationList(text: string): { list: unknown[] } | { error: ImportIssue } {
  const json = parseJson(text);
  if (!json.ok) return { error: fileIssue(json.error) };
  const value = json.value;
  const list = Array.isArray(value) ? value : isRecord(value) && Array.isArray(value.stations) ? value.stations : null;
  if (!list) return { error: fileIssue("The JSON must be a list of stations, or an object with a “stations” list.") };
  if (list.length === 0) return { error: fileIssue("The list of stations is empty.") };
  const tooMany = tooManyStations(list.length);
  return tooMany ? { error: tooMany } : { list };
}

/** Stations from JSON text: a list of stations, or an object with a "stations" list. */
export function parseStationsJson(text: string): ParsedStations {
  const result: ParsedStations = { format: "json", stations: [], errors: [], notices: [] };
  const read = stationList(text);
  if ("error" in read) return { ...result, errors: [read.error] };
  return { ...result, ...stationsFromList(read.list, null, result.notices) };
}

/** Stations from CSV or JSON text, told apart by the first character. */
export function parseStationsFile(text: string): ParsedStations {
  return detectFormat(text) === "json" ? parseStationsJson(text) : parseStationsCsv(text);
}

export type RegistryFile = {
  site: SiteRecord;
  stations: StationRow[];
  configurations: (ConfigurationRecord & { row: number })[];
  instruments: (InstrumentRecord & { row: number })[];
};
export type ParsedRegistry = { registry: RegistryFile | null; errors: ImportIssue[]; notices: string[] };

function listOf(obj: Record<string, unknown>, key: ImportSection, errors: ImportIssue[]): unknown[] {
  const value = obj[key];
  const most = key === "stations" ? MAX_IMPORT_STATIONS : MAX_IMPORT_ITEMS;
  if (!Array.isArray(value)) {
    errors.push({ section: key, row: null, column: null, message: `the file needs a “${key}” list (it may be empty)` });
    return [];
  }
  if (value.length > most) {
    const message = `has ${value.length} items; one import takes at most ${most}`;
    errors.push({ section: key, row: null, column: null, message });
    return [];
  }
  return value;
}

type Read<T> = { value: T | null; issues: ImportIssue[] };

/** The items of a section's list, each an object read by `read`; anything else is refused naming `shape`. */
function itemsOf<T>(
  root: Record<string, unknown>,
  section: "configurations" | "instruments",
  shape: string,
  errors: ImportIssue[],
  read: (item: Record<string, unknown>, row: number) => Read<T>,
): (T & { row: number })[] {
  const out: (T & { row: number })[] = [];
  listOf(root, section, errors).forEach((item, i) => {
    const row = i + 1;
    if (!isRecord(item)) {
      errors.push({ section, row, column: null, message: `must be an object with ${shape}` });
      return;
    }
    const { value, issues } = read(item, row);
    errors.push(...issues);
    if (value) out.push({ ...value, row });
  });
  return out;
}

function readConfiguration(item: Record<string, unknown>, row: number): Read<ConfigurationRecord> {
  const out = v.safeParse(ConfigurationSchema, item);
  if (out.success) return { value: out.output, issues: [] };
  return { value: null, issues: rowIssues(out.issues, { section: "configurations", row }) };
}

/** An instrument's bands, each checked, and each name once. */
function readBands(list: unknown, row: number): { bands: BandRecord[]; issues: ImportIssue[] } {
  const at = (column: string, message: string): ImportIssue => ({ section: "instruments", row, column, message });
  if (!Array.isArray(list)) return { bands: [], issues: [at("bands", "must be a list")] };
  const bands: BandRecord[] = [];
  const issues: ImportIssue[] = [];
  list.forEach((band, j) => {
    const prefix = `bands[${j + 1}]`;
    const out = isRecord(band) ? v.safeParse(BandFileSchema, band) : null;
    if (!out) issues.push(at(prefix, "must be an object"));
    else if (out.success) bands.push(out.output);
    else issues.push(...rowIssues(out.issues, { section: "instruments", row, prefix }));
  });
  const seen = new Set<string>();
  for (const b of bands) {
    if (seen.has(b.name)) issues.push(at("bands", `band ${b.name} appears twice`));
    seen.add(b.name);
  }
  return { bands, issues };
}

function readInstrument(item: Record<string, unknown>, row: number): Read<InstrumentRecord> {
  const head = v.safeParse(InstrumentSchema, item);
  const { bands, issues } = readBands(item.bands ?? [], row);
  const all = [...(head.success ? [] : rowIssues(head.issues, { section: "instruments", row })), ...issues];
  return { value: head.success && all.length === 0 ? { ...head.output, bands } : null, issues: all };
}

/** The root object of a whole-registry file, or the one problem that stops it being read. */
function registryRoot(text: string): { root: Record<string, unknown> } | { error: string } {
  if (detectFormat(text) !== "json")
    return {
      error: "A whole-registry import is a JSON file in the format of the registry export; this looks like CSV.",
    };
  const json = parseJson(text);
  if (!json.ok) return { error: json.error };
  if (!isRecord(json.value))
    return { error: "The JSON must be an object with site, stations, configurations and instruments." };
  return { root: json.value };
}

/** Problems with the file's format and version fields, when it has them. */
function formatIssues(root: Record<string, unknown>): ImportIssue[] {
  const errors: ImportIssue[] = [];
  if (root.format !== undefined && root.format !== REGISTRY_FORMAT)
    errors.push({ section: null, row: null, column: "format", message: `must be “${REGISTRY_FORMAT}”` });
  if (root.version !== undefined && root.version !== REGISTRY_FORMAT_VERSION) {
    const message = `version ${String(root.version)} is not one this app reads (it reads ${REGISTRY_FORMAT_VERSION})`;
    errors.push({ section: null, row: null, column: "version", message });
  }
  return errors;
}

/** A whole registry from JSON text in the registry export's format. */
export function parseRegistryJson(text: string): ParsedRegistry {
  const notices: string[] = [];
  const read = registryRoot(text);
  if ("error" in read) return { registry: null, errors: [fileIssue(read.error)], notices };
  const { root } = read;
  const errors = formatIssues(root);

  let site: SiteRecord | null = null;
  if (!isRecord(root.site))
    errors.push({ section: "site", row: null, column: null, message: "the file needs a “site” object" });
  else {
    const out = v.safeParse(SiteSchema, root.site);
    if (out.success) site = out.output;
    else errors.push(...rowIssues(out.issues, { section: "site", row: null }));
  }

  const { stations, errors: stationErrors } = stationsFromList(listOf(root, "stations", errors), "stations", notices);
  errors.push(...stationErrors);
  const configurations = itemsOf(
    root,
    "configurations",
    "name, description, offered and stations",
    errors,
    readConfiguration,
  );
  errors.push(
    ...repeatedNames(configurations, "configurations", (n, r) => `configuration ${n} is already on row ${r}`),
  );
  const instruments = itemsOf(
    root,
    "instruments",
    "name, description, maxTelescopes and bands",
    errors,
    readInstrument,
  );
  errors.push(...repeatedNames(instruments, "instruments", (n, r) => `instrument ${n} is already on row ${r}`));

  if (errors.length > 0 || !site) return { registry: null, errors, notices };
  return { registry: { site, stations, configurations, instruments }, errors, notices };
}
