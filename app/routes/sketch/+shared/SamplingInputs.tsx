/**
 * When a sketch is observed: the night and its time step, or a range of hour angles; and the
 * observing limits (minimum elevation, the delay-line check).
 */
import { SelectField, TextField } from "~/components/ui";
import { rangeText } from "~/engine";
import { MIN_ELEVATION_RANGE, NIGHT_STEP_RANGE } from "~/services/sketch/limits";
import type { RegistryLike } from "~/services/sketch/registry";
import { type CommonState, STEP_CHOICES_MIN } from "~/services/sketch/state";
import { binder, type GroupProps, InputError, InputGroup } from "./InputGroup";

const SAMPLING_MODES = [
  ["night", "The dark hours of that night"],
  ["hourAngle", "A range of hour angles"],
] as const;

const HOUR_ANGLE_FIELDS = [
  ["haFrom", "From"],
  ["haTo", "To"],
  ["haStep", "Step"],
] as const satisfies readonly (readonly [keyof CommonState, string])[];

function HourAngleRange({ state, set, type, errors }: GroupProps) {
  const field = binder(state, set, type);
  return (
    <div className="space-y-1">
      <div className="grid grid-cols-3 gap-2">
        {HOUR_ANGLE_FIELDS.map(([key, label]) => (
          <TextField
            key={key}
            label={label}
            unit="h"
            inputMode="decimal"
            {...field(key)}
            aria-invalid={errors.ha ? true : undefined}
          />
        ))}
      </div>
      {errors.ha ? (
        <InputError message={errors.ha} />
      ) : (
        <p className="text-sm text-night-600">Hour angles from −12 to 12 h; the Sun is not checked.</p>
      )}
    </div>
  );
}

function TimeStep({ state, set, errors, hint }: Omit<GroupProps, "type"> & { hint?: string }) {
  const known = (STEP_CHOICES_MIN as readonly string[]).includes(state.stepMin);
  const field = binder(state, set);
  return (
    <SelectField
      label="Time step"
      unit="minutes"
      {...field("stepMin", "step")}
      error={errors.step}
      hint={hint ?? `A shared link may carry any step ${rangeText(NIGHT_STEP_RANGE)}.`}
    >
      {!known ? <option value={state.stepMin}>{state.stepMin}</option> : null}
      {STEP_CHOICES_MIN.map((m) => (
        <option key={m} value={m}>
          {m}
        </option>
      ))}
    </SelectField>
  );
}

export function SamplingInputs({
  state,
  set,
  type,
  errors,
  site,
  stepHint,
}: GroupProps & { site: RegistryLike["site"]; stepHint?: string }) {
  const field = binder(state, set, type);
  return (
    <InputGroup title="When">
      <TextField
        label="Night of"
        type="date"
        {...field("date")}
        error={errors.date}
        hint="The night that begins on this local evening."
      />
      <div role="radiogroup" aria-label="Sampling" className="space-y-1 text-sm">
        <p className="font-medium text-night-800">Sampling</p>
        {SAMPLING_MODES.map(([mode, label]) => (
          <label key={mode} className="flex items-center gap-2">
            <input
              type="radio"
              name="sampling"
              value={mode}
              checked={state.sampling === mode}
              onChange={() => set({ sampling: mode })}
            />
            {label}
          </label>
        ))}
      </div>
      {state.sampling === "night" ? (
        <TimeStep state={state} set={set} errors={errors} hint={stepHint} />
      ) : (
        <HourAngleRange state={state} set={set} type={type} errors={errors} />
      )}
      <TextField
        label="Minimum elevation"
        unit="°"
        inputMode="decimal"
        {...field("minElevation", "minel")}
        placeholder={`${site.minElevationDeg} (the site's)`}
        hint={`Allowed ${rangeText(MIN_ELEVATION_RANGE)}; empty: the site's ${site.minElevationDeg}°.`}
        error={errors.minElevation}
      />
      <div>
        <label className="flex items-start gap-2 text-sm">
          <input
            type="checkbox"
            name="dl"
            className="mt-1"
            checked={state.delayLines}
            onChange={(e) => set({ delayLines: e.target.checked })}
          />
          <span>
            Check the delay lines <span className="text-night-600">(stroke {site.delayLineStrokeM} m)</span>
          </span>
        </label>
        <InputError message={errors.delayLines} />
      </div>
    </InputGroup>
  );
}
