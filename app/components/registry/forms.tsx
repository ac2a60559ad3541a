/**
 * The registry's edit forms. Each form posts to its route's action, which answers a failed check with
 * `{ errors, values }` (status 400): the fields show their message and keep what was typed.
 */
import { type FormEvent, type ReactNode, useState } from "react";
import { Form, Link, useNavigation } from "react-router";
import { Button, buttonClass, Card, FormErrors, TextArea, TextField } from "~/components/ui";
import { sentence } from "~/services/registry/io";
import { type MapConfiguration, type MapStation, StationMap } from "./StationMap";

export type FormState = { errors?: Record<string, string>; values?: Record<string, string> } | undefined | null;
type Defaults = Record<string, string>;

function fieldProps(state: FormState, defaults: Defaults, name: string) {
  const message = state?.errors?.[name];
  return {
    name,
    defaultValue: state?.values?.[name] ?? defaults[name] ?? "",
    error: message ? sentence(message) : undefined,
  };
}

function summary(state: FormState, labels: Record<string, string>): string[] {
  return Object.entries(state?.errors ?? {}).map(([key, message]) =>
    labels[key] ? `${labels[key]}: ${message}` : sentence(message),
  );
}

/** A save form with the error summary, the fields and the save/cancel buttons. */
export function EditForm({
  state,
  labels,
  submitLabel,
  cancelTo,
  children,
  onInput,
  ariaLabel,
}: {
  state: FormState;
  labels: Record<string, string>;
  submitLabel: string;
  cancelTo: string;
  children: ReactNode;
  onInput?: (form: HTMLFormElement) => void;
  ariaLabel: string;
}) {
  const navigation = useNavigation();
  const busy = navigation.state === "submitting" && navigation.formData?.get("intent") === "save";
  return (
    <Form
      method="post"
      noValidate
      aria-label={ariaLabel}
      className="space-y-5"
      onInput={(e: FormEvent<HTMLFormElement>) => onInput?.(e.currentTarget)}
    >
      <input type="hidden" name="intent" value="save" />
      <FormErrors errors={summary(state, labels)} />
      {children}
      <div className="flex flex-wrap gap-3">
        <Button type="submit" disabled={busy}>
          {busy ? "Saving…" : submitLabel}
        </Button>
        <Link to={cancelTo} className={buttonClass("secondary")}>
          Cancel
        </Link>
      </div>
    </Form>
  );
}

/** A card with a single delete button (and optional extra fields, e.g. a confirmation). */
export function DeleteCard({
  title,
  children,
  buttonLabel,
  fields,
}: {
  title: string;
  children: ReactNode;
  buttonLabel: string;
  fields?: ReactNode;
}) {
  return (
    <Card title={title} className="ring-danger-700/30">
      <Form method="post" className="space-y-3" aria-label={title}>
        <input type="hidden" name="intent" value="delete" />
        <div className="text-sm text-night-700">{children}</div>
        {fields}
        <Button type="submit" variant="danger">
          {buttonLabel}
        </Button>
      </Form>
    </Card>
  );
}

// ---------------------------------------------------------------------------------------------

export const SITE_LABELS: Record<string, string> = {
  name: "Name",
  latitudeDeg: "Latitude",
  longitudeDeg: "Longitude",
  altitudeM: "Altitude",
  minElevationDeg: "Minimum elevation",
  delayLineStrokeM: "Delay-line stroke",
  timeZone: "Time zone",
};
export const SITE_FIELDS = Object.keys(SITE_LABELS);

export function SiteFields({
  state,
  defaults,
  timeZones,
}: {
  state: FormState;
  defaults: Defaults;
  timeZones: string[];
}) {
  return (
    <div className="grid gap-4 sm:grid-cols-2">
      <div className="sm:col-span-2">
        <TextField label={SITE_LABELS.name} required autoComplete="off" {...fieldProps(state, defaults, "name")} />
      </div>
      <TextField
        label={SITE_LABELS.latitudeDeg}
        unit="°, north positive"
        inputMode="decimal"
        required
        hint="−90 to 90"
        {...fieldProps(state, defaults, "latitudeDeg")}
      />
      <TextField
        label={SITE_LABELS.longitudeDeg}
        unit="°, east positive"
        inputMode="decimal"
        required
        hint="−180 to 180"
        {...fieldProps(state, defaults, "longitudeDeg")}
      />
      <TextField
        label={SITE_LABELS.altitudeM}
        unit="m"
        inputMode="decimal"
        required
        hint="Above sea level"
        {...fieldProps(state, defaults, "altitudeM")}
      />
      <TextField
        label={SITE_LABELS.minElevationDeg}
        unit="°"
        inputMode="decimal"
        required
        hint="0 to 90: the lowest the telescopes point"
        {...fieldProps(state, defaults, "minElevationDeg")}
      />
      <TextField
        label={SITE_LABELS.delayLineStrokeM}
        unit="m"
        inputMode="decimal"
        required
        hint="Total optical path the delay lines can add; more than 0"
        {...fieldProps(state, defaults, "delayLineStrokeM")}
      />
      <div>
        <TextField
          label={SITE_LABELS.timeZone}
          list="registry-time-zones"
          required
          autoComplete="off"
          hint="A time zone name, e.g. America/Argentina/San_Juan or UTC"
          {...fieldProps(state, defaults, "timeZone")}
        />
        <datalist id="registry-time-zones">
          {timeZones.map((z) => (
            <option key={z} value={z} />
          ))}
        </datalist>
      </div>
    </div>
  );
}

// ---------------------------------------------------------------------------------------------

export const STATION_LABELS: Record<string, string> = {
  name: "Name",
  eastM: "East",
  northM: "North",
  upM: "Up",
  pathOffsetM: "Path offset",
};
export const STATION_FIELDS = Object.keys(STATION_LABELS);

/** Station fields beside the site plan, which shows the position as it is typed. */
export function StationFields({
  state,
  defaults,
  stations,
  editing,
}: {
  state: FormState;
  defaults: Defaults;
  stations: MapStation[];
  /** The station being edited (drawn only at its typed position), or null for a new one. */
  editing: string | null;
}) {
  const start = (k: string) => state?.values?.[k] ?? defaults[k] ?? "";
  const [typed, setTyped] = useState({ name: start("name"), east: start("eastM"), north: start("northM") });
  const others = stations.filter((s) => s.name !== editing);
  // An existing station: start framed on it and its nearest neighbours.
  const [framing] = useState(() => {
    const self = stations.find((s) => s.name === editing);
    if (!self) return null;
    const near = [...others].sort(
      (a, b) =>
        Math.hypot(a.eastM - self.eastM, a.northM - self.northM) -
        Math.hypot(b.eastM - self.eastM, b.northM - self.northM),
    );
    return [self, ...near.slice(0, 6)];
  });
  const east = Number(typed.east.replace("−", "-"));
  const north = Number(typed.north.replace("−", "-"));
  const preview =
    typed.east.trim() !== "" && typed.north.trim() !== "" && Number.isFinite(east) && Number.isFinite(north)
      ? { name: typed.name.trim(), eastM: east, northM: north }
      : null;
  return (
    <div
      className="grid grid-cols-1 gap-6 lg:grid-cols-[minmax(0,22rem)_minmax(0,1fr)]"
      onInput={(e) => {
        const form = (e.target as HTMLInputElement).form;
        if (!form) return;
        const get = (k: string) => String(new FormData(form).get(k) ?? "");
        setTyped({ name: get("name"), east: get("eastM"), north: get("northM") });
      }}
    >
      <div className="grid content-start gap-4">
        <TextField
          label={STATION_LABELS.name}
          required
          autoComplete="off"
          hint="Letters, digits, '.', '_' or '-'; unique at the site"
          {...fieldProps(state, defaults, "name")}
        />
        <div className="grid grid-cols-2 gap-4">
          <TextField
            label={STATION_LABELS.eastM}
            unit="m"
            inputMode="decimal"
            required
            {...fieldProps(state, defaults, "eastM")}
          />
          <TextField
            label={STATION_LABELS.northM}
            unit="m"
            inputMode="decimal"
            required
            {...fieldProps(state, defaults, "northM")}
          />
          <TextField
            label={STATION_LABELS.upM}
            unit="m"
            inputMode="decimal"
            required
            {...fieldProps(state, defaults, "upM")}
          />
          <TextField
            label={STATION_LABELS.pathOffsetM}
            unit="m"
            inputMode="decimal"
            required
            {...fieldProps(state, defaults, "pathOffsetM")}
          />
        </div>
        <p className="text-sm text-night-600">
          East, north and up are metres from the array's reference point; the path offset is the station's fixed extra
          optical path.
        </p>
      </div>
      <StationMap
        stations={others}
        preview={preview}
        frame={framing}
        height={380}
        label="Site plan with the position as typed"
      />
    </div>
  );
}

// ---------------------------------------------------------------------------------------------

export const CONFIGURATION_LABELS: Record<string, string> = {
  name: "Name",
  description: "Description",
  offered: "Offered",
  stations: "Stations, in order",
};
export const CONFIGURATION_FIELDS = Object.keys(CONFIGURATION_LABELS);

export function ConfigurationFields({
  state,
  defaults,
  stations,
  widest,
}: {
  state: FormState;
  defaults: Defaults;
  stations: MapStation[];
  /** Most telescopes any instrument combines (0 when there are no instruments). */
  widest: number;
}) {
  const [list, setList] = useState(state?.values?.stations ?? defaults.stations ?? "");
  const names = list.split(/[\s,;]+/).filter(Boolean);
  const known = new Set(stations.map((s) => s.name));
  const unknown = names.filter((n) => !known.has(n));
  const draft: MapConfiguration = { name: "This configuration", stationNames: names };
  // Start framed on the stations the configuration has (the whole site for a new one).
  const [framing] = useState(() => {
    const first = new Set(names);
    const points = stations.filter((s) => first.has(s.name));
    return points.length > 0 ? points : null;
  });
  const offeredDefault = (state?.values ? state.values.offered : defaults.offered) === "on";
  const stationsError = state?.errors?.stations;
  return (
    <div className="grid grid-cols-1 gap-6 lg:grid-cols-[minmax(0,22rem)_minmax(0,1fr)]">
      <div className="grid content-start gap-4">
        <TextField
          label={CONFIGURATION_LABELS.name}
          required
          autoComplete="off"
          {...fieldProps(state, defaults, "name")}
        />
        <TextArea
          label={CONFIGURATION_LABELS.description}
          hint="What the configuration is good for (optional)."
          {...fieldProps(state, defaults, "description")}
        />
        <label className="inline-flex items-center gap-2 text-sm font-medium text-night-800">
          <input type="checkbox" name="offered" defaultChecked={offeredDefault} className="h-4 w-4 accent-ember-700" />
          Offered to proposers
        </label>
        <TextField
          label={CONFIGURATION_LABELS.stations}
          name="stations"
          required
          autoComplete="off"
          value={list}
          onChange={(e) => setList(e.target.value)}
          error={stationsError ? sentence(stationsError) : undefined}
          hint="Names separated by spaces or commas; at least 2. Click stations on the map to add them. Baseline i–j is station j minus station i in this order."
        />
        <p className="text-sm text-night-700" aria-live="polite">
          {names.length} station{names.length === 1 ? "" : "s"}, {(names.length * (names.length - 1)) / 2} baselines
          {unknown.length > 0 ? (
            <span className="block font-medium text-danger-700">Not at this site: {unknown.join(", ")}</span>
          ) : null}
          {widest > 0 && names.length > widest ? (
            <span className="block font-medium text-caution-700">
              No instrument combines more than {widest} telescopes; this list has {names.length}. It can still be saved.
            </span>
          ) : null}
        </p>
      </div>
      <StationMap
        stations={stations}
        draft={draft}
        frame={framing}
        height={420}
        label="Site plan with the configuration's stations and baselines"
        onPickStation={(name) =>
          setList((cur) => (cur.split(/[\s,;]+/).includes(name) ? cur : `${cur.trim()} ${name}`.trim()))
        }
      />
    </div>
  );
}

// ---------------------------------------------------------------------------------------------

export const INSTRUMENT_LABELS: Record<string, string> = {
  name: "Name",
  description: "Description",
  maxTelescopes: "Telescopes it combines",
};
export const INSTRUMENT_FIELDS = Object.keys(INSTRUMENT_LABELS);

export function InstrumentFields({ state, defaults }: { state: FormState; defaults: Defaults }) {
  return (
    <div className="grid max-w-xl gap-4">
      <TextField label={INSTRUMENT_LABELS.name} required autoComplete="off" {...fieldProps(state, defaults, "name")} />
      <TextArea
        label={INSTRUMENT_LABELS.description}
        hint="Optional."
        {...fieldProps(state, defaults, "description")}
      />
      <TextField
        label={INSTRUMENT_LABELS.maxTelescopes}
        inputMode="numeric"
        required
        hint="The most telescopes it takes at once; a whole number, at least 2"
        {...fieldProps(state, defaults, "maxTelescopes")}
      />
    </div>
  );
}

export const BAND_LABELS: Record<string, string> = {
  name: "Name",
  centralWavelengthUm: "Central wavelength",
  bandwidthUm: "Bandwidth",
  channels: "Spectral channels",
  limitingMagnitude: "Limiting magnitude",
};
export const BAND_FIELDS = Object.keys(BAND_LABELS);

export function BandFields({ state, defaults }: { state: FormState; defaults: Defaults }) {
  return (
    <div className="grid max-w-xl gap-4 sm:grid-cols-2">
      <div className="sm:col-span-2">
        <TextField
          label={BAND_LABELS.name}
          required
          autoComplete="off"
          hint="Unique within the instrument, e.g. H"
          {...fieldProps(state, defaults, "name")}
        />
      </div>
      <TextField
        label={BAND_LABELS.centralWavelengthUm}
        unit="µm"
        inputMode="decimal"
        required
        {...fieldProps(state, defaults, "centralWavelengthUm")}
      />
      <TextField
        label={BAND_LABELS.bandwidthUm}
        unit="µm"
        inputMode="decimal"
        required
        hint="Full width; less than twice the central wavelength"
        {...fieldProps(state, defaults, "bandwidthUm")}
      />
      <TextField
        label={BAND_LABELS.channels}
        inputMode="numeric"
        required
        hint="A whole number, at least 1"
        {...fieldProps(state, defaults, "channels")}
      />
      <TextField
        label={BAND_LABELS.limitingMagnitude}
        unit="mag"
        inputMode="decimal"
        required
        hint="Faintest the instrument can track fringes on"
        {...fieldProps(state, defaults, "limitingMagnitude")}
      />
    </div>
  );
}
