/**
 * The array registry as files: the rules every registry value follows (shared by the admin forms
 * and the import), reading station lists and whole registries from CSV or JSON with per-row errors,
 * working out what an import would change, and writing the exports. Pure: no database, HTTP or React.
 *
 * Import rules (the import page repeats them):
 * - A file is UTF-8 text (a byte-order mark is fine) of at most 1 MB; empty, binary and UTF-16
 *   files are refused with a message saying so.
 * - Stations as CSV: a header row, then one station per row. The columns are name, eastM, northM,
 *   upM and pathOffsetM (metres), in any order; case, spaces, underscores and brackets in a header
 *   are ignored, so "East (m)" and "east_m" both name eastM, and "Station" names the name column.
 *   All five columns are required and every cell must be filled (an upsert never guesses a value).
 *   Other columns are ignored, and the preview lists them. Comma, semicolon or tab separated.
 * - Stations as JSON: a list of station objects, or an object with a "stations" list (so both the
 *   station export and the whole-registry export can be read back).
 * - Rows are counted from 1 at the first row under the header (JSON: the first item of the list).
 *   Blank lines are skipped but keep their number.
 * - A station name may appear only once in a file; names are compared exactly, as the database does.
 * - The whole registry as JSON: the format of the registry export ({site, stations, configurations,
 *   instruments}); the site is matched by name and created when none has it; stations,
 *   configurations, instruments and their bands are matched by name and added or updated.
 * - Nothing is removed unless "remove stations missing from the file" is chosen, and even then a
 *   station that a configuration uses stays (the preview names the configurations). Configurations,
 *   instruments and bands missing from a file are left as they are.
 * - One error anywhere and nothing is written.
 */
import Papa from "papaparse";
import * as v from "valibot";

// ---------------------------------------------------------------------------------------------
// Limits

/** Largest file an import accepts, bytes. */
export const MAX_IMPORT_BYTES = 1_000_000;
/** Most stations one import may carry. */
export const MAX_IMPORT_STATIONS = 2000;
/** Most configurations or instruments a whole-registry import may carry. */
export const MAX_IMPORT_ITEMS = 500;

export const STATION_COLUMNS = ["name", "eastM", "northM", "upM", "pathOffsetM"] as const;
export type StationColumn = (typeof STATION_COLUMNS)[number];

// ---------------------------------------------------------------------------------------------
// Value rules

const NUMBER_TEXT = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

/** Reads a number typed in a form or a file: text or a JSON number; an error fragment otherwise. */
export function readNumber(raw: unknown): { value: number } | { error: string } {
  if (raw === undefined || raw === null) return { error: "is required" };
  if (typeof raw === "number") return Number.isFinite(raw) ? { value: raw } : { error: "must be a finite number" };
  if (typeof raw !== "string") return { error: "must be a number" };
  const text = raw.trim().replace(/\u2212/g, "-");
  if (text === "") return { error: "is required" };
  if (NUMBER_TEXT.test(text)) return { value: Number(text) };
  if (/^[+-]?\d*,\d+$/.test(text))
    return { error: `must be a number with a point for decimals (${text.replace(",", ".")}, not ${text})` };
  return { error: "must be a number" };
}

type NumberRule = { min?: number; max?: number; above?: number; below?: number; integer?: boolean; unit?: string };

const withUnit = (x: number, unit?: string) => (unit ? `${x} ${unit}` : String(x));

/** A number from a form field, a CSV cell or a JSON value, with a range and an error naming the rule. */
export function numberField(rule: NumberRule) {
  return v.pipe(
    v.unknown(),
    v.rawTransform<unknown, number>(({ dataset, addIssue, NEVER }) => {
      const read = readNumber(dataset.value);
      if ("error" in read) {
        addIssue({ message: read.error });
        return NEVER;
      }
      const x = read.value;
      const fail = (message: string) => {
        addIssue({ message });
        return NEVER;
      };
      if (rule.integer && !Number.isInteger(x)) return fail("must be a whole number");
      if (rule.above !== undefined && !(x > rule.above)) {
        return fail(
          rule.max !== undefined
            ? `must be greater than ${rule.above} and at most ${withUnit(rule.max, rule.unit)}`
            : `must be greater than ${withUnit(rule.above, rule.unit)}`,
        );
      }
      if (rule.min !== undefined && rule.max !== undefined && (x < rule.min || x > rule.max)) {
        return fail(`must be between ${rule.min} and ${withUnit(rule.max, rule.unit)}`);
      }
      if (rule.min !== undefined && x < rule.min) return fail(`must be at least ${withUnit(rule.min, rule.unit)}`);
      if (rule.max !== undefined && x > rule.max) return fail(`must be at most ${withUnit(rule.max, rule.unit)}`);
      return x;
    }),
  );
}

type TextRule = { required?: boolean; max: number; pattern?: RegExp; patternMessage?: string };

/** Text from a form field, a CSV cell or a JSON string, trimmed. */
export function textField(rule: TextRule) {
  return v.pipe(
    v.unknown(),
    v.rawTransform<unknown, string>(({ dataset, addIssue, NEVER }) => {
      const raw = dataset.value;
      if (raw !== undefined && raw !== null && typeof raw !== "string") {
        addIssue({ message: "must be text" });
        return NEVER;
      }
      const text = (raw ?? "").trim();
      if (rule.required !== false && text === "") {
        addIssue({ message: "is required" });
        return NEVER;
      }
      if (text.length > rule.max) {
        addIssue({ message: `must be at most ${rule.max} characters` });
        return NEVER;
      }
      if (text !== "" && rule.pattern && !rule.pattern.test(text)) {
        addIssue({ message: rule.patternMessage ?? "has characters that are not allowed" });
        return NEVER;
      }
      return text;
    }),
  );
}

/** A yes/no value: a checkbox ("on" or absent), true/false, yes/no, 1/0. */
export function booleanField(whenMissing: boolean) {
  return v.pipe(
    v.unknown(),
    v.rawTransform<unknown, boolean>(({ dataset, addIssue, NEVER }) => {
      const raw = dataset.value;
      if (raw === undefined || raw === null || raw === "") return whenMissing;
      if (typeof raw === "boolean") return raw;
      if (typeof raw === "string") {
        const t = raw.trim().toLowerCase();
        if (["on", "true", "yes", "1"].includes(t)) return true;
        if (["off", "false", "no", "0"].includes(t)) return false;
      }
      addIssue({ message: "must be true or false" });
      return NEVER;
    }),
  );
}

/** An IANA time zone name (e.g. America/Argentina/San_Juan, or UTC). */
export function isTimeZone(name: string): boolean {
  if (!/^[A-Za-z0-9_+\-/]+$/.test(name)) return false;
  try {
    new Intl.DateTimeFormat("en", { timeZone: name });
    return true;
  } catch {
    return false;
  }
}

export const STATION_NAME_PATTERN = /^[A-Za-z0-9][A-Za-z0-9._-]*$/;

export const stationName = textField({
  max: 24,
  pattern: STATION_NAME_PATTERN,
  patternMessage: "must start with a letter or digit and use only letters, digits, '.', '_' or '-'",
});

/** Station names from a list, or from text separated by commas or spaces; in order, each once, at least 2. */
export const stationList = v.pipe(
  v.unknown(),
  v.rawTransform<unknown, string[]>(({ dataset, addIssue, NEVER }) => {
    const raw = dataset.value;
    let names: string[];
    if (typeof raw === "string") names = raw.split(/[\s,;]+/).filter(Boolean);
    else if (Array.isArray(raw) && raw.every((n) => typeof n === "string"))
      names = raw.map((n) => n.trim()).filter(Boolean);
    else if (raw === undefined || raw === null) names = [];
    else {
      addIssue({ message: "must be a list of station names" });
      return NEVER;
    }
    if (names.length < 2) {
      addIssue({ message: "needs at least 2 stations" });
      return NEVER;
    }
    const seen = new Set<string>();
    for (const n of names) {
      if (seen.has(n)) {
        addIssue({ message: `lists ${n} twice` });
        return NEVER;
      }
      seen.add(n);
    }
    const bad = names.find((n) => n.length > 24 || !STATION_NAME_PATTERN.test(n));
    if (bad) {
      addIssue({ message: `“${bad.slice(0, 30)}” is not a station name` });
      return NEVER;
    }
    return names;
  }),
);

const isRecord = (x: unknown): x is Record<string, unknown> => typeof x === "object" && x !== null && !Array.isArray(x);

/**
 * An object of the given fields where a missing field is reported by the field's own rule ("is
 * required"), not as an unknown key; fields that are not listed are dropped.
 */
export function fields<const TEntries extends v.ObjectEntries>(entries: TEntries) {
  const keys = Object.keys(entries);
  return v.pipe(
    v.unknown(),
    v.transform((input) => (isRecord(input) ? Object.fromEntries(keys.map((k) => [k, input[k]])) : input)),
    v.object(entries),
  );
}

export const SiteSchema = fields({
  name: textField({ max: 80 }),
  latitudeDeg: numberField({ min: -90, max: 90, unit: "°" }),
  longitudeDeg: numberField({ min: -180, max: 180, unit: "°" }),
  altitudeM: numberField({ min: -500, max: 9000, unit: "m" }),
  minElevationDeg: numberField({ min: 0, max: 90, unit: "°" }),
  delayLineStrokeM: numberField({ above: 0, max: 10000, unit: "m" }),
  timeZone: v.pipe(
    textField({ max: 64 }),
    v.check(isTimeZone, "must be a time zone name such as UTC or America/Argentina/San_Juan"),
  ),
});
export type SiteRecord = v.InferOutput<typeof SiteSchema>;

export const StationSchema = fields({
  name: stationName,
  eastM: numberField({ min: -20000, max: 20000, unit: "m" }),
  northM: numberField({ min: -20000, max: 20000, unit: "m" }),
  upM: numberField({ min: -1000, max: 1000, unit: "m" }),
  pathOffsetM: numberField({ min: -10000, max: 10000, unit: "m" }),
});
export type StationRecord = v.InferOutput<typeof StationSchema>;

export const ConfigurationSchema = fields({
  name: textField({ max: 60 }),
  description: textField({ required: false, max: 500 }),
  offered: booleanField(true),
  stations: stationList,
});
export type ConfigurationRecord = v.InferOutput<typeof ConfigurationSchema>;

export const InstrumentSchema = fields({
  name: textField({ max: 60 }),
  description: textField({ required: false, max: 500 }),
  maxTelescopes: numberField({ min: 2, max: 50, integer: true }),
});
export type InstrumentValues = v.InferOutput<typeof InstrumentSchema>;

const bandName = textField({ max: 20 });
const channels = numberField({ min: 1, max: 100000, integer: true });
const limitingMagnitude = numberField({ min: -5, max: 30, unit: "mag" });
const BANDWIDTH_RULE = "must be less than twice the central wavelength (the band's short edge would fall below zero)";

/** A band as the forms take it: wavelengths in micrometres. */
export const BandFormSchema = v.pipe(
  fields({
    name: bandName,
    centralWavelengthUm: numberField({ above: 0, max: 1000, unit: "µm" }),
    channels,
    bandwidthUm: numberField({ above: 0, max: 1000, unit: "µm" }),
    limitingMagnitude,
  }),
  v.forward(
    v.partialCheck(
      [["centralWavelengthUm"], ["bandwidthUm"]],
      (b) => b.bandwidthUm < 2 * b.centralWavelengthUm,
      BANDWIDTH_RULE,
    ),
    ["bandwidthUm"],
  ),
);

/** A band as files carry it: wavelengths in metres, as everywhere on the wire. */
export const BandFileSchema = v.pipe(
  fields({
    name: bandName,
    centralWavelengthM: numberField({ above: 0, max: 1e-3, unit: "m" }),
    channels,
    bandwidthM: numberField({ above: 0, max: 1e-3, unit: "m" }),
    limitingMagnitude,
  }),
  v.forward(
    v.partialCheck(
      [["centralWavelengthM"], ["bandwidthM"]],
      (b) => b.bandwidthM < 2 * b.centralWavelengthM,
      BANDWIDTH_RULE,
    ),
    ["bandwidthM"],
  ),
);
export type BandRecord = v.InferOutput<typeof BandFileSchema>;
export type InstrumentRecord = InstrumentValues & { bands: BandRecord[] };

/** Micrometres to metres without a binary-fraction tail (1.65 µm → 1.65e-6 m exactly as typed). */
export function micronsToMetres(um: number): number {
  return Number((um * 1e-6).toPrecision(15));
}
export function metresToMicrons(m: number): number {
  return Number((m * 1e6).toPrecision(12));
}

/** The first message per field of a failed parse, keyed by the field name. */
export function fieldErrors(issues: readonly v.BaseIssue<unknown>[]): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of issues) {
    const key = issue.path?.map((p) => String(p.key)).join(".") || "form";
    out[key] ??= issue.message;
  }
  return out;
}

/** "must be a number" → "Must be a number." for display under a field. */
export function sentence(fragment: string): string {
  const s = fragment.charAt(0).toUpperCase() + fragment.slice(1);
  return /[.!?)]$/.test(s) ? s : `${s}.`;
}

// ---------------------------------------------------------------------------------------------
// Reading files

export type ImportSection = "site" | "stations" | "configurations" | "instruments";

/** One problem with an import: where (section, row counted from 1, column or field) and what. */
export type ImportIssue = { section: ImportSection | null; row: number | null; column: string | null; message: string };

/** "row 4, eastM: must be a number" (with the section first in a whole-registry file). */
export function issueText(issue: ImportIssue): string {
  const where = [
    issue.section && issue.row !== null ? `${issue.section} row ${issue.row}` : issue.section,
    issue.section ? null : issue.row !== null ? `row ${issue.row}` : null,
    issue.column,
  ].filter(Boolean);
  return where.length > 0 ? `${where.join(", ")}: ${issue.message}` : issue.message;
}

export type DecodedUpload = { ok: true; text: string } | { ok: false; error: string };

const megabytes = (n: number) => `${(n / 1_000_000).toFixed(n < 10_000_000 ? 1 : 0)} MB`;

/** Bytes of an uploaded file as text, or why not: too large, empty, binary, UTF-16, not UTF-8. */
export function decodeUpload(bytes: Uint8Array, limit = MAX_IMPORT_BYTES): DecodedUpload {
  if (bytes.length > limit)
    return { ok: false, error: `The file is ${megabytes(bytes.length)}; the limit is ${megabytes(limit)}.` };
  if (bytes.length === 0) return { ok: false, error: "The file is empty." };
  if ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff)) {
    return {
      ok: false,
      error: "The file is in UTF-16; save it as UTF-8 (in a spreadsheet: “CSV UTF-8”) and try again.",
    };
  }
  if (bytes[0] === 0x50 && bytes[1] === 0x4b && bytes[2] === 0x03 && bytes[3] === 0x04) {
    return {
      ok: false,
      error: "This is a spreadsheet workbook or another zipped file; save the sheet as CSV (UTF-8) and import that.",
    };
  }
  if (bytes.includes(0)) return { ok: false, error: "This is not a text file; import a CSV or JSON file." };
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    return { ok: false, error: "The file is not UTF-8 text; save it as UTF-8 and try again." };
  }
  if (text.trim() === "") return { ok: false, error: "The file is empty." };
  return { ok: true, text };
}

export type FileFormat = "csv" | "json";

/** JSON when the text starts with “{” or “[”, CSV otherwise. */
export function detectFormat(text: string): FileFormat {
  const first = text
    .replace(/^\uFEFF/, "")
    .trimStart()
    .charAt(0);
  return first === "{" || first === "[" ? "json" : "csv";
}

export type StationRow = StationRecord & { row: number };
export type ParsedStations = { format: FileFormat; stations: StationRow[]; errors: ImportIssue[]; notices: string[] };

const normaliseHeader = (h: string) => h.toLowerCase().replace(/[^a-z0-9]/g, "");
const STATION_HEADER: Record<string, StationColumn> = {
  name: "name",
  station: "name",
  stationname: "name",
  eastm: "eastM",
  northm: "northM",
  upm: "upM",
  pathoffsetm: "pathOffsetM",
};

function stationIssues(
  issues: readonly v.BaseIssue<unknown>[],
  row: number,
  section: ImportSection | null,
): ImportIssue[] {
  return Object.entries(fieldErrors(issues)).map(([column, message]) => ({
    section,
    row,
    column: column === "form" ? null : column,
    message,
  }));
}

/** Flags the second and later rows that repeat a station name. */
function duplicateNames(rows: { row: number; name: string }[], section: ImportSection | null): ImportIssue[] {
  const firstRow = new Map<string, number>();
  const out: ImportIssue[] = [];
  for (const r of rows) {
    const first = firstRow.get(r.name);
    if (first !== undefined)
      out.push({
        section,
        row: r.row,
        column: "name",
        message: `${r.name} is already on row ${first}; a station may appear only once`,
      });
    else firstRow.set(r.name, r.row);
  }
  return out;
}

/** Stations from CSV text (see the rules at the top of this file). */
export function parseStationsCsv(text: string): ParsedStations {
  const result: ParsedStations = { format: "csv", stations: [], errors: [], notices: [] };
  const parsed = Papa.parse<string[]>(text.replace(/^\uFEFF/, ""), {
    header: false,
    skipEmptyLines: false,
    delimitersToGuess: [",", ";", "\t"],
  });
  const rows = parsed.data;
  const headerIndex = rows.findIndex((r) => r.some((c) => c.trim() !== ""));
  if (headerIndex < 0) {
    result.errors.push({ section: null, row: null, column: null, message: "The file is empty." });
    return result;
  }
  for (const e of parsed.errors) {
    if (e.code === "MissingQuotes") {
      result.errors.push({
        section: null,
        row: typeof e.row === "number" ? e.row - headerIndex : null,
        column: null,
        message: "a quoted value is never closed",
      });
    }
  }
  if (result.errors.length > 0) return result;

  const header = rows[headerIndex];
  const columnOf = new Map<StationColumn, number>();
  const ignored: string[] = [];
  header.forEach((raw, index) => {
    const canonical = STATION_HEADER[normaliseHeader(raw)];
    if (!canonical) {
      if (raw.trim() !== "") ignored.push(raw.trim());
      return;
    }
    if (columnOf.has(canonical)) {
      result.errors.push({
        section: null,
        row: null,
        column: canonical,
        message: `two columns (${header[columnOf.get(canonical)!].trim()} and ${raw.trim()}) both give ${canonical}`,
      });
      return;
    }
    columnOf.set(canonical, index);
  });
  const missing = STATION_COLUMNS.filter((c) => !columnOf.has(c));
  for (const c of missing) {
    result.errors.push({
      section: null,
      row: null,
      column: c,
      message: `the column is missing (the header row must name ${STATION_COLUMNS.join(", ")})`,
    });
  }
  if (ignored.length > 0)
    result.notices.push(
      `Not used and ignored: the column${ignored.length > 1 ? "s" : ""} ${ignored.map((c) => `“${c}”`).join(", ")}.`,
    );
  if (result.errors.length > 0) return result;

  const body = rows.slice(headerIndex + 1);
  const filled = body
    .map((cells, i) => ({ cells, row: i + 1 }))
    .filter(({ cells }) => cells.some((c) => c.trim() !== ""));
  if (filled.length === 0) {
    result.errors.push({
      section: null,
      row: null,
      column: null,
      message: "The file has a header row but no stations under it.",
    });
    return result;
  }
  if (filled.length > MAX_IMPORT_STATIONS) {
    result.errors.push({
      section: null,
      row: null,
      column: null,
      message: `The file has ${filled.length} stations; one import takes at most ${MAX_IMPORT_STATIONS}.`,
    });
    return result;
  }
  for (const { cells, row } of filled) {
    if (cells.length !== header.length) {
      result.errors.push({
        section: null,
        row,
        column: null,
        message: `has ${cells.length} values but the header has ${header.length} columns`,
      });
      continue;
    }
    const record = Object.fromEntries(STATION_COLUMNS.map((c) => [c, cells[columnOf.get(c)!]]));
    const out = v.safeParse(StationSchema, record);
    if (out.success) result.stations.push({ ...out.output, row });
    else result.errors.push(...stationIssues(out.issues, row, null));
  }
  result.errors.push(...duplicateNames(result.stations, null));
  return result;
}

function parseJson(text: string): { ok: true; value: unknown } | { ok: false; error: string } {
  try {
    return { ok: true, value: JSON.parse(text.replace(/^\uFEFF/, "")) };
  } catch (e) {
    return { ok: false, error: `The file is not valid JSON (${String((e as Error).message).slice(0, 160)}).` };
  }
}

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
    else errors.push(...stationIssues(out.issues, row, section));
  });
  errors.push(...duplicateNames(stations, section));
  if (extra.size > 0)
    notices.push(
      `Not used and ignored${section ? ` in ${section}` : ""}: the field${extra.size > 1 ? "s" : ""} ${[...extra].map((k) => `“${k}”`).join(", ")}.`,
    );
  return { stations, errors };
}

/** Stations from JSON text: a list of stations, or an object with a "stations" list. */
export function parseStationsJson(text: string): ParsedStations {
  const result: ParsedStations = { format: "json", stations: [], errors: [], notices: [] };
  const json = parseJson(text);
  if (!json.ok) {
    result.errors.push({ section: null, row: null, column: null, message: json.error });
    return result;
  }
  const list = Array.isArray(json.value)
    ? json.value
    : isRecord(json.value) && Array.isArray(json.value.stations)
      ? json.value.stations
      : null;
  if (!list) {
    result.errors.push({
      section: null,
      row: null,
      column: null,
      message: "The JSON must be a list of stations, or an object with a “stations” list.",
    });
    return result;
  }
  if (list.length === 0) {
    result.errors.push({ section: null, row: null, column: null, message: "The list of stations is empty." });
    return result;
  }
  if (list.length > MAX_IMPORT_STATIONS) {
    result.errors.push({
      section: null,
      row: null,
      column: null,
      message: `The file has ${list.length} stations; one import takes at most ${MAX_IMPORT_STATIONS}.`,
    });
    return result;
  }
  const { stations, errors } = stationsFromList(list, null, result.notices);
  result.stations = stations;
  result.errors = errors;
  return result;
}

/** Stations from CSV or JSON text, told apart by the first character. */
export function parseStationsFile(text: string): ParsedStations {
  return detectFormat(text) === "json" ? parseStationsJson(text) : parseStationsCsv(text);
}

export const REGISTRY_FORMAT = "fringe-docket-registry";
export const REGISTRY_FORMAT_VERSION = 1;

export type RegistryFile = {
  site: SiteRecord;
  stations: StationRow[];
  configurations: (ConfigurationRecord & { row: number })[];
  instruments: (InstrumentRecord & { row: number })[];
};
export type ParsedRegistry = { registry: RegistryFile | null; errors: ImportIssue[]; notices: string[] };

function listOf(obj: Record<string, unknown>, key: ImportSection, errors: ImportIssue[]): unknown[] {
  const value = obj[key];
  if (!Array.isArray(value)) {
    errors.push({ section: key, row: null, column: null, message: `the file needs a “${key}” list (it may be empty)` });
    return [];
  }
  if (value.length > (key === "stations" ? MAX_IMPORT_STATIONS : MAX_IMPORT_ITEMS)) {
    errors.push({
      section: key,
      row: null,
      column: null,
      message: `has ${value.length} items; one import takes at most ${key === "stations" ? MAX_IMPORT_STATIONS : MAX_IMPORT_ITEMS}`,
    });
    return [];
  }
  return value;
}

function duplicates<T extends { row: number }>(
  items: T[],
  key: (t: T) => string,
  section: ImportSection,
  column: string,
  what: string,
): ImportIssue[] {
  const first = new Map<string, number>();
  const out: ImportIssue[] = [];
  for (const item of items) {
    const k = key(item);
    const seen = first.get(k);
    if (seen !== undefined)
      out.push({ section, row: item.row, column, message: `${what} ${k} is already on row ${seen}` });
    else first.set(k, item.row);
  }
  return out;
}

/** A whole registry from JSON text in the registry export's format. */
export function parseRegistryJson(text: string): ParsedRegistry {
  const errors: ImportIssue[] = [];
  const notices: string[] = [];
  if (detectFormat(text) !== "json") {
    return {
      registry: null,
      errors: [
        {
          section: null,
          row: null,
          column: null,
          message: "A whole-registry import is a JSON file in the format of the registry export; this looks like CSV.",
        },
      ],
      notices,
    };
  }
  const json = parseJson(text);
  if (!json.ok)
    return { registry: null, errors: [{ section: null, row: null, column: null, message: json.error }], notices };
  const root = json.value;
  if (!isRecord(root)) {
    return {
      registry: null,
      errors: [
        {
          section: null,
          row: null,
          column: null,
          message: "The JSON must be an object with site, stations, configurations and instruments.",
        },
      ],
      notices,
    };
  }
  if (root.format !== undefined && root.format !== REGISTRY_FORMAT) {
    errors.push({ section: null, row: null, column: "format", message: `must be “${REGISTRY_FORMAT}”` });
  }
  if (root.version !== undefined && root.version !== REGISTRY_FORMAT_VERSION) {
    errors.push({
      section: null,
      row: null,
      column: "version",
      message: `version ${String(root.version)} is not one this app reads (it reads ${REGISTRY_FORMAT_VERSION})`,
    });
  }

  let site: SiteRecord | null = null;
  if (!isRecord(root.site))
    errors.push({ section: "site", row: null, column: null, message: "the file needs a “site” object" });
  else {
    const out = v.safeParse(SiteSchema, root.site);
    if (out.success) site = out.output;
    else
      for (const [column, message] of Object.entries(fieldErrors(out.issues)))
        errors.push({ section: "site", row: null, column, message });
  }

  const { stations, errors: stationErrors } = stationsFromList(listOf(root, "stations", errors), "stations", notices);
  errors.push(...stationErrors);

  const configurations: RegistryFile["configurations"] = [];
  listOf(root, "configurations", errors).forEach((item, i) => {
    const row = i + 1;
    if (!isRecord(item))
      return errors.push({
        section: "configurations",
        row,
        column: null,
        message: "must be an object with name, description, offered and stations",
      });
    const out = v.safeParse(ConfigurationSchema, item);
    if (out.success) configurations.push({ ...out.output, row });
    else
      for (const [column, message] of Object.entries(fieldErrors(out.issues)))
        errors.push({ section: "configurations", row, column, message });
  });
  errors.push(...duplicates(configurations, (c) => c.name, "configurations", "name", "configuration"));

  const instruments: RegistryFile["instruments"] = [];
  listOf(root, "instruments", errors).forEach((item, i) => {
    const row = i + 1;
    if (!isRecord(item))
      return errors.push({
        section: "instruments",
        row,
        column: null,
        message: "must be an object with name, description, maxTelescopes and bands",
      });
    const head = v.safeParse(InstrumentSchema, item);
    const instrumentErrors: ImportIssue[] = head.success
      ? []
      : Object.entries(fieldErrors(head.issues)).map(([column, message]) => ({
          section: "instruments" as const,
          row,
          column,
          message,
        }));
    const bandList = item.bands ?? [];
    const bandsOut: BandRecord[] = [];
    if (!Array.isArray(bandList))
      instrumentErrors.push({ section: "instruments", row, column: "bands", message: "must be a list" });
    else {
      bandList.forEach((band, j) => {
        if (!isRecord(band))
          return instrumentErrors.push({
            section: "instruments",
            row,
            column: `bands[${j + 1}]`,
            message: "must be an object",
          });
        const out = v.safeParse(BandFileSchema, band);
        if (out.success) bandsOut.push(out.output);
        else
          for (const [field, message] of Object.entries(fieldErrors(out.issues)))
            instrumentErrors.push({ section: "instruments", row, column: `bands[${j + 1}].${field}`, message });
      });
      const seen = new Set<string>();
      for (const b of bandsOut) {
        if (seen.has(b.name))
          instrumentErrors.push({
            section: "instruments",
            row,
            column: "bands",
            message: `band ${b.name} appears twice`,
          });
        seen.add(b.name);
      }
    }
    errors.push(...instrumentErrors);
    if (head.success && instrumentErrors.length === 0) instruments.push({ ...head.output, bands: bandsOut, row });
  });
  errors.push(...duplicates(instruments, (x) => x.name, "instruments", "name", "instrument"));

  if (errors.length > 0 || !site) return { registry: null, errors, notices };
  return { registry: { site, stations, configurations, instruments }, errors, notices };
}

// ---------------------------------------------------------------------------------------------
// What an import would change

export type Change = "new" | "updated" | "unchanged" | "remove" | "keep";

export type StationLine = {
  /** Row in the file, or null for a station that is only at the site. */
  row: number | null;
  name: string;
  change: Change;
  before: StationRecord | null;
  after: StationRecord | null;
  /** The fields whose values differ (for "updated"). */
  changed: StationColumn[];
  note: string | null;
};

export type StationPlan = { lines: StationLine[]; counts: Record<Change, number>; notices: string[] };

const STATION_VALUES: StationColumn[] = ["eastM", "northM", "upM", "pathOffsetM"];

function countChanges(lines: { change: Change }[]): Record<Change, number> {
  const counts: Record<Change, number> = { new: 0, updated: 0, unchanged: 0, remove: 0, keep: 0 };
  for (const l of lines) counts[l.change] += 1;
  return counts;
}

/**
 * Compares the stations of a file with those at the site: new, updated or unchanged by name; the
 * site's stations missing from the file are kept, or removed when `removeMissing` is set and no
 * configuration uses them (`usage`: station name → names of the configurations that use it).
 */
export function planStations(
  current: StationRecord[],
  incoming: StationRow[],
  options: { removeMissing: boolean; usage: Record<string, string[]> },
): StationPlan {
  const byName = new Map(current.map((s) => [s.name, s]));
  const lines: StationLine[] = incoming.map((s) => {
    const { row, ...after } = s;
    const before = byName.get(s.name) ?? null;
    if (!before) return { row, name: s.name, change: "new", before: null, after, changed: [], note: null };
    const changed = STATION_VALUES.filter((k) => before[k] !== after[k]);
    return {
      row,
      name: s.name,
      change: changed.length > 0 ? "updated" : "unchanged",
      before,
      after,
      changed,
      note: null,
    };
  });
  const inFile = new Set(incoming.map((s) => s.name));
  for (const s of current) {
    if (inFile.has(s.name)) continue;
    const users = options.usage[s.name] ?? [];
    if (!options.removeMissing) {
      lines.push({
        row: null,
        name: s.name,
        change: "keep",
        before: s,
        after: s,
        changed: [],
        note: "not in the file; left as it is",
      });
    } else if (users.length > 0) {
      lines.push({
        row: null,
        name: s.name,
        change: "keep",
        before: s,
        after: s,
        changed: [],
        note: `not in the file, but used by ${users.join(", ")}, so it stays`,
      });
    } else {
      lines.push({
        row: null,
        name: s.name,
        change: "remove",
        before: s,
        after: null,
        changed: [],
        note: "not in the file; will be removed",
      });
    }
  }
  const notices: string[] = [];
  const kept = lines.filter((l) => l.change === "keep" && l.note?.startsWith("not in the file, but used")).length;
  if (kept > 0)
    notices.push(
      `${kept} station${kept > 1 ? "s" : ""} missing from the file stay${kept > 1 ? "" : "s"} because configurations use ${kept > 1 ? "them" : "it"}.`,
    );
  return { lines, counts: countChanges(lines), notices };
}

export type RegistrySnapshot = {
  site: SiteRecord;
  stations: StationRecord[];
  configurations: ConfigurationRecord[];
  instruments: InstrumentRecord[];
};

type Line<T, K extends string> = {
  row: number | null;
  name: string;
  change: Change;
  before: T | null;
  after: T | null;
  changed: K[];
};
export type SiteLine = Line<SiteRecord, keyof SiteRecord>;
export type ConfigurationLine = Line<ConfigurationRecord, keyof ConfigurationRecord>;
export type BandLine = Line<BandRecord, keyof BandRecord>;
export type InstrumentLine = Line<InstrumentValues, keyof InstrumentValues> & { bands: BandLine[] };

export type RegistryPlan = {
  site: SiteLine;
  stations: StationLine[];
  configurations: ConfigurationLine[];
  instruments: InstrumentLine[];
  counts: Record<"site" | "stations" | "configurations" | "instruments" | "bands", Record<Change, number>>;
  errors: ImportIssue[];
  notices: string[];
};

function compareFields<T extends Record<string, unknown>>(before: T, after: T, keys: (keyof T)[]): (keyof T)[] {
  return keys.filter((k) => {
    const a = before[k];
    const b = after[k];
    if (Array.isArray(a) && Array.isArray(b)) return a.length !== b.length || a.some((x, i) => x !== b[i]);
    return a !== b;
  });
}

function line<T extends Record<string, unknown>>(
  row: number | null,
  name: string,
  before: T | null,
  after: T,
  keys: (keyof T)[],
): Line<T, Extract<keyof T, string>> {
  if (!before) return { row, name, change: "new", before: null, after, changed: [] };
  const changed = compareFields(before, after, keys) as Extract<keyof T, string>[];
  return { row, name, change: changed.length > 0 ? "updated" : "unchanged", before, after, changed };
}

/**
 * Compares a whole-registry file with the site of the same name (`current`, or null when there is
 * none yet). References are checked here: every station a configuration lists must be in the file
 * or at the site.
 */
export function planRegistry(
  current: RegistrySnapshot | null,
  file: RegistryFile,
  options: { removeMissing: boolean },
): RegistryPlan {
  const errors: ImportIssue[] = [];
  const notices: string[] = [];
  const siteKeys: (keyof SiteRecord)[] = [
    "latitudeDeg",
    "longitudeDeg",
    "altitudeM",
    "minElevationDeg",
    "delayLineStrokeM",
    "timeZone",
  ];
  const site = line(null, file.site.name, current?.site ?? null, file.site, siteKeys);

  const known = new Set([...file.stations.map((s) => s.name), ...(current?.stations ?? []).map((s) => s.name)]);
  for (const c of file.configurations) {
    const unknown = c.stations.filter((n) => !known.has(n));
    if (unknown.length > 0) {
      errors.push({
        section: "configurations",
        row: c.row,
        column: "stations",
        message: `${unknown.join(", ")} ${unknown.length > 1 ? "are" : "is"} neither in the file's stations nor at the site`,
      });
    }
  }

  // Which configurations use each station once the import is applied.
  const finalConfigs = new Map<string, string[]>();
  for (const c of current?.configurations ?? []) finalConfigs.set(c.name, c.stations);
  for (const c of file.configurations) finalConfigs.set(c.name, c.stations);
  const usage: Record<string, string[]> = {};
  for (const [name, list] of finalConfigs) for (const s of list) (usage[s] ??= []).push(name);

  const stationPlan = planStations(current?.stations ?? [], file.stations, {
    removeMissing: options.removeMissing,
    usage,
  });
  notices.push(...stationPlan.notices);

  const currentConfigs = new Map((current?.configurations ?? []).map((c) => [c.name, c]));
  const configurations: ConfigurationLine[] = file.configurations.map(({ row, ...c }) =>
    line(row, c.name, currentConfigs.get(c.name) ?? null, c, ["description", "offered", "stations"]),
  );
  const inFileConfigs = new Set(file.configurations.map((c) => c.name));
  for (const c of current?.configurations ?? []) {
    if (!inFileConfigs.has(c.name))
      configurations.push({ row: null, name: c.name, change: "keep", before: c, after: c, changed: [] });
  }

  const currentInstruments = new Map((current?.instruments ?? []).map((i) => [i.name, i]));
  const instruments: InstrumentLine[] = file.instruments.map(({ row, bands, ...values }) => {
    const before = currentInstruments.get(values.name) ?? null;
    const head = line(
      row,
      values.name,
      before ? { name: before.name, description: before.description, maxTelescopes: before.maxTelescopes } : null,
      values,
      ["description", "maxTelescopes"],
    );
    const currentBands = new Map((before?.bands ?? []).map((b) => [b.name, b]));
    const bandLines: BandLine[] = bands.map((b) =>
      line(null, b.name, currentBands.get(b.name) ?? null, b, [
        "centralWavelengthM",
        "channels",
        "bandwidthM",
        "limitingMagnitude",
      ]),
    );
    const inFileBands = new Set(bands.map((b) => b.name));
    for (const b of before?.bands ?? [])
      if (!inFileBands.has(b.name))
        bandLines.push({ row: null, name: b.name, change: "keep", before: b, after: b, changed: [] });
    return { ...head, bands: bandLines };
  });
  for (const i of current?.instruments ?? []) {
    if (!file.instruments.some((x) => x.name === i.name)) {
      instruments.push({
        row: null,
        name: i.name,
        change: "keep",
        before: i,
        after: i,
        changed: [],
        bands: i.bands.map((b) => ({ row: null, name: b.name, change: "keep", before: b, after: b, changed: [] })),
      });
    }
  }

  // A configuration larger than every instrument can take is allowed, but worth a word.
  const allInstruments = instruments.map((i) => i.after!).filter(Boolean);
  const widest = allInstruments.reduce((m, i) => Math.max(m, i.maxTelescopes), 0);
  if (widest > 0) {
    for (const c of configurations) {
      if (c.after && c.change !== "keep" && c.after.stations.length > widest) {
        notices.push(
          `Configuration ${c.name} has ${c.after.stations.length} stations; no instrument combines more than ${widest}.`,
        );
      }
    }
  }

  return {
    site,
    stations: stationPlan.lines,
    configurations,
    instruments,
    counts: {
      site: countChanges([site]),
      stations: stationPlan.counts,
      configurations: countChanges(configurations),
      instruments: countChanges(instruments),
      bands: countChanges(instruments.flatMap((i) => i.bands)),
    },
    errors,
    notices,
  };
}

// ---------------------------------------------------------------------------------------------
// Writing files

/** Stations as CSV; the header names carry the unit (M = metres). */
export function stationsToCsv(stations: StationRecord[]): string {
  return Papa.unparse(
    { fields: [...STATION_COLUMNS], data: stations.map((s) => STATION_COLUMNS.map((c) => s[c])) },
    { escapeFormulae: true, newline: "\n" },
  );
}

/** Configurations as CSV: stations in order, separated by spaces. */
export function configurationsToCsv(configurations: ConfigurationRecord[]): string {
  return Papa.unparse(
    {
      fields: ["name", "description", "offered", "stationCount", "stations"],
      data: configurations.map((c) => [c.name, c.description, c.offered, c.stations.length, c.stations.join(" ")]),
    },
    { escapeFormulae: true, newline: "\n" },
  );
}

/** One row per band with its instrument; wavelengths in micrometres (Um in the header). */
export function bandsToCsv(instruments: InstrumentRecord[]): string {
  return Papa.unparse(
    {
      fields: [
        "instrument",
        "maxTelescopes",
        "band",
        "centralWavelengthUm",
        "bandwidthUm",
        "channels",
        "limitingMagnitude",
      ],
      data: instruments.flatMap((i) =>
        i.bands.map((b) => [
          i.name,
          i.maxTelescopes,
          b.name,
          metresToMicrons(b.centralWavelengthM),
          metresToMicrons(b.bandwidthM),
          b.channels,
          b.limitingMagnitude,
        ]),
      ),
    },
    { escapeFormulae: true, newline: "\n" },
  );
}

/** The whole registry of a site as the JSON the whole-registry import reads (wavelengths in metres). */
export function registryToJson(snapshot: RegistrySnapshot, exportedAt: Date) {
  return {
    format: REGISTRY_FORMAT,
    version: REGISTRY_FORMAT_VERSION,
    exportedAt: exportedAt.toISOString(),
    site: snapshot.site,
    stations: snapshot.stations.map((s) => ({
      name: s.name,
      eastM: s.eastM,
      northM: s.northM,
      upM: s.upM,
      pathOffsetM: s.pathOffsetM,
    })),
    configurations: snapshot.configurations,
    instruments: snapshot.instruments,
  };
}
