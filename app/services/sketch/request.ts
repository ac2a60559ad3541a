/**
 * From the typed inputs of the Sketchpad and the Triangle finder to the JSON bodies of
 * POST /api/coverage, /api/ephemeris and /api/triangles. Pure: shared by the pages and their tests.
 *
 * The builder checks what the page can before asking: text that is not a number or an angle, the
 * physical ranges of the model parameters (the API's own, from ~/engine), the time step and minimum
 * elevation, a station pick that is too small or larger than the instrument combines, the request
 * size limits. Anything else the API refuses is shown beside the input it names (./api-errors.ts).
 */
import {
  type BeamOptions,
  channelWavelengthsM,
  type EphemerisInput,
  MAX_SAMPLES,
  maxNightSamples,
  type ObservationInput,
  type TargetModel,
  type TrianglesInput,
} from "~/engine";
import { parseDeclination, parseRightAscension } from "~/lib/coordinates";
import { type Built, type FieldErrors, INPUT_LABELS, readNumber, readNumberIn } from "./inputs";
import {
  MAX_SKETCH_HOUR_ANGLES,
  MIN_ELEVATION_RANGE,
  NIGHT_STEP_RANGE,
  SKETCH_GRID_SIZE,
  sizeFailure,
  TRIANGLE_ROWS,
} from "./limits";
import { modelFromState } from "./model-input";
import { findBand, pickedStations, poolStations, type RegistryLike, siteBody, stationBodies } from "./registry";
import type { CommonState, SketchState, TriangleState } from "./state";
import { plural } from "./words";

/** The POST /api/coverage body of a Sketchpad state: the observation and the beam with its images. */
export type CoverageBody = ObservationInput & { beam?: Omit<BeamOptions, "robust"> | null };
/** The POST /api/triangles body of a Triangle finder state. */
export type TrianglesBody = TrianglesInput;
/** The POST /api/ephemeris body of the night of a state. */
export type EphemerisBody = EphemerisInput;

/** Hour angles from..to (inclusive, within rounding) every step, hours. */
export function hourAngleList(from: number, to: number, step: number): number[] {
  const n = Math.floor((to - from) / step + 1e-9) + 1;
  const out: number[] = [];
  for (let k = 0; k < n; k++) out.push(Math.round((from + k * step) * 1e9) / 1e9);
  return out;
}

type Sampling = { night: { date: string; stepMin: number } } | { hourAnglesH: number[] };

function hourAngleSampling(s: CommonState, errors: FieldErrors): { body: Sampling; bound: number } | null {
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

function sampling(s: CommonState, errors: FieldErrors): { body: Sampling; bound: number } | null {
  if (s.sampling === "hourAngle") return hourAngleSampling(s, errors);
  if (s.date.trim() === "") {
    errors.date = `${INPUT_LABELS.date}: choose a date (YYYY-MM-DD)`;
    return null;
  }
  const step = readNumberIn(s.stepMin, INPUT_LABELS.step, NIGHT_STEP_RANGE, "minutes");
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
  const read = readNumberIn(s.minElevation, INPUT_LABELS.minElevation, MIN_ELEVATION_RANGE, "degrees");
  if (read.ok) return read.value;
  errors.minElevation = read.message;
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
): Built<ObservationInput> {
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

/** Why a Sketchpad state's stations cannot be sketched with the chosen instrument, or null. */
function stationPickFailure(
  s: SketchState,
  r: RegistryLike,
  names: string[],
  found: ReturnType<typeof common>["found"],
): string | null {
  const label = INPUT_LABELS.stations;
  if (s.config !== "" && !r.configurations.some((c) => c.name === s.config)) {
    return `${label}: there is no configuration "${s.config}"`;
  }
  if (names.length < 2) return `${label}: pick at least 2 stations (${names.length} picked)`;
  if (found && names.length > found.instrument.maxTelescopes) {
    return (
      `${label}: ${found.instrument.name} combines at most ${plural(found.instrument.maxTelescopes, "telescope")} ` +
      `(${names.length} ${s.config !== "" ? `in ${s.config}` : "picked"}); pick fewer stations or another instrument`
    );
  }
  return null;
}

/** The POST /api/coverage body of a Sketchpad state (with the beam and model images). */
export function buildCoverageRequest(s: SketchState, r: RegistryLike): Built<CoverageBody> {
  const errors: FieldErrors = {};
  const parts = common(s, r, errors);
  const names = pickedStations(s, r);
  const failure = stationPickFailure(s, r, names, parts.found);
  if (failure) errors.stations = failure;
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
  const pool = poolStations(s.pool, r);
  if (!pool) errors.stations = `${INPUT_LABELS.stations}: choose a configuration or all stations`;
  const names = pool ?? [];
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
