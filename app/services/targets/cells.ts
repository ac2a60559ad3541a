/**
 * One target from named cells, the one reader for a CSV row and for the target form (pure: no I/O),
 * and its inverse for the model's parameters.
 */
import * as v from "valibot";
import { type TargetModel, TargetModelSchema } from "~/engine";
import { parseDeclination, parseRightAscension } from "~/lib/coordinates";
import { parseNumber } from "~/lib/numbers";
import {
  Magnitude,
  type ModelColumn,
  type RowError,
  type StoredTarget,
  TargetName,
  TargetNotes,
  type TargetValues,
} from "./schemas";

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

/** The CSV column of each model parameter. */
const PARAMETER_COLUMN: Record<string, ModelColumn> = {
  diameterMas: "size_mas",
  fwhmMas: "size_mas",
  coefficient: "ld_coefficient",
  separationMas: "separation_mas",
  positionAngleDeg: "position_angle_deg",
  fluxRatio: "flux_ratio",
};

/** The output of `schema` for `value`, or undefined with its first message added to `errors`. */
function checked<T>(
  schema: v.GenericSchema<unknown, T>,
  value: unknown,
  at: { row: number; column: string },
  errors: RowError[],
): T | undefined {
  const result = v.safeParse(schema, value);
  if (result.success) return result.output;
  errors.push({ ...at, message: result.issues[0].message });
  return undefined;
}

function numberCell(raw: string | undefined, column: string, row: number, errors: RowError[]): number | undefined {
  const text = (raw ?? "").trim();
  if (text === "") return undefined;
  // Strictly: "0x10" or "1e3" is refused, never read as 16 or 1000.
  const read = parseNumber(text);
  if (!read.ok) {
    errors.push({ row, column, message: `"${text}" is not a number (write it plainly, such as 12.5)` });
    return undefined;
  }
  return read.value;
}

/** Builds the model of one row from its cells, or reports what is missing. */
function modelOf(cells: Record<string, string | undefined>, row: number, errors: RowError[]): TargetModel | null {
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
    errors.push({ row, column: PARAMETER_COLUMN[key] ?? "model", message: issue.message });
    return null;
  }
  return parsed.output;
}

/**
 * A star's J2000 position from its name (the star catalogue), for a target given by name alone: the
 * position and the designation it was found under, or why the name names no star.
 */
export type StarPositionResolver = (
  name: string,
) => { ok: true; raDeg: number; decDeg: number; star: string } | { ok: false; message: string };

/** Where a target's coordinates came from when it was given by name alone. */
export type ResolvedFrom = { star: string };

/**
 * Reads one target from named cells (a CSV row or a form): name, ra, dec, the model columns, the
 * `mag_<band>` columns listed in `magColumns`, notes. Errors carry `row` (0 for a form). With
 * `resolveName`, a target whose ra and dec are both empty takes the position of the catalogue star
 * its name names (`resolved` says which); a name that names none is an error on `name`.
 */
export function readTargetCells(
  cells: Record<string, string | undefined>,
  magColumns: string[],
  row = 0,
  resolveName?: StarPositionResolver,
): { target: TargetValues | null; errors: RowError[]; resolved?: ResolvedFrom } {
  const errors: RowError[] = [];
  const name = checked(TargetName, cells.name ?? "", { row, column: "name" }, errors);
  let ra = parseRightAscension(cells.ra ?? "");
  let dec = parseDeclination(cells.dec ?? "");
  let resolved: ResolvedFrom | undefined;
  const noPosition = (cells.ra ?? "").trim() === "" && (cells.dec ?? "").trim() === "";
  if (noPosition && resolveName && name !== undefined) {
    const star = resolveName(name);
    if (star.ok) {
      ra = { ok: true, deg: star.raDeg };
      dec = { ok: true, deg: star.decDeg };
      resolved = { star: star.star };
    } else {
      errors.push({ row, column: "name", message: `no coordinates given, and ${star.message} to take them from` });
    }
  } else {
    if (!ra.ok) errors.push({ row, column: "ra", message: ra.message });
    if (!dec.ok) errors.push({ row, column: "dec", message: dec.message });
  }
  const model = modelOf(cells, row, errors);
  const magnitudes: Record<string, number> = {};
  for (const column of magColumns) {
    const value = numberCell(cells[column], column, row, errors);
    if (value === undefined) continue;
    const magnitude = checked(Magnitude, value, { row, column }, errors);
    if (magnitude !== undefined) magnitudes[column.slice(4).toUpperCase()] = magnitude;
  }
  const notes = checked(TargetNotes, cells.notes ?? "", { row, column: "notes" }, errors);
  if (errors.length || name === undefined || notes === undefined || !ra.ok || !dec.ok || !model) {
    return { target: null, errors };
  }
  return { target: { name, raDeg: ra.deg, decDeg: dec.deg, model, magnitudes, notes }, errors, resolved };
}

/** A stored model's parameters as the cells `readTargetCells` reads back; "" where the model has none. */
export function modelCells(model: StoredTarget["model"]): Record<ModelColumn, string> {
  const cell = (x: unknown) => (x === undefined || x === null ? "" : String(x));
  return {
    size_mas: cell(model.diameterMas ?? model.fwhmMas),
    ld_coefficient: cell(model.coefficient),
    separation_mas: cell(model.separationMas),
    position_angle_deg: cell(model.positionAngleDeg),
    flux_ratio: cell(model.fluxRatio),
  };
}
