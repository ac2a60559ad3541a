/**
 * CSV writing (RFC 4180 through papaparse), one copy for every export: a header row of field names
 * (units in the names, "raDeg", "Hours (h)") and one row per record.
 */
import Papa from "papaparse";

export type CsvCell = string | number | boolean | null | undefined;

/** Header and rows as CSV text; null and undefined cells are written empty. */
export function toCsv(fields: readonly string[], rows: readonly (readonly CsvCell[])[]): string {
  return Papa.unparse({
    fields: [...fields],
    data: rows.map((r) => r.map((c) => (c === null || c === undefined ? "" : c))),
  });
}

/**
 * `toCsv` for a file a spreadsheet opens: a text cell that starts like a formula (=, +, -, @, tab)
 * gets a leading apostrophe, so it is shown and never run; lines end in "\n".
 */
export function toSpreadsheetCsv(fields: readonly string[], rows: readonly (readonly CsvCell[])[]): string {
  return Papa.unparse({ fields: [...fields], data: rows.map((r) => [...r]) }, { escapeFormulae: true, newline: "\n" });
}
