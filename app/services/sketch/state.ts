/**
 * The inputs of the Sketchpad and the Triangle finder, kept exactly as typed (strings), and their
 * encoding in URL search parameters so a sketch can be shared by its address. Pure.
 *
 * Parameters (all optional; missing ones take the defaults given to the reader):
 *   name, ra, dec            target name and coordinates as typed
 *   date                     night (YYYY-MM-DD; the night that begins on that local evening)
 *   config | st              a configuration by name, or a free pick: st=C01,C05,X02
 *   pool                     Triangle finder: a configuration name, or "all"
 *   inst, band               instrument and band by name
 *   model, diam, fwhm, ld, sep, pa, ratio
 *                            model type and parameters (only the type's own parameters are written)
 *   c2, c2diam … c2ratio, c2flux, c2east, c2north
 *                            optional second component (the model becomes a two-component sum)
 *   step | ha=from,to,step   night sampling every `step` minutes, or an hour-angle range in hours
 *   minel, dl=off, wt, uv=m  minimum elevation, delay-line check off, beam weighting, uv plane in metres
 *   from=targets             opened from My targets: the page links back (and hands the mark on)
 */

import { href } from "react-router";
import type { BeamOptions } from "~/engine";
import { formatDeclination, formatRightAscension } from "~/lib/coordinates";
import {
  defaultModel,
  defaultSecond,
  isModelType,
  MODEL_PARAMS,
  MODEL_PARAMS_LIST,
  type ModelState,
  modelInputsOf,
  PARAM_INFO,
  type SavedTarget,
  type SecondComponentState,
  type SimpleModelType,
} from "./models";
import { raTransitingAtMidnight } from "./night";

export type Weighting = BeamOptions["weighting"];
export type SamplingMode = "night" | "hourAngle";

/** Inputs shared by both pages. */
export interface CommonState {
  name: string;
  ra: string;
  dec: string;
  date: string;
  instrument: string;
  band: string;
  model: ModelState;
  second: SecondComponentState | null;
  sampling: SamplingMode;
  stepMin: string;
  haFrom: string;
  haTo: string;
  haStep: string;
  /** Minimum elevation in degrees as typed; "" means the site's own. */
  minElevation: string;
  delayLines: boolean;
  /** The page this one was opened from, to link back to ("targets": My targets); absent for none. */
  from?: typeof FROM_MY_TARGETS;
}

/** The `from` of a Sketchpad or Triangle finder opened from My targets. */
export const FROM_MY_TARGETS = "targets";

export interface SketchState extends CommonState {
  /** Configuration name, or "" for a free pick of stations. */
  config: string;
  /** The free pick (used when config is ""). */
  stations: string[];
  weighting: Weighting;
  uvUnit: "mlambda" | "m";
}

export interface TriangleState extends CommonState {
  /** A configuration name, or ALL_STATIONS. */
  pool: string;
}

export const ALL_STATIONS = "all";

export const DEFAULT_STEP_MIN = "10";
export const STEP_CHOICES_MIN = ["2", "5", "10", "15", "20", "30"] as const;
const DEFAULT_HA = { from: "-4", to: "4", step: "0.25" };

/** Defaults that depend on the registry and today's date (the reader cannot know them). */
export interface StateDefaults {
  date: string;
  config: string;
  instrument: string;
  band: string;
}

function readModel(params: URLSearchParams, prefix: string, fallbackType: SimpleModelType): ModelState {
  const typeText = params.get(prefix === "" ? "model" : prefix);
  const model = defaultModel(isModelType(typeText) ? typeText : fallbackType);
  for (const p of MODEL_PARAMS_LIST) {
    const v = params.get(prefix + PARAM_INFO[p].urlKey);
    if (v !== null) model.params[p] = v;
  }
  return model;
}

function writeModel(out: URLSearchParams, model: ModelState, prefix: string) {
  out.set(prefix === "" ? "model" : prefix, model.type);
  for (const p of MODEL_PARAMS[model.type]) out.set(prefix + PARAM_INFO[p].urlKey, model.params[p]);
}

/** The second component of a two-component model, when there is one (c2…). */
function writeSecond(out: URLSearchParams, second: SecondComponentState | null) {
  if (!second) return;
  writeModel(out, second, "c2");
  out.set("c2flux", second.flux);
  out.set("c2east", second.east);
  out.set("c2north", second.north);
}

function readCommon(params: URLSearchParams, defaults: StateDefaults): CommonState {
  const get = (k: string, d: string) => params.get(k) ?? d;
  const c2 = params.get("c2");
  let second: SecondComponentState | null = null;
  if (isModelType(c2)) {
    const m = readModel(params, "c2", "gaussian");
    const base = defaultSecond();
    second = {
      ...m,
      flux: get("c2flux", base.flux),
      east: get("c2east", base.east),
      north: get("c2north", base.north),
    };
  }
  const ha = params.get("ha");
  let haParts = [DEFAULT_HA.from, DEFAULT_HA.to, DEFAULT_HA.step];
  if (ha !== null) {
    const parts = ha.split(",");
    haParts = [parts[0] ?? "", parts[1] ?? "", parts[2] ?? ""];
  }
  return {
    name: get("name", ""),
    ra: get("ra", ""),
    dec: get("dec", ""),
    date: get("date", defaults.date),
    instrument: get("inst", defaults.instrument),
    band: get("band", defaults.band),
    model: readModel(params, "", "uniformDisk"),
    second,
    sampling: ha !== null ? "hourAngle" : "night",
    stepMin: get("step", DEFAULT_STEP_MIN),
    haFrom: haParts[0],
    haTo: haParts[1],
    haStep: haParts[2],
    minElevation: get("minel", ""),
    delayLines: params.get("dl") !== "off",
    ...(params.get("from") === FROM_MY_TARGETS ? { from: FROM_MY_TARGETS } : {}),
  };
}

function writeCommon(out: URLSearchParams, s: CommonState) {
  if (s.name !== "") out.set("name", s.name);
  if (s.ra !== "") out.set("ra", s.ra);
  if (s.dec !== "") out.set("dec", s.dec);
  out.set("date", s.date);
  out.set("inst", s.instrument);
  out.set("band", s.band);
  writeModel(out, s.model, "");
  writeSecond(out, s.second);
  if (s.sampling === "hourAngle") out.set("ha", `${s.haFrom},${s.haTo},${s.haStep}`);
  else if (s.stepMin !== DEFAULT_STEP_MIN) out.set("step", s.stepMin);
  if (s.minElevation !== "") out.set("minel", s.minElevation);
  if (!s.delayLines) out.set("dl", "off");
  if (s.from) out.set("from", s.from);
}

/** Splits "C01, C05,X02" into distinct names in order. */
export function splitStationList(text: string | null): string[] {
  if (!text) return [];
  const out: string[] = [];
  for (const raw of text.split(",")) {
    const name = raw.trim();
    if (name !== "" && !out.includes(name)) out.push(name);
  }
  return out;
}

export function readSketchState(params: URLSearchParams, defaults: StateDefaults): SketchState {
  const st = params.get("st");
  const wt = params.get("wt");
  return {
    ...readCommon(params, defaults),
    config: st !== null ? "" : (params.get("config") ?? defaults.config),
    stations: splitStationList(st),
    weighting: wt === "uniform" || wt === "robust" ? wt : "natural",
    uvUnit: params.get("uv") === "m" ? "m" : "mlambda",
  };
}

export function writeSketchState(s: SketchState): URLSearchParams {
  const out = new URLSearchParams();
  writeCommon(out, s);
  if (s.config !== "") out.set("config", s.config);
  else out.set("st", s.stations.join(","));
  if (s.weighting !== "natural") out.set("wt", s.weighting);
  if (s.uvUnit === "m") out.set("uv", "m");
  return out;
}

export function readTriangleState(params: URLSearchParams, defaults: StateDefaults): TriangleState {
  return { ...readCommon(params, defaults), pool: params.get("pool") ?? defaults.config };
}

export function writeTriangleState(s: TriangleState): URLSearchParams {
  const out = new URLSearchParams();
  writeCommon(out, s);
  out.set("pool", s.pool);
  return out;
}

/** The Sketchpad address of a station pick with the target, model, date, band and sampling of `s`. */
export function sketchpadHref(s: CommonState, stations: readonly string[]): string {
  const state: SketchState = { ...s, config: "", stations: [...stations], weighting: "natural", uvUnit: "mlambda" };
  return `${href("/sketchpad")}?${writeSketchState(state).toString()}`;
}

/**
 * The Triangle finder's address for the target, model, date, band and sampling of a Sketchpad state,
 * with the sketch's configuration as the pool (every station for a free pick).
 */
export function trianglesHref(s: SketchState): string {
  const state: TriangleState = { ...s, pool: s.config !== "" ? s.config : ALL_STATIONS };
  return `${href("/triangles")}?${writeTriangleState(state).toString()}`;
}

/**
 * The Sketchpad address of one of My targets: its name, position and model (a sum of two components
 * as the model and its second component); every other input keeps the Sketchpad's default. The
 * Sketchpad then links back to My targets.
 */
export function targetSketchpadHref(t: SavedTarget): string {
  const out = new URLSearchParams();
  out.set("name", t.name);
  out.set("ra", formatRightAscension(t.raDeg, 2));
  out.set("dec", formatDeclination(t.decDeg, 1));
  const { model, second } = modelInputsOf(t.model);
  writeModel(out, model, "");
  writeSecond(out, second);
  out.set("from", FROM_MY_TARGETS);
  return `${href("/sketchpad")}?${out.toString()}`;
}

/**
 * Coordinates of a target that is up tonight: on the meridian at local midnight of the night of
 * `date`, 5° north of the zenith's declination rounded to the degree.
 */
export function exampleTarget(
  date: string,
  site: { latitudeDeg: number; longitudeDeg: number },
): Pick<CommonState, "ra" | "dec"> {
  return {
    ra: formatRightAscension(raTransitingAtMidnight(date, site.longitudeDeg), 1),
    dec: formatDeclination(Math.round(site.latitudeDeg) - 5, 0),
  };
}
