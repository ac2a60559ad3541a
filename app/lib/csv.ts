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

/** One record of a CSV file: its cells as written, and the line of the file it starts on (1 = first). */
export interface CsvRecord {
  line: number;
  cells: string[];
}

/** A problem of the CSV syntax (an unclosed quote), at the line its record starts on. */
export interface CsvSyntaxError {
  line: number;
  message: string;
}

/**
 * CSV reading (papaparse), one numbering for every import: each record with the file's own line
 * number, the one an editor shows — blank lines and quoted line breaks counted, so "line 12" is
 * line 12 of the file whatever came before it. Empty records (blank lines) are kept; callers skip them.
 */
export function readCsvRecords(
  text: string,
  options: { delimitersToGuess?: string[] } = {},
): { records: CsvRecord[]; errors: CsvSyntaxError[] } {
  const body = text.replace(/^\uFEFF/, "");
  const lineStarts = [0];
  for (let i = 0; i < body.length; i++) if (body[i] === "\n") lineStarts.push(i + 1);
  const lineAt = (offset: number) => {
    let lo = 0;
    let hi = lineStarts.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (lineStarts[mid] <= offset) lo = mid;
      else hi = mid - 1;
    }
    return lo + 1;
  };
  const records: CsvRecord[] = [];
  const errors: CsvSyntaxError[] = [];
  let start = 0;
  Papa.parse<string[]>(body, {
    header: false,
    skipEmptyLines: false,
    delimitersToGuess: options.delimitersToGuess,
    step: (r) => {
      const line = lineAt(start);
      if (start < body.length) records.push({ line, cells: r.data });
      for (const e of r.errors) {
        if (e.code === "MissingQuotes") errors.push({ line, message: "a quoted value is never closed" });
        else if (e.type !== "Delimiter") errors.push({ line, message: e.message });
      }
      start = r.meta.cursor;
    },
  });
  return { records, errors };
}

/** True for a record with nothing in it (a blank line, or only separators and spaces). */
export const isBlankRecord = (r: CsvRecord) => r.cells.every((c) => c.trim() === "");
