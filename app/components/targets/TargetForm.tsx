import { useState } from "react";
import { Form } from "react-router";
import { StarNameField } from "~/components/catalogue/StarNameField";
import { FormErrors, SelectField } from "~/components/ui";
import { FieldList, type FieldSpec, SubmitButton } from "~/components/ui/FieldList";
import type { TargetModel } from "~/engine";

export type TargetFormValues = Record<string, string>;

type ModelType = Exclude<TargetModel["type"], "sum">;

const MODELS: { value: ModelType; label: string }[] = [
  { value: "point", label: "Point source" },
  { value: "uniformDisk", label: "Uniform disk" },
  { value: "limbDarkenedDisk", label: "Limb-darkened disk (linear law)" },
  { value: "gaussian", label: "Gaussian" },
  { value: "ring", label: "Thin ring" },
  { value: "binary", label: "Binary (two points)" },
];

const POSITION: FieldSpec[] = [
  { name: "ra", label: "Right ascension", required: true, hint: "J2000; hours 05:36:12.8 or degrees 84.05" },
  { name: "dec", label: "Declination", required: true, hint: "J2000; −01:12:07 or −1.202" },
];

/** The parameters of each model, in the order they are shown; field names are the CSV columns. */
const PARAMETERS: (FieldSpec & { models: string[] })[] = [
  { name: "size_mas", label: "Diameter", unit: "mas", models: ["uniformDisk", "limbDarkenedDisk", "ring", "gaussian"] },
  {
    name: "ld_coefficient",
    label: "Limb-darkening coefficient",
    hint: "Linear law, 0 to 1",
    models: ["limbDarkenedDisk"],
  },
  { name: "separation_mas", label: "Separation", unit: "mas", models: ["binary"] },
  { name: "position_angle_deg", label: "Position angle", unit: "° east of north", models: ["binary"] },
  { name: "flux_ratio", label: "Flux ratio", unit: "secondary / primary", models: ["binary"] },
];

/** The fields of `model`'s parameters; a Gaussian's size is its FWHM. */
function parameterFields(model: string): FieldSpec[] {
  return PARAMETERS.filter((p) => p.models.includes(model)).map(({ models: _, ...field }) => ({
    ...field,
    inputMode: "decimal",
    label: field.name === "size_mas" && model === "gaussian" ? "FWHM" : field.label,
  }));
}

const NOTES: FieldSpec[] = [{ name: "notes", label: "Notes", multiline: true, maxLength: 1000, className: "min-h-20" }];

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
  const magnitudes = bands.map(
    (b): FieldSpec => ({
      name: `mag_${b}`,
      label: `${b} band`,
      unit: "mag",
      inputMode: "decimal",
    }),
  );
  return (
    <>
      <div className="grid gap-4 md:grid-cols-3">
        <StarNameField
          label="Name"
          name="name"
          defaultValue={values.name}
          error={errors.name}
          maxLength={80}
          required
          fill={{ ra: "ra", dec: "dec" }}
          hint="A star's name or designation fills its coordinates (HD 39801, α Ori, 58 Ori); any name may be kept."
        />
        <FieldList fields={POSITION} values={values} errors={errors} />
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
        <FieldList fields={parameterFields(model)} values={values} errors={errors} />
      </div>
      {bands.length ? (
        <fieldset className="grid gap-4 sm:grid-cols-3">
          <legend className="mb-1 text-sm font-medium text-night-800">Magnitudes (leave empty when unknown)</legend>
          <FieldList fields={magnitudes} values={values} errors={errors} />
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
  return (
    <Form method="post" className="grid gap-4" noValidate>
      <input type="hidden" name="intent" value={intent} />
      <FormErrors errors={Object.values(errors)} />
      <TargetFields values={values} errors={errors} bands={bands} />
      <FieldList fields={NOTES} values={values} errors={errors} />
      <div>
        <SubmitButton label={submitLabel} />
      </div>
    </Form>
  );
}
