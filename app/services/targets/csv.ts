/**
 * Reading a target list from CSV (pure: no I/O). One target per row; the header names the columns:
 *
 *   name, ra, dec                 required. RA in hours (05:36:12.8) or degrees (84.05); Dec in degrees.
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
import * as v from "valibot";
import { type TargetModel, TargetModelSchema } from "~/engine";
import { parseDeclination, parseRightAscension } from "~/lib/coordinates";

export type ImportedTarget = {
  row: number;
  name: string;
  raDeg: number;
  decDeg: number;
  model: TargetModel;
  magnitudes: Record<string, number>;
  notes: string;
};
export type RowError = { row: number; column: string; message: string };
export type TargetCsvResult = { targets: ImportedTarget[]; errors: RowError[]; warnings: string[] };

export const TARGET_CSV_COLUMNS = [
  "name",
  "ra",
  "dec",
  "model",
  "size_mas",
  "ld_coefficient",
  "separation_mas",
  "position_angle_deg",
  "flux_ratio",
  "notes",
] as const;
/** Largest CSV accepted, bytes, and most rows. */
export const MAX_TARGET_CSV_BYTES = 512 * 1024;
export const MAX_TARGET_ROWS = 500;

const MODEL_NAMES: Record<string, TargetModel["type"]> = {
  point: "point",
  uniformdisk: "uniformDisk",
  "uniform disk": "uniformDisk",
  gaussian: "gaussian",
  limbdarkeneddisk: "limbDarkenedDisk",
  "limb-darkened disk": "limbDarkenedDisk",
  ring: "ring",
  binary: "binary",
};

function numberCell(raw: string | undefined, column: string, row: number, errors: RowError[]): number | undefined {
  const text = (raw ?? "").trim();
  if (text === "") return undefined;
  const x = Number(text.replace(/\u2212/g, "-"));
  if (!Number.isFinite(x)) {
    errors.push({ row, column, message: `"${text}" is not a number` });
    return undefined;
  }
  return x;
}

/** Builds the model of one row from its cells, or reports what is missing. */
function modelOf(cells: Record<string, string>, row: number, errors: RowError[]): TargetModel | null {
  const typeText = (cells.model ?? "").trim();
  const type = typeText === "" ? "point" : MODEL_NAMES[typeText.toLowerCase()];
  if (!type) {
    errors.push({
      row,
      column: "model",
      message: `"${typeText}" is not a model; use point, uniformDisk, gaussian, limbDarkenedDisk, ring or binary`,
    });
    return null;
  }
  const before = errors.length;
  const size = numberCell(cells.size_mas, "size_mas", row, errors);
  const ld = numberCell(cells.ld_coefficient, "ld_coefficient", row, errors);
  const sep = numberCell(cells.separation_mas, "separation_mas", row, errors);
  const pa = numberCell(cells.position_angle_deg, "position_angle_deg", row, errors);
  const ratio = numberCell(cells.flux_ratio, "flux_ratio", row, errors);
  if (errors.length > before) return null;
  const need = (value: number | undefined, column: string) => {
    if (value === undefined) errors.push({ row, column, message: `needed for a ${type} model` });
    return value ?? NaN;
  };
  let candidate: unknown;
  switch (type) {
    case "point":
      candidate = { type };
      break;
    case "uniformDisk":
    case "ring":
      candidate = { type, diameterMas: need(size, "size_mas") };
      break;
    case "gaussian":
      candidate = { type, fwhmMas: need(size, "size_mas") };
      break;
    case "limbDarkenedDisk":
      candidate = { type, diameterMas: need(size, "size_mas"), coefficient: need(ld, "ld_coefficient") };
      break;
    case "binary":
      candidate = {
        type,
        separationMas: need(sep, "separation_mas"),
        positionAngleDeg: need(pa, "position_angle_deg"),
        fluxRatio: need(ratio, "flux_ratio"),
      };
      break;
  }
  if (errors.length > before) return null;
  const parsed = v.safeParse(TargetModelSchema, candidate);
  if (!parsed.success) {
    const issue = parsed.issues[0];
    const key = String(issue.path?.[issue.path.length - 1]?.key ?? "model");
    const column =
      {
        diameterMas: "size_mas",
        fwhmMas: "size_mas",
        coefficient: "ld_coefficient",
        separationMas: "separation_mas",
        positionAngleDeg: "position_angle_deg",
        fluxRatio: "flux_ratio",
      }[key] ?? "model";
    errors.push({ row, column, message: issue.message });
    return null;
  }
  return parsed.output;
}

/**
 * Reads one target from named cells (a CSV row or a form): name, ra, dec, the model columns, the
 * `mag_<band>` columns listed in `magColumns`, notes. Errors carry `row` (0 for a form).
 */
export function readTargetCells(
  cells: Record<string, string | undefined>,
  magColumns: string[],
  row = 0,
): { target: Omit<ImportedTarget, "row"> | null; errors: RowError[] } {
  const errors: RowError[] = [];
  const name = (cells.name ?? "").trim();
  if (!name) errors.push({ row, column: "name", message: "a name is required" });
  else if (name.length > 80) errors.push({ row, column: "name", message: "at most 80 characters" });
  const ra = parseRightAscension(cells.ra ?? "");
  if (!ra.ok) errors.push({ row, column: "ra", message: ra.message });
  const dec = parseDeclination(cells.dec ?? "");
  if (!dec.ok) errors.push({ row, column: "dec", message: dec.message });
  const model = modelOf(cells as Record<string, string>, row, errors);
  const magnitudes: Record<string, number> = {};
  for (const column of magColumns) {
    const value = numberCell(cells[column], column, row, errors);
    if (value === undefined) continue;
    if (value < -30 || value > 30) errors.push({ row, column, message: "a magnitude between -30 and 30" });
    else magnitudes[column.slice(4).toUpperCase()] = value;
  }
  const notes = (cells.notes ?? "").trim().slice(0, 1000);
  if (errors.length || !ra.ok || !dec.ok || !model) return { target: null, errors };
  return { target: { name, raDeg: ra.deg, decDeg: dec.deg, model, magnitudes, notes }, errors };
}

/**
 * Parses and checks a CSV target list. `existingNames` (lower case) are names already in the
 * person's list: reported per row unless `replaceExisting` is set.
 */
export function parseTargetCsv(
  text: string,
  options: { existingNames?: Set<string>; replaceExisting?: boolean } = {},
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
  const missing = ["name", "ra", "dec"].filter((c) => !header.includes(c));
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
  const known = new Set<string>(TARGET_CSV_COLUMNS);
  const unknown = header.filter((h) => !known.has(h) && !/^mag_[a-z0-9]+$/i.test(h));
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
  const magColumns = header.filter((h) => /^mag_[a-z0-9]+$/i.test(h));
  parsed.data.forEach((cells, i) => {
    const row = i + 2;
    const read = readTargetCells(cells, magColumns, row);
    errors.push(...read.errors);
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
export function targetsToCsv(
  list: {
    name: string;
    raDeg: number;
    decDeg: number;
    model: { type: string; [k: string]: unknown };
    magnitudes: Record<string, number>;
    notes: string;
  }[],
): string {
  const bands = [...new Set(list.flatMap((t) => Object.keys(t.magnitudes)))].sort();
  const fields = [...TARGET_CSV_COLUMNS.slice(0, 9), ...bands.map((b) => `mag_${b}`), "notes"];
  const data = list.map((t) => {
    const m = t.model;
    const size = m.diameterMas ?? m.fwhmMas ?? "";
    return [
      t.name,
      t.raDeg,
      t.decDeg,
      t.model.type,
      size,
      m.coefficient ?? "",
      m.separationMas ?? "",
      m.positionAngleDeg ?? "",
      m.fluxRatio ?? "",
      ...bands.map((b) => t.magnitudes[b] ?? ""),
      t.notes,
    ];
  });
  return Papa.unparse({ fields, data });
}
