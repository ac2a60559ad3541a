/** The settings of a new imaging preview, each with its default stated. */
import type { ChangeEvent } from "react";
import { SelectField, TextField } from "~/components/ui";
import { IMAGING_DEFAULTS, REGULARIZER_LABELS } from "~/services/imaging/schemas";

/** The settings as typed (strings), turned into the request's numbers by `settingsBody`. */
export type SettingsDraft = {
  gridSize: string;
  regularizer: string;
  weightMode: "auto" | "fixed";
  weight: string;
  seed: string;
  vis2Percent: string;
  closurePhaseDeg: string;
  closurePhaseTriangles: string;
};

export const DEFAULT_DRAFT: SettingsDraft = {
  gridSize: String(IMAGING_DEFAULTS.gridSize),
  regularizer: IMAGING_DEFAULTS.regularizer,
  weightMode: "auto",
  weight: "1",
  seed: String(IMAGING_DEFAULTS.seed),
  vis2Percent: String(IMAGING_DEFAULTS.vis2Relative * 100),
  closurePhaseDeg: String(IMAGING_DEFAULTS.closurePhaseDeg),
  closurePhaseTriangles: IMAGING_DEFAULTS.closurePhaseTriangles,
};

/** The settings typed as numbers. */
type NumberKey = "gridSize" | "weight" | "seed" | "vis2Percent" | "closurePhaseDeg";
/** Where the request's field has another name than the draft's (the error comes back under it). */
const BODY_FIELD: Partial<Record<NumberKey, string>> = { vis2Percent: "vis2Relative" };

const num = (s: string) => (s.trim() === "" ? Number.NaN : Number(s));

/** The `settings` of POST /api/imaging/jobs; the server validates and names any field out of range. */
export function settingsBody(d: SettingsDraft) {
  return {
    gridSize: num(d.gridSize),
    regularizer: d.regularizer,
    weight: d.weightMode === "auto" ? "auto" : num(d.weight),
    seed: num(d.seed),
    vis2Relative: num(d.vis2Percent) / 100,
    closurePhaseDeg: num(d.closurePhaseDeg),
    closurePhaseTriangles: d.closurePhaseTriangles,
  };
}

export function ImagingSettingsForm({
  draft,
  onChange,
  errors,
  disabled,
}: {
  draft: SettingsDraft;
  onChange: (d: SettingsDraft) => void;
  errors: Record<string, string>;
  disabled?: boolean;
}) {
  const set = (patch: Partial<SettingsDraft>) => onChange({ ...draft, ...patch });
  /** A typed number field: its text, its change, and the error the server names it by. */
  const bind = (key: NumberKey, inputMode: "numeric" | "decimal") => ({
    inputMode,
    value: draft[key],
    onChange: (e: ChangeEvent<HTMLInputElement>) => set({ [key]: e.target.value }),
    error: errors[`settings.${BODY_FIELD[key] ?? key}`],
  });
  /** A choice: its value, its change, and the error the server names it by. */
  const choose = (key: "regularizer" | "weightMode" | "closurePhaseTriangles") => ({
    value: draft[key],
    onChange: (e: ChangeEvent<HTMLSelectElement>) => set({ [key]: e.target.value } as Partial<SettingsDraft>),
    error: errors[`settings.${key}`],
  });
  return (
    <fieldset disabled={disabled} className="grid gap-3 sm:grid-cols-2 xl:grid-cols-4">
      <legend className="sr-only">Imaging settings</legend>
      <TextField
        label="Grid size"
        unit="pixels per side"
        {...bind("gridSize", "numeric")}
        hint="32–128, default 64; pixel λ/(4 B_max)."
      />
      <SelectField label="Regularizer" {...choose("regularizer")}>
        {Object.entries(REGULARIZER_LABELS).map(([value, label]) => (
          <option key={value} value={value}>
            {label}
          </option>
        ))}
      </SelectField>
      <SelectField
        label="Weight"
        {...choose("weightMode")}
        hint="Automatic: chosen so the reduced χ² comes out near 1."
      >
        <option value="auto">Automatic</option>
        <option value="fixed">Fixed</option>
      </SelectField>
      {draft.weightMode === "fixed" ? (
        <TextField label="Weight value" {...bind("weight", "decimal")} hint="0 to 1 000 000, against the reduced χ²." />
      ) : null}
      <TextField label="Noise seed" {...bind("seed", "numeric")} hint="The same seed gives the same data." />
      <TextField
        label="V² error"
        unit="% of V²"
        {...bind("vis2Percent", "decimal")}
        hint="Default 5 % (common practice for a well calibrated night)."
      />
      <TextField
        label="Closure-phase error"
        unit="degrees"
        {...bind("closurePhaseDeg", "decimal")}
        hint="Default 2° (common practice)."
      />
      <SelectField
        label="Closure phases"
        {...choose("closurePhaseTriangles")}
        hint="Independent: the (N−1)(N−2)/2 triangles through the first station."
      >
        <option value="all">Every triangle</option>
        <option value="independent">Independent triangles only</option>
      </SelectField>
    </fieldset>
  );
}
