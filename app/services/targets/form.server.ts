/** Shared by the target pages: reading the target form and showing a stored target in it. */
import type { targets } from "~/db/schema/proposals";
import { formatDeclination, formatRightAscension } from "~/lib/coordinates";
import { type ImportedTarget, readTargetCells } from "~/services/targets/csv";

export const TARGET_FIELDS = [
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
];

export function targetFormValues(form: FormData, bands: string[]): Record<string, string> {
  const out: Record<string, string> = {};
  for (const k of [...TARGET_FIELDS, ...bands.map((b) => `mag_${b}`)]) {
    const x = form.get(k);
    out[k] = typeof x === "string" ? x : "";
  }
  return out;
}

/** Checks a submitted target form: the target, or messages keyed by field. */
export function readTargetForm(values: Record<string, string>, bands: string[]) {
  const read = readTargetCells(
    values,
    bands.map((b) => `mag_${b}`),
  );
  const errors: Record<string, string> = {};
  for (const e of read.errors) {
    if (!errors[e.column])
      errors[e.column] = e.message.startsWith(fieldLabel(e.column))
        ? e.message
        : `${fieldLabel(e.column)}: ${e.message}`;
  }
  return { target: read.target as Omit<ImportedTarget, "row"> | null, errors };
}

function fieldLabel(column: string) {
  const labels: Record<string, string> = {
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
  return labels[column] ?? (column.startsWith("mag_") ? `${column.slice(4)} magnitude` : column);
}

/** A stored target (of My targets or of a proposal) as form values, coordinates in sexagesimal. */
export function valuesOfTarget(
  t: Pick<typeof targets.$inferSelect, "name" | "raDeg" | "decDeg" | "model" | "magnitudes" | "notes">,
): Record<string, string> {
  const m = t.model as Record<string, unknown>;
  const str = (x: unknown) => (x === undefined || x === null ? "" : String(x));
  const out: Record<string, string> = {
    name: t.name,
    ra: formatRightAscension(t.raDeg, 3),
    dec: formatDeclination(t.decDeg, 2),
    model: t.model.type,
    size_mas: str(m.diameterMas ?? m.fwhmMas),
    ld_coefficient: str(m.coefficient),
    separation_mas: str(m.separationMas),
    position_angle_deg: str(m.positionAngleDeg),
    flux_ratio: str(m.fluxRatio),
    notes: t.notes,
  };
  for (const [band, mag] of Object.entries(t.magnitudes)) out[`mag_${band}`] = String(mag);
  return out;
}
