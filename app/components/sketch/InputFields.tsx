/**
 * Inputs shared by the Sketchpad and the Triangle finder: target, model, band, night or hour-angle
 * sampling and observing limits. Every input is controlled and keeps exactly what was typed; errors
 * (the page's own checks or the API's 400) appear under the input they belong to.
 */
import type { ReactNode } from "react";
import { Button, cx, SelectField, TextField } from "~/components/ui";
import { describeChannels } from "~/engine";
import { formatDeclination, formatRightAscension, parseDeclination, parseRightAscension } from "~/lib/coordinates";
import type { FieldErrors, RegistryLike } from "~/services/sketch/request";
import {
  type CommonState,
  defaultSecond,
  MODEL_LABELS,
  MODEL_PARAMS,
  type ModelParam,
  type ModelState,
  modelInputsOf,
  PARAM_INFO,
  type SavedTarget,
  SIMPLE_MODEL_TYPES,
  type SimpleModelType,
  STEP_CHOICES_MIN,
} from "~/services/sketch/state";

type Patch = (patch: Partial<CommonState>) => void;

/** A titled group of inputs (a fieldset with a visible legend). */
export function InputGroup({ title, children, className }: { title: string; children: ReactNode; className?: string }) {
  return (
    <fieldset className={cx("space-y-3 rounded-lg border border-night-200 bg-white p-4", className)}>
      <legend className="px-1 text-sm font-semibold text-night-900">{title}</legend>
      {children}
    </fieldset>
  );
}

export function TargetInputs({
  state,
  set,
  errors,
  onExample,
  savedTargets = [],
}: {
  state: CommonState;
  set: Patch;
  errors: FieldErrors;
  /** Fills a target that is up tonight (shown while no coordinates are typed). */
  onExample?: () => void;
  /** The person's own targets ("My targets"); picking one fills name, coordinates and model. */
  savedTargets?: SavedTarget[];
}) {
  const ra = parseRightAscension(state.ra);
  const dec = parseDeclination(state.dec);
  return (
    <InputGroup title="Target">
      {savedTargets.length > 0 ? (
        <SelectField
          label="From My targets"
          name="saved"
          value=""
          onChange={(e) => {
            const t = savedTargets.find((x) => String(x.id) === e.target.value);
            if (!t) return;
            set({
              name: t.name,
              ra: formatRightAscension(t.raDeg, 2),
              dec: formatDeclination(t.decDeg, 1),
              ...modelInputsOf(t.model),
            });
          }}
        >
          <option value="">— pick one to fill the fields —</option>
          {savedTargets.map((t) => (
            <option key={t.id} value={t.id}>
              {t.name}
            </option>
          ))}
        </SelectField>
      ) : null}
      <TextField
        label="Name"
        name="name"
        value={state.name}
        maxLength={200}
        autoComplete="off"
        placeholder="optional"
        error={errors.name}
        onChange={(e) => set({ name: e.target.value })}
      />
      <TextField
        label="Right ascension"
        name="ra"
        value={state.ra}
        autoComplete="off"
        spellCheck={false}
        placeholder="05:36:12.8 or 84.05"
        error={errors.ra}
        hint={
          ra.ok
            ? `${formatRightAscension(ra.deg)} = ${ra.deg.toFixed(4)}° (J2000)`
            : "hh:mm:ss.s (hours) or decimal degrees, J2000"
        }
        onChange={(e) => set({ ra: e.target.value })}
      />
      <TextField
        label="Declination"
        name="dec"
        value={state.dec}
        autoComplete="off"
        spellCheck={false}
        placeholder="-01:12:07 or -1.2"
        error={errors.dec}
        hint={
          dec.ok
            ? `${formatDeclination(dec.deg)} = ${dec.deg.toFixed(4)}° (J2000)`
            : "±dd:mm:ss or decimal degrees, J2000"
        }
        onChange={(e) => set({ dec: e.target.value })}
      />
      {onExample && state.ra.trim() === "" && state.dec.trim() === "" ? (
        <Button variant="secondary" size="sm" onClick={onExample}>
          Try a target that is up tonight
        </Button>
      ) : null}
    </InputGroup>
  );
}

function ModelParams({
  model,
  prefix,
  errors,
  onChange,
}: {
  model: ModelState;
  prefix: "model" | "second";
  errors: FieldErrors;
  onChange: (m: ModelState) => void;
}) {
  return (
    <>
      <SelectField
        label={prefix === "model" ? "Model" : "Second component"}
        name={prefix === "model" ? "model" : "c2"}
        value={model.type}
        error={errors[prefix]}
        onChange={(e) => onChange({ ...model, type: e.target.value as SimpleModelType })}
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
            onChange={(e) => onChange({ ...model, params: { ...model.params, [p]: e.target.value } })}
          />
        );
      })}
    </>
  );
}

export function ModelInputs({ state, set, errors }: { state: CommonState; set: Patch; errors: FieldErrors }) {
  const second = state.second;
  return (
    <InputGroup title="Source model">
      <ModelParams model={state.model} prefix="model" errors={errors} onChange={(model) => set({ model })} />
      {second ? (
        <div className="space-y-3 border-t border-night-100 pt-3">
          <ModelParams
            model={second}
            prefix="second"
            errors={errors}
            onChange={(m) => set({ second: { ...second, ...m } })}
          />
          <TextField
            label="Relative flux"
            unit="first component = 1"
            name="c2flux"
            inputMode="decimal"
            value={second.flux}
            error={errors["second.flux"]}
            onChange={(e) => set({ second: { ...second, flux: e.target.value } })}
          />
          <div className="grid grid-cols-2 gap-3">
            <TextField
              label="Offset east"
              unit="mas"
              name="c2east"
              inputMode="decimal"
              value={second.east}
              error={errors["second.east"]}
              onChange={(e) => set({ second: { ...second, east: e.target.value } })}
            />
            <TextField
              label="Offset north"
              unit="mas"
              name="c2north"
              inputMode="decimal"
              value={second.north}
              error={errors["second.north"]}
              onChange={(e) => set({ second: { ...second, north: e.target.value } })}
            />
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

export function BandInput({
  state,
  set,
  errors,
  registry,
}: {
  state: CommonState;
  set: Patch;
  errors: FieldErrors;
  registry: RegistryLike;
}) {
  const inst = registry.instruments.find((i) => i.name === state.instrument);
  const band = inst?.bands.find((b) => b.name === state.band);
  return (
    <SelectField
      label="Instrument band"
      name="band"
      value={`${state.instrument}\u001f${state.band}`}
      error={errors.band}
      hint={
        band && inst
          ? `${describeChannels(band)}. ${inst.name} combines up to ${inst.maxTelescopes} telescopes.`
          : "Channels spread evenly across the band."
      }
      onChange={(e) => {
        const [instrument, b] = e.target.value.split("\u001f");
        set({ instrument, band: b });
      }}
    >
      {!band ? <option value={`${state.instrument}\u001f${state.band}`}>Choose a band</option> : null}
      {registry.instruments.map((i) => (
        <optgroup key={i.name} label={i.name}>
          {i.bands.map((b) => (
            <option key={b.name} value={`${i.name}\u001f${b.name}`}>
              {i.name} {b.name} — {(b.centralWavelengthM * 1e6).toFixed(2)} µm, {b.channels} channels
            </option>
          ))}
        </optgroup>
      ))}
    </SelectField>
  );
}

export function SamplingInputs({
  state,
  set,
  errors,
  site,
  stepHint,
}: {
  state: CommonState;
  set: Patch;
  errors: FieldErrors;
  site: RegistryLike["site"];
  stepHint?: string;
}) {
  return (
    <InputGroup title="When">
      <TextField
        label="Night of"
        name="date"
        type="date"
        value={state.date}
        error={errors.date}
        hint="The night that begins on this local evening."
        onChange={(e) => set({ date: e.target.value })}
      />
      <div role="radiogroup" aria-label="Sampling" className="space-y-1 text-sm">
        <p className="font-medium text-night-800">Sampling</p>
        {(
          [
            ["night", "The dark hours of that night"],
            ["hourAngle", "A range of hour angles"],
          ] as const
        ).map(([mode, label]) => (
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
        <SelectField
          label="Time step"
          unit="minutes"
          name="step"
          value={state.stepMin}
          error={errors.step}
          hint={stepHint}
          onChange={(e) => set({ stepMin: e.target.value })}
        >
          {!STEP_CHOICES_MIN.includes(state.stepMin as (typeof STEP_CHOICES_MIN)[number]) ? (
            <option value={state.stepMin}>{state.stepMin}</option>
          ) : null}
          {STEP_CHOICES_MIN.map((m) => (
            <option key={m} value={m}>
              {m}
            </option>
          ))}
        </SelectField>
      ) : (
        <div className="space-y-1">
          <div className="grid grid-cols-3 gap-2">
            <TextField
              label="From"
              unit="h"
              name="haFrom"
              inputMode="decimal"
              value={state.haFrom}
              onChange={(e) => set({ haFrom: e.target.value })}
              aria-invalid={errors.ha ? true : undefined}
            />
            <TextField
              label="To"
              unit="h"
              name="haTo"
              inputMode="decimal"
              value={state.haTo}
              onChange={(e) => set({ haTo: e.target.value })}
              aria-invalid={errors.ha ? true : undefined}
            />
            <TextField
              label="Step"
              unit="h"
              name="haStep"
              inputMode="decimal"
              value={state.haStep}
              onChange={(e) => set({ haStep: e.target.value })}
              aria-invalid={errors.ha ? true : undefined}
            />
          </div>
          {errors.ha ? (
            <p role="alert" className="text-sm font-medium text-danger-700">
              {errors.ha}
            </p>
          ) : (
            <p className="text-sm text-night-600">Hour angles from −12 to 12 h; the Sun is not checked.</p>
          )}
        </div>
      )}
      <TextField
        label="Minimum elevation"
        unit="°"
        name="minel"
        inputMode="decimal"
        value={state.minElevation}
        placeholder={`${site.minElevationDeg} (the site's)`}
        error={errors.minElevation}
        onChange={(e) => set({ minElevation: e.target.value })}
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
        {errors.delayLines ? (
          <p role="alert" className="text-sm font-medium text-danger-700">
            {errors.delayLines}
          </p>
        ) : null}
      </div>
    </InputGroup>
  );
}
