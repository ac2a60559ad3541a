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
 * Column names are case-insensitive; unknown columns are reported as a warning and ignored. Row numbers
 * in messages count as a spreadsheet does: the header is row 1.
 */
import Papa from "papaparse";
import { toCsv } from "~/lib/csv";
import { modelCells, readTargetCells, type StarPositionResolver } from "./cells";
import { MAG_COLUMN, magColumn, type RowError, type StoredTarget, TARGET_COLUMNS, type TargetValues } from "./schemas";

export type ImportedTarget = TargetValues & { row: number };
export type { RowError };
export type TargetCsvResult = { targets: ImportedTarget[]; errors: RowError[]; warnings: string[] };

/** Largest CSV accepted, bytes, and most rows. */
export const MAX_TARGET_CSV_BYTES = 512 * 1024;
export const MAX_TARGET_ROWS = 500;

/**
 * Parses and checks a CSV target list. `existingNames` (lower case) are names already in the
 * person's list: reported per row unless `replaceExisting` is set.
 */
export function parseTargetCsv(
  text: string,
  options: { existingNames?: Set<string>; replaceExisting?: boolean; resolveName?: StarPositionResolver } = {},
): TargetCsvResult {
  const errors: RowError[] = [];
  const warnings: string[] = [];
  if (text.trim() === "")
    return { targets: [], errors: [{ row: 1, column: "file", message: "the file is empty" }], warnings };
  if (new TextEncoder().encode(text).length > MAX_TARGET_CSV_BYTES) {
    return {
      targets: [],
      errors: [{ row: 1, column: "file", message: `the file is larger than ${MAX_TARGET_CSV_BYTES / 1024} KB` }],
      warnings,
    };
  }
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ""), {
    header: true,
    skipEmptyLines: "greedy",
    transformHeader: (h) => h.trim().toLowerCase(),
  });
  const header = parsed.meta.fields ?? [];
  // With the star catalogue, a list may give names alone (no ra and dec columns at all).
  const byNameOnly = options.resolveName && !header.includes("ra") && !header.includes("dec");
  const missing = (byNameOnly ? ["name"] : ["name", "ra", "dec"]).filter((c) => !header.includes(c));
  if (missing.length) {
    return {
      targets: [],
      errors: [
        {
          row: 1,
          column: missing.join(", "),
          message: `missing column${missing.length > 1 ? "s" : ""} ${missing.join(", ")} (the header needs name, ra, dec)`,
        },
      ],
      warnings,
    };
  }
  const known = new Set<string>(TARGET_COLUMNS);
  const unknown = header.filter((h) => !known.has(h) && !MAG_COLUMN.test(h));
  if (unknown.length) warnings.push(`ignored column${unknown.length > 1 ? "s" : ""}: ${unknown.join(", ")}`);
  for (const e of parsed.errors) {
    if (e.type === "FieldMismatch" && e.code === "TooFewFields") continue; // short rows: missing cells are reported below
    errors.push({ row: (e.row ?? 0) + 2, column: "line", message: e.message });
  }
  if (parsed.data.length > MAX_TARGET_ROWS) {
    return {
      targets: [],
      errors: [{ row: 1, column: "file", message: `more than ${MAX_TARGET_ROWS} targets; split the list` }],
      warnings,
    };
  }
  const targets: ImportedTarget[] = [];
  const seen = new Map<string, number>();
  const magColumns = header.filter((h) => MAG_COLUMN.test(h));
  parsed.data.forEach((cells, i) => {
    const row = i + 2;
    const read = readTargetCells(cells, magColumns, row, options.resolveName);
    errors.push(...read.errors);
    if (read.resolved) warnings.push(`row ${row}: coordinates of ${read.resolved.star} from the star catalogue`);
    const name = (cells.name ?? "").trim();
    const key = name.toLowerCase();
    let clash = false;
    if (name) {
      if (seen.has(key)) {
        errors.push({ row, column: "name", message: `"${name}" appears twice (also row ${seen.get(key)})` });
        clash = true;
      } else seen.set(key, row);
      if (options.existingNames?.has(key) && !options.replaceExisting) {
        errors.push({
          row,
          column: "name",
          message: `"${name}" is already in My targets (tick "replace" to update it)`,
        });
        clash = true;
      }
    }
    if (read.target && !clash) targets.push({ row, ...read.target });
  });
  if (parsed.data.length === 0 && errors.length === 0)
    errors.push({ row: 2, column: "file", message: "the file has a header but no targets" });
  return { targets, errors, warnings };
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
        t.raDeg,
        t.decDeg,
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
