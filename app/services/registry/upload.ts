/**
 * Reading an import file: its limits, the bytes as text (or why not), CSV or JSON told apart, and
 * the one shape of a problem found in it (section, row, column, message).
 *
 * - A file is UTF-8 text (a byte-order mark is fine) of at most 1 MB; empty, binary and UTF-16
 *   files are refused with a message saying so.
 * - Rows are counted from 1 at the first row under the header (JSON: the first item of the list).
 */
import type * as v from "valibot";
import { fieldErrors } from "~/lib/form-errors";

/** Largest file an import accepts, bytes. */
export const MAX_IMPORT_BYTES = 1_000_000;
/** The limit as the page says it: "1 MB". */
export const MAX_IMPORT_TEXT = `${MAX_IMPORT_BYTES / 1_000_000} MB`;
/** Most stations one import may carry. */
export const MAX_IMPORT_STATIONS = 2000;
/** Most configurations or instruments a whole-registry import may carry. */
export const MAX_IMPORT_ITEMS = 500;

export type ImportSection = "site" | "stations" | "configurations" | "instruments";

/** One problem with an import: where (section, row counted from 1, column or field) and what. */
export type ImportIssue = { section: ImportSection | null; row: number | null; column: string | null; message: string };

/** A problem with the whole file (no section, row or column). */
export const fileIssue = (message: string): ImportIssue => ({ section: null, row: null, column: null, message });

/** "row 4, eastM: must be a number" (with the section first in a whole-registry file). */
export function issueText(issue: ImportIssue): string {
  const where = [
    issue.section && issue.row !== null ? `${issue.section} row ${issue.row}` : issue.section,
    issue.section ? null : issue.row !== null ? `row ${issue.row}` : null,
    issue.column,
  ].filter(Boolean);
  return where.length > 0 ? `${where.join(", ")}: ${issue.message}` : issue.message;
}

/**
 * The issues of a failed parse of one row, one per field (`prefix.field` under a prefix such as
 * "bands[2]"); an issue of the whole row has no column.
 */
export function rowIssues(
  issues: readonly v.BaseIssue<unknown>[],
  where: { section: ImportSection | null; row: number | null; prefix?: string },
): ImportIssue[] {
  return Object.entries(fieldErrors(issues)).map(([field, message]) => ({
    section: where.section,
    row: where.row,
    column: field === "form" ? (where.prefix ?? null) : where.prefix ? `${where.prefix}.${field}` : field,
    message,
  }));
}

/** Flags the second and later items that repeat a name, saying on which row it came first. */
export function repeatedNames<T extends { row: number; name: string }>(
  items: T[],
  section: ImportSection | null,
  message: (name: string, firstRow: number) => string,
): ImportIssue[] {
  const firstRow = new Map<string, number>();
  const out: ImportIssue[] = [];
  for (const item of items) {
    const first = firstRow.get(item.name);
    if (first !== undefined) out.push({ section, row: item.row, column: "name", message: message(item.name, first) });
    else firstRow.set(item.name, item.row);
  }
  return out;
}

export type DecodedUpload = { ok: true; text: string } | { ok: false; error: string };

const megabytes = (n: number) => `${(n / 1_000_000).toFixed(n < 10_000_000 ? 1 : 0)} MB`;

/** Why the first bytes of a file show it is not text to import; null when they do not. */
function notText(bytes: Uint8Array): string | null {
  if ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff))
    return "The file is in UTF-16; save it as UTF-8 (in a spreadsheet: “CSV UTF-8”) and try again.";
  if (bytes[0] === 0x50 && bytes[1] === 0x4b && bytes[2] === 0x03 && bytes[3] === 0x04)
    return "This is a spreadsheet workbook or another zipped file; save the sheet as CSV (UTF-8) and import that.";
  if (bytes.includes(0)) return "This is not a text file; import a CSV or JSON file.";
  return null;
}

/** Bytes of an uploaded file as text, or why not: too large, empty, binary, UTF-16, not UTF-8. */
export function decodeUpload(bytes: Uint8Array, limit = MAX_IMPORT_BYTES): DecodedUpload {
  if (bytes.length > limit)
    return { ok: false, error: `The file is ${megabytes(bytes.length)}; the limit is ${megabytes(limit)}.` };
  if (bytes.length === 0) return { ok: false, error: "The file is empty." };
  const refused = notText(bytes);
  if (refused) return { ok: false, error: refused };
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

/** JSON text (a byte-order mark is fine) as a value, or why it is not JSON. */
export function parseJson(text: string): { ok: true; value: unknown } | { ok: false; error: string } {
  try {
    return { ok: true, value: JSON.parse(text.replace(/^\uFEFF/, "")) };
  } catch (e) {
    return { ok: false, error: `The file is not valid JSON (${String((e as Error).message).slice(0, 160)}).` };
  }
}
