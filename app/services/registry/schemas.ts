/**
 * The registry's records and the rules every value follows, shared by the admin forms and the
 * imports: a site, a station, a configuration, an instrument and its bands.
 */
import * as v from "valibot";
import { booleanField, fields, isTimeZone, type NumberRule, numberField, textField } from "./field-rules";

export const STATION_COLUMNS = ["name", "eastM", "northM", "upM", "pathOffsetM"] as const;
export type StationColumn = (typeof STATION_COLUMNS)[number];

export const STATION_NAME_PATTERN = /^[A-Za-z0-9][A-Za-z0-9._-]*$/;

export const stationName = textField({
  max: 24,
  pattern: STATION_NAME_PATTERN,
  patternMessage: "must start with a letter or digit and use only letters, digits, '.', '_' or '-'",
});

/** Why a list of station names is refused: too short, a name twice, or not a station name; null when fine. */
function stationListProblem(names: string[]): string | null {
  if (names.length < 2) return "needs at least 2 stations";
  const seen = new Set<string>();
  for (const n of names) {
    if (seen.has(n)) return `lists ${n} twice`;
    seen.add(n);
  }
  const bad = names.find((n) => n.length > 24 || !STATION_NAME_PATTERN.test(n));
  return bad ? `“${bad.slice(0, 30)}” is not a station name` : null;
}

/** Station names from a list, or from text separated by commas or spaces; in order, each once, at least 2. */
export const stationList = v.pipe(
  v.unknown(),
  v.rawTransform<unknown, string[]>(({ dataset, addIssue, NEVER }) => {
    const raw = dataset.value;
    let names: string[] | null = null;
    if (typeof raw === "string") names = raw.split(/[\s,;]+/).filter(Boolean);
    else if (Array.isArray(raw) && raw.every((n) => typeof n === "string"))
      names = raw.map((n) => n.trim()).filter(Boolean);
    else if (raw === undefined || raw === null) names = [];
    const problem = names ? stationListProblem(names) : "must be a list of station names";
    if (problem === null) return names ?? [];
    addIssue({ message: problem });
    return NEVER;
  }),
);

export const SiteSchema = fields({
  name: textField({ max: 80 }),
  latitudeDeg: numberField({ min: -90, max: 90, unit: "°" }),
  longitudeDeg: numberField({ min: -180, max: 180, unit: "°" }),
  altitudeM: numberField({ min: -500, max: 9000, unit: "m" }),
  minElevationDeg: numberField({ min: 0, max: 90, unit: "°" }),
  delayLineStrokeM: numberField({ above: 0, max: 10000, unit: "m" }),
  timeZone: v.pipe(
    textField({ max: 64 }),
    v.check(isTimeZone, "must be a time zone name such as UTC or America/Argentina/San_Juan"),
  ),
});
export type SiteRecord = v.InferOutput<typeof SiteSchema>;

export const StationSchema = fields({
  name: stationName,
  eastM: numberField({ min: -20000, max: 20000, unit: "m" }),
  northM: numberField({ min: -20000, max: 20000, unit: "m" }),
  upM: numberField({ min: -1000, max: 1000, unit: "m" }),
  pathOffsetM: numberField({ min: -10000, max: 10000, unit: "m" }),
});
export type StationRecord = v.InferOutput<typeof StationSchema>;

export const ConfigurationSchema = fields({
  name: textField({ max: 60 }),
  description: textField({ required: false, max: 500 }),
  offered: booleanField(true),
  stations: stationList,
});
export type ConfigurationRecord = v.InferOutput<typeof ConfigurationSchema>;

export const InstrumentSchema = fields({
  name: textField({ max: 60 }),
  description: textField({ required: false, max: 500 }),
  maxTelescopes: numberField({ min: 2, max: 50, integer: true }),
});
export type InstrumentValues = v.InferOutput<typeof InstrumentSchema>;

const BANDWIDTH_RULE = "must be less than twice the central wavelength (the band's short edge would fall below zero)";

/**
 * A band with its two wavelengths under the given field names and rule (the forms take
 * micrometres, files carry metres); the bandwidth must stay below twice the central wavelength.
 */
function bandSchema<C extends string, W extends string>(central: C, width: W, wavelength: NumberRule) {
  const entries = {
    name: textField({ max: 20 }),
    [central]: numberField(wavelength),
    channels: numberField({ min: 1, max: 100000, integer: true }),
    [width]: numberField(wavelength),
    limitingMagnitude: numberField({ min: -5, max: 30, unit: "mag" }),
  } as { name: ReturnType<typeof textField>; channels: ReturnType<typeof numberField> } & Record<
    C | W | "limitingMagnitude",
    ReturnType<typeof numberField>
  >;
  // The paths name the two generic keys, which valibot cannot type: checked here by hand.
  const narrowEnough = (b: Record<C | W, number>) => b[width] < 2 * b[central];
  return v.pipe(
    fields(entries),
    v.forward(v.partialCheck([[central], [width]] as never, narrowEnough as never, BANDWIDTH_RULE), [width] as never),
  );
}

/** A band as the forms take it: wavelengths in micrometres. */
export const BandFormSchema = bandSchema("centralWavelengthUm", "bandwidthUm", { above: 0, max: 1000, unit: "µm" });

/** A band as files carry it: wavelengths in metres, as everywhere on the wire. */
export const BandFileSchema = bandSchema("centralWavelengthM", "bandwidthM", { above: 0, max: 1e-3, unit: "m" });
export type BandRecord = v.InferOutput<typeof BandFileSchema>;
export type InstrumentRecord = InstrumentValues & { bands: BandRecord[] };

/** Micrometres to metres without a binary-fraction tail (1.65 µm → 1.65e-6 m exactly as typed). */
export function micronsToMetres(um: number): number {
  return Number((um * 1e-6).toPrecision(15));
}
export function metresToMicrons(m: number): number {
  return Number((m * 1e6).toPrecision(12));
}
