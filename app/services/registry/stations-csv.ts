/**
 * Stations as CSV: a header row, then one station per row. The columns are name, eastM, northM,
 * upM and pathOffsetM (metres), in any order; case, spaces, underscores and brackets in a header
 * are ignored, so "East (m)" and "east_m" both name eastM, and "Station" names the name column.
 * All five columns are required and every cell must be filled (an upsert never guesses a value).
 * Other columns are ignored, and the preview lists them. Comma, semicolon or tab separated.
 * Rows are numbered by the file's own lines (`readCsvRecords`), blank lines counted. A station name may appear only once in a file;
 * names are compared exactly, as the database does.
 */
import * as v from "valibot";
import { isBlankRecord, readCsvRecords } from "~/lib/csv";
import { STATION_COLUMNS, type StationColumn, type StationRecord, StationSchema } from "./schemas";
import {
  type FileFormat,
  fileIssue,
  type ImportIssue,
  type ImportSection,
  MAX_IMPORT_STATIONS,
  repeatedNames,
  rowIssues,
} from "./upload";

export type StationRow = StationRecord & { row: number };
export type ParsedStations = { format: FileFormat; stations: StationRow[]; errors: ImportIssue[]; notices: string[] };

/** Flags the second and later rows that repeat a station name. */
export const repeatedStations = (rows: StationRow[], section: ImportSection | null) =>
  repeatedNames(rows, section, (name, first) => `${name} is already on row ${first}; a station may appear only once`);

/** Refuses a list longer than one import takes. */
export const tooManyStations = (n: number): ImportIssue | null =>
  n > MAX_IMPORT_STATIONS
    ? fileIssue(`The file has ${n} stations; one import takes at most ${MAX_IMPORT_STATIONS}.`)
    : null;

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

/** Which cell of a row holds each column, the header's unused columns, and what is wrong with it. */
function readHeader(header: string[]) {
  const columnOf = new Map<StationColumn, number>();
  const ignored: string[] = [];
  const errors: ImportIssue[] = [];
  header.forEach((raw, index) => {
    const canonical = STATION_HEADER[normaliseHeader(raw)];
    if (!canonical) {
      if (raw.trim() !== "") ignored.push(raw.trim());
    } else if (columnOf.has(canonical)) {
      const message = `two columns (${header[columnOf.get(canonical)!].trim()} and ${raw.trim()}) both give ${canonical}`;
      errors.push({ section: null, row: null, column: canonical, message });
    } else columnOf.set(canonical, index);
  });
  for (const c of STATION_COLUMNS.filter((c) => !columnOf.has(c))) {
    const message = `the column is missing (the header row must name ${STATION_COLUMNS.join(", ")})`;
    errors.push({ section: null, row: null, column: c, message });
  }
  return { columnOf, ignored, errors };
}

/** The records of the text with their line numbers, the header's record, and each quote never closed. */
function readRows(text: string) {
  const { records, errors } = readCsvRecords(text, { delimitersToGuess: [",", ";", "\t"] });
  const headerIndex = records.findIndex((r) => !isBlankRecord(r));
  const unclosed = errors.map((e) => ({ section: null, row: e.line, column: null, message: e.message }));
  return { records, headerIndex, unclosed };
}

/** Stations from CSV text (see the rules at the top of this file). */
export function parseStationsCsv(text: string): ParsedStations {
  const result: ParsedStations = { format: "csv", stations: [], errors: [], notices: [] };
  const refuse = (...issues: ImportIssue[]) => {
    result.errors.push(...issues);
    return result;
  };
  const { records, headerIndex, unclosed } = readRows(text);
  if (headerIndex < 0) return refuse(fileIssue("The file is empty."));
  if (unclosed.length > 0) return refuse(...unclosed);

  const header = records[headerIndex].cells;
  const { columnOf, ignored, errors } = readHeader(header);
  if (ignored.length > 0)
    result.notices.push(
      `Not used and ignored: the column${ignored.length > 1 ? "s" : ""} ${ignored.map((c) => `“${c}”`).join(", ")}.`,
    );
  if (errors.length > 0) return refuse(...errors);

  const filled = records
    .slice(headerIndex + 1)
    .filter((r) => !isBlankRecord(r))
    .map(({ cells, line }) => ({ cells, row: line }));
  if (filled.length === 0) return refuse(fileIssue("The file has a header row but no stations under it."));
  const tooMany = tooManyStations(filled.length);
  if (tooMany) return refuse(tooMany);
  for (const { cells, row } of filled) {
    if (cells.length !== header.length) {
      const message = `has ${cells.length} values but the header has ${header.length} columns`;
      result.errors.push({ section: null, row, column: null, message });
      continue;
    }
    const record = Object.fromEntries(STATION_COLUMNS.map((c) => [c, cells[columnOf.get(c)!]]));
    const out = v.safeParse(StationSchema, record);
    if (out.success) result.stations.push({ ...out.output, row });
    else result.errors.push(...rowIssues(out.issues, { section: null, row }));
  }
  result.errors.push(...repeatedStations(result.stations, null));
  return result;
}
