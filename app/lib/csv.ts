/**
 * CSV writing (RFC 4180 through papaparse), one copy for every export: a header row of field names
 * (units in the names, "raDeg", "Hours (h)") and one row per record.
 *
 * Spreadsheets run a cell that starts with `=`, `+`, `-`, `@`, a tab or a carriage return as a
 * formula, so a target named `=HYPERLINK(…)` could act when a colleague opens the export. Following
 * the OWASP advice on CSV injection, such TEXT cells are written with a leading apostrophe (and
 * quoted), which spreadsheets show as plain text. Numbers are written as numbers: −31.4 stays
 * `-31.4`, so exported coordinates and magnitudes keep their sign and can be read back.
 */
import Papa from "papaparse";

export type CsvCell = string | number | boolean | null | undefined;

/** The first characters that make a spreadsheet read a text cell as a formula. */
export const FORMULA_START = /^[=+\-@\t\r]/;

/** A text cell as it is safe to write: with a leading apostrophe when it would start a formula. */
export function neutralizeCell(text: string): string {
  return FORMULA_START.test(text) ? `'${text}` : text;
}

/** Header and rows as CSV text; null and undefined cells are written empty, formula-like text neutralized. */
export function toCsv(fields: readonly string[], rows: readonly (readonly CsvCell[])[]): string {
  return Papa.unparse(
    { fields: [...fields], data: rows.map((r) => r.map((c) => (c === null || c === undefined ? "" : c))) },
    // papaparse prefixes the apostrophe to text cells only (numbers and booleans are left alone) and quotes them.
    { escapeFormulae: FORMULA_START },
  );
}

/**
 * `toCsv` for a file a spreadsheet opens: a text cell that starts like a formula (=, +, -, @, tab)
 * gets a leading apostrophe, so it is shown and never run; lines end in "\n".
 */
export function toSpreadsheetCsv(fields: readonly string[], rows: readonly (readonly CsvCell[])[]): string {
  return Papa.unparse({ fields: [...fields], data: rows.map((r) => [...r]) }, { escapeFormulae: true, newline: "\n" });
}
