/** Shared by the target pages (My targets and a proposal's targets): the target form in and out. */
import { formatDeclination, formatRightAscension } from "~/lib/coordinates";
import { modelCells, readTargetCells } from "./cells";
import { columnLabel, magColumn, type StoredTarget, TARGET_COLUMNS, type TargetValues } from "./schemas";
import { starPosition } from "./star-names.server";

/** The submitted target fields (and one magnitude field per band) as text, to check and to show again. */
export function targetFormValues(form: FormData, bands: string[]): Record<string, string> {
  const out: Record<string, string> = {};
  for (const k of [...TARGET_COLUMNS, ...bands.map(magColumn)]) {
    const x = form.get(k);
    out[k] = typeof x === "string" ? x : "";
  }
  return out;
}

/** Checks a submitted target form: the target, or messages keyed by field, each starting with its label. */
export function readTargetForm(
  values: Record<string, string>,
  bands: string[],
): { target: TargetValues | null; errors: Record<string, string> } {
  // A name with no coordinates: the position of the catalogue star it names.
  const read = readTargetCells(values, bands.map(magColumn), 0, starPosition);
  const errors: Record<string, string> = {};
  for (const e of read.errors) {
    const label = columnLabel(e.column);
    errors[e.column] ??= e.message.startsWith(label) ? e.message : `${label}: ${e.message}`;
  }
  return { target: read.target, errors };
}

/** A stored target (of My targets or of a proposal) as form values, coordinates in sexagesimal. */
export function valuesOfTarget(t: StoredTarget): Record<string, string> {
  const out: Record<string, string> = {
    name: t.name,
    ra: formatRightAscension(t.raDeg, 3),
    dec: formatDeclination(t.decDeg, 2),
    model: t.model.type,
    ...modelCells(t.model),
    notes: t.notes,
  };
  for (const [band, mag] of Object.entries(t.magnitudes)) out[magColumn(band)] = String(mag);
  return out;
}
