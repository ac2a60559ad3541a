/**
 * From the typed inputs of the Sketchpad and the Triangle finder to the JSON bodies of
 * POST /api/coverage, /api/ephemeris and /api/triangles, and from the API's 400 answers back to the
 * input that caused them. Pure: shared by the pages and their tests.
 *
 * The builder checks what only the page can know (text that is not a number or an angle, a station
 * pick that is too small or larger than the instrument combines, the request size limits); ranges the
 * API already checks (a negative diameter, a minimum elevation above 90°) are left to it, and its
 * message is shown beside the input it names.
 */
import {
  type BandLike,
  channelWavelengthsM,
  MAX_CLOSURE_VALUES,
  MAX_SAMPLES,
  MAX_UV_POINTS,
  maxNightSamples,
  type TargetModel,
} from "~/engine";
import { parseDeclination, parseRightAscension } from "~/lib/coordinates";
import {
  ALL_STATIONS,
  type CommonState,
  MODEL_PARAMS,
  type ModelParam,
  type ModelState,
  PARAM_INFO,
  type SketchState,
  type TriangleState,
} from "~/services/sketch/state";

/** The parts of the array registry the builders need (a subset of the registry loader's data). */
export interface RegistryLike {
  site: {
    latitudeDeg: number;
    longitudeDeg: number;
    altitudeM: number;
    minElevationDeg: number;
    delayLineStrokeM: number;
  };
  stations: { name: string; eastM: number; northM: number; upM: number; pathOffsetM: number }[];
  configurations: { name: string; stationNames: string[] }[];
  instruments: { name: string; maxTelescopes: number; bands: BandLike[] }[];
}

/** The registry as the pages receive it from their loader (with the site's name and configuration details). */
export interface SketchRegistry extends RegistryLike {
  site: RegistryLike["site"] & { name: string };
  configurations: (RegistryLike["configurations"][number] & { description: string; offered: boolean })[];
}

/** Names of the inputs an error can be shown beside. */
export type InputKey =
  | "form"
  | "name"
  | "ra"
  | "dec"
  | "date"
  | "stations"
  | "band"
  | "model"
  | `model.${ModelParam}`
  | "second"
  | `second.${ModelParam}`
  | "second.flux"
  | "second.east"
  | "second.north"
  | "step"
  | "ha"
  | "minElevation"
  | "delayLines"
  | "weighting";

export type FieldErrors = Partial<Record<InputKey, string>>;

export const INPUT_LABELS: Record<string, string> = {
  form: "Request",
  name: "Target name",
  ra: "Right ascension",
  dec: "Declination",
  date: "Night",
  stations: "Stations",
  band: "Band",
  model: "Model",
  second: "Second component",
  "second.flux": "Relative flux",
  "second.east": "Offset east",
  "second.north": "Offset north",
  step: "Time step",
  ha: "Hour-angle range",
  minElevation: "Minimum elevation",
  delayLines: "Delay-line check",
  weighting: "Beam weighting",
};
for (const p of Object.keys(PARAM_INFO) as ModelParam[]) {
  INPUT_LABELS[`model.${p}`] = PARAM_INFO[p].label;
  INPUT_LABELS[`second.${p}`] = PARAM_INFO[p].label;
}

export interface SiteBody {
  latitudeDeg: number;
  longitudeDeg: number;
  altitudeM: number;
}
export interface StationBody {
  name: string;
  eastM: number;
  northM: number;
  upM: number;
  pathOffsetM: number;
}
export interface CoverageBody {
  site: SiteBody;
  stations: StationBody[];
  target: { name?: string; raDeg: number; decDeg: number; model: TargetModel };
  wavelengthsM: number[];
  night?: { date: string; stepMin: number };
  hourAnglesH?: number[];
  minElevationDeg: number;
  delayLineStrokeM: number | null;
  beam?: { gridSize: number; weighting: SketchState["weighting"]; includeImages: boolean } | null;
}
export interface TrianglesBody extends Omit<CoverageBody, "beam"> {
  maxTriangles: number;
}
export interface EphemerisBody {
  site: SiteBody;
  date: string;
}

export type Built<T> =
  | { ok: true; body: T }
  /** `waiting`: nothing to compute yet (no target typed); the page shows a prompt, not errors. */
  | { ok: false; errors: FieldErrors; waiting: boolean };

/** Dirty-beam grid of the Sketchpad: 256² keeps the fitted FWHM within a few per cent (docs/cli.md). */
export const SKETCH_GRID_SIZE = 256;
/** Most hour-angle samples the Sketchpad asks for in one request. */
export const MAX_SKETCH_HOUR_ANGLES = 2000;
/** Rows the Triangle finder asks for. */
export const TRIANGLE_ROWS = 50;

const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)(e[+-]?\d+)?$/i;

/** Reads a number as typed; the message names the input and its unit. */
export function readNumber(
  text: string,
  label: string,
  unit?: string,
): { ok: true; value: number } | { ok: false; message: string } {
  const t = text.replace(/\u2212/g, "-").trim();
  if (t === "") return { ok: false, message: `${label}: required${unit ? ` (in ${unit})` : ""}` };
  if (!NUMBER.test(t))
    return { ok: false, message: `${label}: must be a number${unit ? ` in ${unit}` : ""} (got "${text.trim()}")` };
  return { ok: true, value: Number(t) };
}

function siteBody(r: RegistryLike): SiteBody {
  return { latitudeDeg: r.site.latitudeDeg, longitudeDeg: r.site.longitudeDeg, altitudeM: r.site.altitudeM };
}

export function findBand(r: RegistryLike, instrument: string, band: string) {
  const inst = r.instruments.find((i) => i.name === instrument);
  const b = inst?.bands.find((x) => x.name === band);
  return inst && b ? { instrument: inst, band: b } : null;
}

/** The single model (no second component) as the API expects it, or the failing inputs. */
function simpleModel(m: ModelState, prefix: "model" | "second", errors: FieldErrors): TargetModel | null {
  const values: Partial<Record<ModelParam, number>> = {};
  let ok = true;
  for (const p of MODEL_PARAMS[m.type]) {
    const info = PARAM_INFO[p];
    const read = readNumber(m.params[p], info.label, info.unit);
    if (read.ok) values[p] = read.value;
    else {
      errors[`${prefix}.${p}`] = read.message;
      ok = false;
    }
  }
  if (!ok) return null;
  switch (m.type) {
    case "point":
      return { type: "point" };
    case "uniformDisk":
      return { type: "uniformDisk", diameterMas: values.diameterMas! };
    case "gaussian":
      return { type: "gaussian", fwhmMas: values.fwhmMas! };
    case "limbDarkenedDisk":
      return { type: "limbDarkenedDisk", diameterMas: values.diameterMas!, coefficient: values.coefficient! };
    case "ring":
      return { type: "ring", diameterMas: values.diameterMas! };
    case "binary":
      return {
        type: "binary",
        separationMas: values.separationMas!,
        positionAngleDeg: values.positionAngleDeg!,
        fluxRatio: values.fluxRatio!,
      };
  }
}

/**
 * The target model of the inputs: one component, or with a second component a two-component sum
 * (the first with flux 1 at the phase centre, the second with its relative flux and offset).
 */
export function modelFromState(s: Pick<CommonState, "model" | "second">, errors: FieldErrors = {}): TargetModel | null {
  const first = simpleModel(s.model, "model", errors);
  if (!s.second) return first;
  const second = simpleModel(s.second, "second", errors);
  const flux = readNumber(s.second.flux, INPUT_LABELS["second.flux"]);
  const east = readNumber(s.second.east, INPUT_LABELS["second.east"], "mas");
  const north = readNumber(s.second.north, INPUT_LABELS["second.north"], "mas");
  if (!flux.ok) errors["second.flux"] = flux.message;
  if (!east.ok) errors["second.east"] = east.message;
  if (!north.ok) errors["second.north"] = north.message;
  if (!first || !second || !flux.ok || !east.ok || !north.ok) return null;
  return {
    type: "sum",
    components: [
      { model: first, flux: 1, offsetEastMas: 0, offsetNorthMas: 0 },
      { model: second, flux: flux.value, offsetEastMas: east.value, offsetNorthMas: north.value },
    ],
  };
}

/** Hour angles from..to (inclusive, within rounding) every step, hours. */
export function hourAngleList(from: number, to: number, step: number): number[] {
  const n = Math.floor((to - from) / step + 1e-9) + 1;
  const out: number[] = [];
  for (let k = 0; k < n; k++) out.push(Math.round((from + k * step) * 1e9) / 1e9);
  return out;
}

type Sampling = { night: { date: string; stepMin: number } } | { hourAnglesH: number[] };

function sampling(s: CommonState, errors: FieldErrors): { body: Sampling; bound: number } | null {
  if (s.sampling === "hourAngle") {
    const label = INPUT_LABELS.ha;
    const from = readNumber(s.haFrom, `${label} (from)`, "h");
    const to = readNumber(s.haTo, `${label} (to)`, "h");
    const step = readNumber(s.haStep, `${label} (step)`, "h");
    const bad = [from, to, step].find((x) => !x.ok);
    if (bad && !bad.ok) {
      errors.ha = bad.message;
      return null;
    }
    if (!from.ok || !to.ok || !step.ok) return null;
    if (!(step.value > 0)) {
      errors.ha = `${label}: the step must be positive (got ${step.value} h)`;
      return null;
    }
    if (to.value < from.value) {
      errors.ha = `${label}: "to" (${to.value} h) must not be before "from" (${from.value} h)`;
      return null;
    }
    const count = Math.floor((to.value - from.value) / step.value + 1e-9) + 1;
    if (count > MAX_SKETCH_HOUR_ANGLES) {
      errors.ha = `${label}: ${count} samples; at most ${MAX_SKETCH_HOUR_ANGLES} here — use a larger step`;
      return null;
    }
    return { body: { hourAnglesH: hourAngleList(from.value, to.value, step.value) }, bound: count };
  }
  if (s.date.trim() === "") {
    errors.date = `${INPUT_LABELS.date}: choose a date (YYYY-MM-DD)`;
    return null;
  }
  const step = readNumber(s.stepMin, INPUT_LABELS.step, "minutes");
  if (!step.ok) {
    errors.step = step.message;
    return null;
  }
  return {
    body: { night: { date: s.date.trim(), stepMin: step.value } },
    bound: step.value > 0 ? Math.min(MAX_SAMPLES, maxNightSamples(step.value)) : 0,
  };
}

function target(s: CommonState, model: TargetModel | null, errors: FieldErrors) {
  const ra = parseRightAscension(s.ra);
  const dec = parseDeclination(s.dec);
  if (!ra.ok) errors.ra = ra.message;
  if (!dec.ok) errors.dec = dec.message;
  if (!ra.ok || !dec.ok || !model) return null;
  const name = s.name.trim();
  return { ...(name !== "" ? { name } : {}), raDeg: ra.deg, decDeg: dec.deg, model };
}

function minElevation(s: CommonState, r: RegistryLike, errors: FieldErrors): number | null {
  if (s.minElevation.trim() === "") return r.site.minElevationDeg;
  const read = readNumber(s.minElevation, INPUT_LABELS.minElevation, "degrees");
  if (!read.ok) {
    errors.minElevation = read.message;
    return null;
  }
  return read.value;
}

/** Stations of a Sketchpad state: the configuration's, or the free pick (in registry order). */
export function pickedStations(s: Pick<SketchState, "config" | "stations">, r: RegistryLike): string[] {
  if (s.config !== "") return r.configurations.find((c) => c.name === s.config)?.stationNames ?? [];
  const set = new Set(s.stations);
  return r.stations.filter((st) => set.has(st.name)).map((st) => st.name);
}

function stationBodies(names: string[], r: RegistryLike): StationBody[] {
  return names.map((n) => {
    const st = r.stations.find((x) => x.name === n)!;
    return { name: st.name, eastM: st.eastM, northM: st.northM, upM: st.upM, pathOffsetM: st.pathOffsetM };
  });
}

/** Checks the request-size limits of the API before asking (docs/cli.md, "Size limits"). */
export function sizeFailure(stations: number, samples: number, channels: number, withClosures = true): string | null {
  const baselines = (stations * (stations - 1)) / 2;
  const triangles = (stations * (stations - 1) * (stations - 2)) / 6;
  const uv = baselines * samples * channels;
  if (uv > MAX_UV_POINTS) {
    return `${baselines} baselines × ${samples} samples × ${channels} channels = ${uv} uv points, above the limit of ${MAX_UV_POINTS}; use a larger time step`;
  }
  const cp = triangles * samples * channels;
  if (withClosures && cp > MAX_CLOSURE_VALUES) {
    return `${triangles} triangles × ${samples} samples × ${channels} channels = ${cp} closure phases, above the limit of ${MAX_CLOSURE_VALUES}; use a larger time step or fewer stations`;
  }
  return null;
}

function common(s: CommonState, r: RegistryLike, errors: FieldErrors) {
  const model = modelFromState(s, errors);
  const tgt = target(s, model, errors);
  const found = findBand(r, s.instrument, s.band);
  if (!found) errors.band = `${INPUT_LABELS.band}: choose an instrument band`;
  const samp = sampling(s, errors);
  const minEl = minElevation(s, r, errors);
  return { tgt, found, samp, minEl };
}

/** True when neither coordinate has been typed: nothing to compute, nothing to complain about. */
function waitingForTarget(s: CommonState): boolean {
  return s.ra.trim() === "" && s.dec.trim() === "";
}

/**
 * What both pages share once the station list is known: the request-size check, silence while no
 * target is typed, and the body without the page's own extras (beam, triangle count).
 */
function finishRequest(
  s: CommonState,
  r: RegistryLike,
  names: string[],
  errors: FieldErrors,
  { tgt, found, samp, minEl }: ReturnType<typeof common>,
): Built<Omit<CoverageBody, "beam">> {
  if (found && samp && !errors.stations) {
    const size = sizeFailure(names.length, samp.bound, found.band.channels);
    const field = s.sampling === "hourAngle" ? "ha" : "step";
    if (size) errors[field] = `${INPUT_LABELS[field]}: ${size}`;
  }
  const waiting = waitingForTarget(s);
  if (waiting) {
    delete errors.ra;
    delete errors.dec;
  }
  if (waiting || Object.keys(errors).length > 0 || !tgt || !found || !samp || minEl === null) {
    return { ok: false, errors, waiting };
  }
  return {
    ok: true,
    body: {
      site: siteBody(r),
      stations: stationBodies(names, r),
      target: tgt,
      wavelengthsM: channelWavelengthsM(found.band.centralWavelengthM, found.band.bandwidthM, found.band.channels),
      ...samp.body,
      minElevationDeg: minEl,
      delayLineStrokeM: s.delayLines ? r.site.delayLineStrokeM : null,
    },
  };
}

/** The POST /api/coverage body of a Sketchpad state (with the beam and model images). */
export function buildCoverageRequest(s: SketchState, r: RegistryLike): Built<CoverageBody> {
  const errors: FieldErrors = {};
  const parts = common(s, r, errors);
  const { found } = parts;
  const names = pickedStations(s, r);
  if (s.config !== "" && !r.configurations.some((c) => c.name === s.config)) {
    errors.stations = `${INPUT_LABELS.stations}: there is no configuration "${s.config}"`;
  } else if (names.length < 2) {
    errors.stations = `${INPUT_LABELS.stations}: pick at least 2 stations (${names.length} picked)`;
  } else if (found && names.length > found.instrument.maxTelescopes) {
    errors.stations =
      `${INPUT_LABELS.stations}: ${found.instrument.name} combines at most ${found.instrument.maxTelescopes} telescopes ` +
      `(${names.length} ${s.config !== "" ? `in ${s.config}` : "picked"}); pick fewer stations or another instrument`;
  }
  const done = finishRequest(s, r, names, errors, parts);
  if (!done.ok) return done;
  return {
    ok: true,
    body: { ...done.body, beam: { gridSize: SKETCH_GRID_SIZE, weighting: s.weighting, includeImages: true } },
  };
}

/** The POST /api/triangles body of a Triangle finder state. */
export function buildTrianglesRequest(s: TriangleState, r: RegistryLike): Built<TrianglesBody> {
  const errors: FieldErrors = {};
  const parts = common(s, r, errors);
  let names: string[] = [];
  if (s.pool === ALL_STATIONS) names = r.stations.map((st) => st.name);
  else {
    const c = r.configurations.find((x) => x.name === s.pool);
    if (!c) errors.stations = `${INPUT_LABELS.stations}: choose a configuration or all stations`;
    else names = c.stationNames;
  }
  if (!errors.stations && names.length < 3) {
    errors.stations = `${INPUT_LABELS.stations}: a triangle needs at least 3 stations (${names.length} in the pool)`;
  }
  const done = finishRequest(s, r, names, errors, parts);
  if (!done.ok) return done;
  return { ok: true, body: { ...done.body, maxTriangles: TRIANGLE_ROWS } };
}

/** The POST /api/ephemeris body for the night of the state's date, or null without a date. */
export function buildEphemerisRequest(s: Pick<CommonState, "date">, r: RegistryLike): EphemerisBody | null {
  const date = s.date.trim();
  if (!/^\d{4}-\d{2}-\d{2}$/.test(date)) return null;
  return { site: siteBody(r), date };
}

/**
 * The input an API error belongs to, from the `field` of a 400 answer (docs/cli.md), e.g.
 * "target.decDeg" → "dec", "target.model.components[1].flux" → "second.flux", "night.date" → "date".
 */
export function inputForApiField(field: string | null, mode: CommonState["sampling"] = "night"): InputKey {
  if (!field) return "form";
  if (field === "target.raDeg") return "ra";
  if (field === "target.decDeg") return "dec";
  if (field === "target.name") return "name";
  if (field === "date") return "date";
  const second = /^target\.model\.components\[1\]\.(flux|offsetEastMas|offsetNorthMas|model)(?:\.(\w+))?/.exec(field);
  if (second) {
    if (second[1] === "flux") return "second.flux";
    if (second[1] === "offsetEastMas") return "second.east";
    if (second[1] === "offsetNorthMas") return "second.north";
    return isParam(second[2]) ? `second.${second[2]}` : "second";
  }
  const first = /^target\.model(?:\.components\[0\]\.model)?\.(\w+)/.exec(field);
  if (first) return isParam(first[1]) ? `model.${first[1]}` : "model";
  if (field.startsWith("target")) return "model";
  if (field.startsWith("night.date")) return "date";
  if (field.startsWith("night")) return "step";
  if (field.startsWith("hourAnglesH")) return mode === "hourAngle" ? "ha" : "step";
  if (field.startsWith("minElevationDeg")) return "minElevation";
  if (field.startsWith("delayLineStrokeM")) return "delayLines";
  if (field.startsWith("stations")) return "stations";
  if (field.startsWith("wavelengthsM")) return "band";
  if (field.startsWith("beam")) return "weighting";
  return "form";
}

function isParam(x: string | undefined): x is ModelParam {
  return x !== undefined && x in PARAM_INFO;
}

/**
 * The API's message with its field path replaced by the input's label:
 * ("target.decDeg", "target.decDeg: must be between -90 and 90") → "Declination: must be between -90 and 90".
 */
export function apiErrorText(field: string | null, message: string, mode: CommonState["sampling"] = "night"): string {
  const key = inputForApiField(field, mode);
  if (!field || key === "form") return message;
  const prefix = `${field}: `;
  const rest = message.startsWith(prefix) ? message.slice(prefix.length) : message;
  return `${INPUT_LABELS[key] ?? key}: ${rest}`;
}
