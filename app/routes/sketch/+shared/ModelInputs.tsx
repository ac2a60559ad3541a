/**
 * The source model of a sketch: a model type with its parameters, and an optional second component
 * with its flux relative to the first and its offset from the phase centre.
 */
import { Button, SelectField, TextField } from "~/components/ui";
import type { FieldErrors } from "~/services/sketch/inputs";
import {
  defaultSecond,
  MODEL_LABELS,
  MODEL_PARAMS,
  type ModelParam,
  type ModelState,
  PARAM_INFO,
  SECOND_INFO,
  type SecondComponentState,
  SIMPLE_MODEL_TYPES,
  type SimpleModelType,
} from "~/services/sketch/models";
import { type GroupProps, InputGroup } from "./InputGroup";

function ModelParams({
  model,
  prefix,
  errors,
  onPick,
  onType,
}: {
  model: ModelState;
  prefix: "model" | "second";
  errors: FieldErrors;
  /** A new model type (computed at once). */
  onPick: (m: ModelState) => void;
  /** A parameter typed (computed once the typing pauses). */
  onType: (m: ModelState) => void;
}) {
  return (
    <>
      <SelectField
        label={prefix === "model" ? "Model" : "Second component"}
        name={prefix === "model" ? "model" : "c2"}
        value={model.type}
        error={errors[prefix]}
        onChange={(e) => onPick({ ...model, type: e.target.value as SimpleModelType })}
      >
        {SIMPLE_MODEL_TYPES.map((t) => (
          <option key={t} value={t}>
            {MODEL_LABELS[t]}
          </option>
        ))}
      </SelectField>
      {MODEL_PARAMS[model.type].map((p: ModelParam) => {
        const info = PARAM_INFO[p];
        return (
          <TextField
            key={p}
            label={info.label}
            unit={info.unit}
            name={`${prefix === "model" ? "" : "c2"}${info.urlKey}`}
            inputMode="decimal"
            autoComplete="off"
            value={model.params[p]}
            hint={info.hint}
            error={errors[`${prefix}.${p}`]}
            onChange={(e) => onType({ ...model, params: { ...model.params, [p]: e.target.value } })}
          />
        );
      })}
    </>
  );
}

function SecondField({
  field,
  second,
  errors,
  type,
}: Pick<GroupProps, "errors" | "type"> & { field: keyof typeof SECOND_INFO; second: SecondComponentState }) {
  const info = SECOND_INFO[field];
  return (
    <TextField
      label={info.label}
      unit={info.unit}
      hint={info.hint}
      name={`c2${field}`}
      inputMode="decimal"
      autoComplete="off"
      value={second[field]}
      error={errors[`second.${field}`]}
      onChange={(e) => type({ second: { ...second, [field]: e.target.value } })}
    />
  );
}

export function ModelInputs({ state, set, type, errors }: GroupProps) {
  const second = state.second;
  return (
    <InputGroup title="Source model">
      <ModelParams
        model={state.model}
        prefix="model"
        errors={errors}
        onPick={(model) => set({ model })}
        onType={(model) => type({ model })}
      />
      {second ? (
        <div className="space-y-3 border-t border-night-100 pt-3">
          <ModelParams
            model={second}
            prefix="second"
            errors={errors}
            onPick={(m) => set({ second: { ...second, ...m } })}
            onType={(m) => type({ second: { ...second, ...m } })}
          />
          <SecondField field="flux" second={second} errors={errors} type={type} />
          <div className="grid gap-3 sm:grid-cols-2">
            <SecondField field="east" second={second} errors={errors} type={type} />
            <SecondField field="north" second={second} errors={errors} type={type} />
          </div>
          <Button variant="ghost" size="sm" onClick={() => set({ second: null })}>
            Remove the second component
          </Button>
        </div>
      ) : (
        <Button variant="secondary" size="sm" onClick={() => set({ second: defaultSecond() })}>
          Add a second component
        </Button>
      )}
      <p className="text-xs text-night-600">
        Position angles east of north; binary flux ratio secondary / primary. Two components make a weighted sum, the
        first at the phase centre.
      </p>
    </InputGroup>
  );
}
