import { useState } from "react";
import { Form, useNavigation } from "react-router";
import { Button, FormErrors, SelectField, TextArea, TextField } from "~/components/ui";

export type TargetFormValues = Record<string, string>;

const MODELS: { value: string; label: string }[] = [
  { value: "point", label: "Point source" },
  { value: "uniformDisk", label: "Uniform disk" },
  { value: "limbDarkenedDisk", label: "Limb-darkened disk (linear law)" },
  { value: "gaussian", label: "Gaussian" },
  { value: "ring", label: "Thin ring" },
  { value: "binary", label: "Binary (two points)" },
];

/**
 * The fields of one target: name, coordinates (sexagesimal or degrees), model with its parameters,
 * magnitudes per band. Field names are the CSV column names, so one reader checks forms and files.
 */
export function TargetFields({
  values,
  errors,
  bands,
}: {
  values: TargetFormValues;
  errors: Record<string, string>;
  bands: string[];
}) {
  const [model, setModel] = useState(values.model || "point");
  const sized = model === "uniformDisk" || model === "limbDarkenedDisk" || model === "ring" || model === "gaussian";
  return (
    <>
      <div className="grid gap-4 md:grid-cols-3">
        <TextField label="Name" name="name" defaultValue={values.name} error={errors.name} maxLength={80} required />
        <TextField
          label="Right ascension"
          name="ra"
          defaultValue={values.ra}
          error={errors.ra}
          required
          hint="J2000; hours 05:36:12.8 or degrees 84.05"
        />
        <TextField
          label="Declination"
          name="dec"
          defaultValue={values.dec}
          error={errors.dec}
          required
          hint="J2000; −01:12:07 or −1.202"
        />
      </div>
      <div className="grid gap-4 md:grid-cols-3">
        <SelectField
          label="Model"
          name="model"
          value={model}
          onChange={(e) => setModel(e.target.value)}
          error={errors.model}
        >
          {MODELS.map((m) => (
            <option key={m.value} value={m.value}>
              {m.label}
            </option>
          ))}
        </SelectField>
        {sized ? (
          <TextField
            label={model === "gaussian" ? "FWHM" : "Diameter"}
            unit="mas"
            name="size_mas"
            inputMode="decimal"
            defaultValue={values.size_mas}
            error={errors.size_mas}
          />
        ) : null}
        {model === "limbDarkenedDisk" ? (
          <TextField
            label="Limb-darkening coefficient"
            name="ld_coefficient"
            inputMode="decimal"
            defaultValue={values.ld_coefficient}
            error={errors.ld_coefficient}
            hint="Linear law, 0 to 1"
          />
        ) : null}
        {model === "binary" ? (
          <>
            <TextField
              label="Separation"
              unit="mas"
              name="separation_mas"
              inputMode="decimal"
              defaultValue={values.separation_mas}
              error={errors.separation_mas}
            />
            <TextField
              label="Position angle"
              unit="° east of north"
              name="position_angle_deg"
              inputMode="decimal"
              defaultValue={values.position_angle_deg}
              error={errors.position_angle_deg}
            />
            <TextField
              label="Flux ratio"
              unit="secondary / primary"
              name="flux_ratio"
              inputMode="decimal"
              defaultValue={values.flux_ratio}
              error={errors.flux_ratio}
            />
          </>
        ) : null}
      </div>
      {bands.length ? (
        <fieldset className="grid gap-4 sm:grid-cols-3">
          <legend className="mb-1 text-sm font-medium text-night-800">Magnitudes (leave empty when unknown)</legend>
          {bands.map((b) => (
            <TextField
              key={b}
              label={`${b} band`}
              unit="mag"
              name={`mag_${b}`}
              inputMode="decimal"
              defaultValue={values[`mag_${b}`]}
              error={errors[`mag_${b}`]}
            />
          ))}
        </fieldset>
      ) : null}
    </>
  );
}

/** A form for one target of My targets: the target's fields and notes. */
export function TargetForm({
  values,
  errors,
  bands,
  submitLabel,
  intent,
}: {
  values: TargetFormValues;
  errors: Record<string, string>;
  bands: string[];
  submitLabel: string;
  intent: string;
}) {
  const busy = useNavigation().state === "submitting";
  return (
    <Form method="post" className="grid gap-4" noValidate>
      <input type="hidden" name="intent" value={intent} />
      <FormErrors errors={Object.values(errors)} />
      <TargetFields values={values} errors={errors} bands={bands} />
      <TextArea
        label="Notes"
        name="notes"
        defaultValue={values.notes}
        error={errors.notes}
        maxLength={1000}
        className="min-h-20"
      />
      <div>
        <Button type="submit" disabled={busy}>
          {busy ? "Saving…" : submitLabel}
        </Button>
      </div>
    </Form>
  );
}
