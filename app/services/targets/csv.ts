/**
 * Reading a target list from CSV (pure: no I/O). One target per row; the header names the columns:
 *
 *   name, ra, dec                 required. RA in hours (05:36:12.8) or degrees (84.05); Dec in degrees.
 *                                 With the star catalogue (`resolveName`), a row with a name but empty
 *                                 ra and dec takes the named star's position, and ra, dec may be left out.
 *   model                         point (default), uniformDisk, gaussian, limbDarkenedDisk, ring, binary
 *   size_mas                      diameter (disks, ring) or FWHM (gaussian), milliarcseconds
 *   ld_coefficient                linear limb-darkening coefficient 0..1 (limbDarkenedDisk)
 *   separation_mas, position_angle_deg, flux_ratio    binary: separation, PA east of north, secondary/primary
 *   mag_<band>                    magnitude in a band, e.g. mag_H, mag_K, mag_N
 *   notes                         free text
 *
 * Column names are case-insensitive; unknown columns are reported as a warning and ignored. Rows are
 * numbered by the file's own lines (the header on line 1 when nothing comes before it).
 */
import { isBlankRecord, readCsvRecords, toCsv } from "~/lib/csv";
import { modelCells, readTargetCells, type StarPositionResolver } from "./cells";
import { MAG_COLUMN, magColumn, type RowError, type StoredTarget, TARGET_COLUMNS, type TargetValues } from "./schemas";

export type ImportedTarget = TargetValues & { row: number };
export type { RowError };
export type TargetCsvResult = {
  targets: ImportedTarget[];
  errors: RowError[];
  warnings: string[];
  /** Rows identical to a target already in the list: nothing to write for them. */
  unchanged: number;
};

/** Largest CSV accepted, bytes, and most rows. */
export const MAX_TARGET_CSV_BYTES = 512 * 1024;
export const MAX_TARGET_ROWS = 500;

const near = (a: number, b: number) => Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b));
/** Decimals of the exported coordinates: 1e-7° is 0.36 mas, far below any pointing or delay need. */
const COORDINATE_DECIMALS = 7;
/** Coordinates as the export writes them, rounded (84.05333333333334 → 84.0533333). */
const coordinate = (deg: number) => Number(deg.toFixed(COORDINATE_DECIMALS));
/** Two positions are the same when they agree to the export's rounding. */
const samePlace = (a: number, b: number) => Math.abs(a - b) <= 10 ** -COORDINATE_DECIMALS;

/** Whether a row read from a file says exactly what the stored target says. */
export function sameTarget(a: TargetValues, b: StoredTarget): boolean {
  const ma = Object.entries(a.magnitudes).sort();
  const mb = Object.entries(b.magnitudes ?? {}).sort();
  return (
    samePlace(a.raDeg, b.raDeg) &&
    samePlace(a.decDeg, b.decDeg) &&
    JSON.stringify(a.model) === JSON.stringify(b.model) &&
    ma.length === mb.length &&
    ma.every(([band, m], i) => mb[i][0] === band && near(m, mb[i][1])) &&
    (a.notes ?? "") === (b.notes ?? "")
  );
}

/** One problem per line, the first found, in the order of the file. */
function firstPerLine(errors: RowError[]): RowError[] {
  const byLine = new Map<number, RowError>();
  for (const e of errors) if (!byLine.has(e.row)) byLine.set(e.row, e);
  return [...byLine.values()].sort((a, b) => a.row - b.row);
}

/**
 * Parses and checks a CSV target list. Rows and problems carry the file's own line numbers
 * (`readCsvRecords`), one problem per line, in order, naming columns as the file's header writes them.
 * `existing` are the person's stored targets by lower-case name: a row identical to one is counted as
 * unchanged and skipped; a different row of the same name is reported unless `replaceExisting` is set.
 */
export function parseTargetCsv(
  text: string,
  options: { existing?: Map<string, StoredTarget>; replaceExisting?: boolean; resolveName?: StarPositionResolver } = {},
): TargetCsvResult {
  const errors: RowError[] = [];
  const warnings: string[] = [];
  const refuse = (row: number, column: string, message: string): TargetCsvResult => ({
    targets: [],
    errors: [{ row, column, message }],
    warnings,
    unchanged: 0,
  });
  if (text.trim() === "") return refuse(1, "file", "the file is empty");
  if (new TextEncoder().encode(text).length > MAX_TARGET_CSV_BYTES)
    return refuse(1, "file", `the file is larger than ${MAX_TARGET_CSV_BYTES / 1024} KB`);
  const read = readCsvRecords(text);
  const filled = read.records.filter((r) => !isBlankRecord(r));
  const headerRecord = filled[0];
  if (!headerRecord) return refuse(1, "file", "the file is empty");
  const written = headerRecord.cells.map((h) => h.trim());
  const header = written.map((h) => h.toLowerCase());
  /** A column as the file's header writes it ("mag_H", not "mag_h"). */
  const asWritten = (column: string) => written[header.indexOf(column)] ?? column;
  // With the star catalogue, a list may give names alone (no ra and dec columns at all).
  const byNameOnly = options.resolveName && !header.includes("ra") && !header.includes("dec");
  const missing = (byNameOnly ? ["name"] : ["name", "ra", "dec"]).filter((c) => !header.includes(c));
  if (missing.length) {
    const message = `missing column${missing.length > 1 ? "s" : ""} ${missing.join(", ")} (the header needs name, ra, dec)`;
    return refuse(headerRecord.line, missing.join(", "), message);
  }
  const known = new Set<string>(TARGET_COLUMNS);
  const unknown = written.filter((_, i) => !known.has(header[i]) && !MAG_COLUMN.test(header[i]));
  if (unknown.length) warnings.push(`ignored column${unknown.length > 1 ? "s" : ""}: ${unknown.join(", ")}`);
  for (const e of read.errors) errors.push({ row: e.line, column: "line", message: e.message });
  const rows = filled.slice(1);
  if (rows.length > MAX_TARGET_ROWS) return refuse(1, "file", `more than ${MAX_TARGET_ROWS} targets; split the list`);
  const targets: ImportedTarget[] = [];
  const seen = new Map<string, number>();
  const magColumns = header.filter((h) => MAG_COLUMN.test(h));
  let unchanged = 0;
  for (const record of rows) {
    const row = record.line;
    if (record.cells.length > header.length && record.cells.slice(header.length).some((c) => c.trim() !== "")) {
      const message = `${record.cells.length} values, but the header names ${header.length} columns`;
      errors.push({ row, column: "line", message });
      continue;
    }
    const cells = Object.fromEntries(header.map((h, i) => [h, (record.cells[i] ?? "").trim()]));
    const checked = readTargetCells(cells, magColumns, row, options.resolveName);
    errors.push(...checked.errors.map((e) => ({ ...e, column: asWritten(e.column) })));
    if (checked.resolved) warnings.push(`line ${row}: coordinates of ${checked.resolved.star} from the star catalogue`);
    const name = (cells.name ?? "").trim();
    const key = name.toLowerCase();
    let clash = false;
    if (name) {
      if (seen.has(key)) {
        errors.push({
          row,
          column: asWritten("name"),
          message: `"${name}" appears twice (also line ${seen.get(key)})`,
        });
        clash = true;
      } else seen.set(key, row);
      const stored = options.existing?.get(key);
      if (!clash && stored && checked.target && sameTarget(checked.target, stored)) {
        unchanged++;
        continue;
      }
      if (stored && !options.replaceExisting) {
        errors.push({
          row,
          column: asWritten("name"),
          message: `"${name}" is already in My targets with other values (tick "replace" to update it)`,
        });
        clash = true;
      }
    }
    if (checked.target && !clash) targets.push({ row, ...checked.target });
  }
  if (rows.length === 0 && errors.length === 0)
    errors.push({ row: headerRecord.line + 1, column: "file", message: "the file has a header but no targets" });
  return { targets, errors: firstPerLine(errors), warnings, unchanged };
}

/** The CSV of a target list, in the same columns `parseTargetCsv` reads. */
export function targetsToCsv(list: StoredTarget[]): string {
  const bands = [...new Set(list.flatMap((t) => Object.keys(t.magnitudes)))].sort();
  const fields = [...TARGET_COLUMNS.slice(0, 9), ...bands.map(magColumn), "notes"];
  return toCsv(
    fields,
    list.map((t) => {
      const m = modelCells(t.model);
      return [
        t.name,
        coordinate(t.raDeg),
        coordinate(t.decDeg),
        t.model.type,
        m.size_mas,
        m.ld_coefficient,
        m.separation_mas,
        m.position_angle_deg,
        m.flux_ratio,
        ...bands.map((b) => t.magnitudes[b]),
        t.notes,
      ];
    }),
  );
}
