/**
 * The fields of a target, written once for the form, the CSV import and the CSV export: their names
 * (the CSV column names), their labels in messages, and the valibot rules of the plain fields. The
 * model's parameters are checked by the engine's `TargetModelSchema`; coordinates by lib/coordinates.
 */
import * as v from "valibot";
import type { targets } from "~/db/schema/proposals";
import type { TargetModel } from "~/engine";

/** Form field names and CSV columns, in the order the export writes them (magnitudes before notes). */
export const TARGET_COLUMNS = [
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
export type TargetColumn = (typeof TARGET_COLUMNS)[number];

/** The columns that carry a model's parameters. */
export type ModelColumn = "size_mas" | "ld_coefficient" | "separation_mas" | "position_angle_deg" | "flux_ratio";

/** The magnitude column of a band: "H" → "mag_H". */
export const magColumn = (band: string) => `mag_${band}`;
export const MAG_COLUMN = /^mag_[a-z0-9]+$/i;

const LABELS: Record<TargetColumn, string> = {
  name: "Name",
  ra: "Right ascension",
  dec: "Declination",
  model: "Model",
  size_mas: "Size",
  ld_coefficient: "Limb-darkening coefficient",
  separation_mas: "Separation",
  position_angle_deg: "Position angle",
  flux_ratio: "Flux ratio",
  notes: "Notes",
};

/** The field's name as messages start with it: "Right ascension", "H magnitude". */
export function columnLabel(column: string): string {
  if (column in LABELS) return LABELS[column as TargetColumn];
  return column.startsWith("mag_") ? `${column.slice(4)} magnitude` : column;
}

export const TargetName = v.pipe(
  v.string(),
  v.trim(),
  v.nonEmpty("a name is required"),
  v.maxLength(80, "at most 80 characters"),
);
export const TargetNotes = v.pipe(v.string(), v.trim(), v.maxLength(1000, "at most 1 000 characters"));
export const Magnitude = v.pipe(
  v.number(),
  v.minValue(-30, "a magnitude between -30 and 30"),
  v.maxValue(30, "a magnitude between -30 and 30"),
);

/** One target as it is written to My targets (a checked form or CSV row). */
export type TargetValues = {
  name: string;
  raDeg: number;
  decDeg: number;
  model: TargetModel;
  magnitudes: Record<string, number>;
  notes: string;
};

/** A stored target (of My targets or of a proposal), as far as the form and the CSV show it. */
export type StoredTarget = Pick<
  typeof targets.$inferSelect,
  "name" | "raDeg" | "decDeg" | "model" | "magnitudes" | "notes"
>;

/** A problem with one cell: `row` is the line of the file (`readCsvRecords`); 0 for a form. */
export type RowError = { row: number; column: string; message: string };
