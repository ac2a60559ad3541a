/**
 * The fields of the registry's edit forms, written once for the form that shows them and the
 * action that reads them: name, label, unit and hint. The value rules are the feature's schemas.
 */
export type FieldSpec = {
  name: string;
  label: string;
  unit?: string;
  hint?: string;
  /** A number: the keyboard to offer. */
  inputMode?: "decimal" | "numeric";
  /** Optional free text over several lines. */
  multiline?: boolean;
  /** A name or code the browser should not fill in from elsewhere. */
  noAutofill?: boolean;
  /** Takes the whole row of a two-column grid. */
  wide?: boolean;
  /** The id of a list of suggestions. */
  list?: string;
};

const nameField = (hint?: string, wide?: boolean): FieldSpec => ({
  name: "name",
  label: "Name",
  noAutofill: true,
  hint,
  wide,
});
const description = (hint: string): FieldSpec => ({ name: "description", label: "Description", multiline: true, hint });
const metres = (name: string, label: string): FieldSpec => ({ name, label, unit: "m", inputMode: "decimal" });

export const SITE_FIELDS: FieldSpec[] = [
  nameField(undefined, true),
  { name: "latitudeDeg", label: "Latitude", unit: "°, north positive", inputMode: "decimal", hint: "−90 to 90" },
  { name: "longitudeDeg", label: "Longitude", unit: "°, east positive", inputMode: "decimal", hint: "−180 to 180" },
  { ...metres("altitudeM", "Altitude"), hint: "Above sea level" },
  {
    name: "minElevationDeg",
    label: "Minimum elevation",
    unit: "°",
    inputMode: "decimal",
    hint: "0 to 90: the lowest the telescopes point",
  },
  {
    ...metres("delayLineStrokeM", "Delay-line stroke"),
    hint: "Total optical path the delay lines can add; more than 0",
  },
  {
    name: "timeZone",
    label: "Time zone",
    list: "registry-time-zones",
    noAutofill: true,
    hint: "A time zone name, e.g. America/Argentina/San_Juan or UTC",
  },
];

export const STATION_NAME_FIELD = nameField("Letters, digits, '.', '_' or '-'; unique at the site");
export const STATION_POSITION_FIELDS: FieldSpec[] = [
  metres("eastM", "East"),
  metres("northM", "North"),
  metres("upM", "Up"),
  metres("pathOffsetM", "Path offset"),
];
export const STATION_FIELDS = [STATION_NAME_FIELD, ...STATION_POSITION_FIELDS];

export const CONFIGURATION_FIELDS: FieldSpec[] = [
  nameField(),
  description("What the configuration is good for (optional)."),
  { name: "offered", label: "Offered" },
  { name: "stations", label: "Stations, in order" },
];

export const INSTRUMENT_FIELDS: FieldSpec[] = [
  nameField(),
  description("Optional."),
  {
    name: "maxTelescopes",
    label: "Telescopes it combines",
    inputMode: "numeric",
    hint: "The most telescopes it takes at once; a whole number, at least 2",
  },
];

export const BAND_FIELDS: FieldSpec[] = [
  nameField("Unique within the instrument, e.g. H", true),
  { name: "centralWavelengthUm", label: "Central wavelength", unit: "µm", inputMode: "decimal" },
  {
    name: "bandwidthUm",
    label: "Bandwidth",
    unit: "µm",
    inputMode: "decimal",
    hint: "Full width; less than twice the central wavelength",
  },
  { name: "channels", label: "Spectral channels", inputMode: "numeric", hint: "A whole number, at least 1" },
  {
    name: "limitingMagnitude",
    label: "Limiting magnitude",
    unit: "mag",
    inputMode: "decimal",
    hint: "Faintest the instrument can track fringes on",
  },
];

/** The names a form's action reads. */
export const namesOf = (specs: FieldSpec[]) => specs.map((s) => s.name);

/** Labels by field name, for the error summary ("Latitude: must be between -90 and 90 °"). */
export const labelsOf = (specs: FieldSpec[]): Record<string, string> =>
  Object.fromEntries(specs.map((s) => [s.name, s.label]));
