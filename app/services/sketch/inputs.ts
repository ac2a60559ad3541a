/**
 * The inputs of the Sketchpad and the Triangle finder as the request builders see them: the name of
 * each input an error can be shown beside, its label, the reading of a typed number, and the
 * outcome of building a request. Pure.
 */
import { type ParamRange, rangeFailure } from "~/engine";
import { type ModelParam, PARAM_INFO } from "./models";

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

export type Built<T> =
  | { ok: true; body: T }
  /** `waiting`: nothing to compute yet (no target typed); the page shows a prompt, not errors. */
  | { ok: false; errors: FieldErrors; waiting: boolean };

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

/** A typed number checked against `range` (the API's own ranges, ~/engine); the message names the input. */
export function readNumberIn(
  text: string,
  label: string,
  range: ParamRange,
  unit?: string,
): { ok: true; value: number } | { ok: false; message: string } {
  const read = readNumber(text, label, unit);
  if (!read.ok) return read;
  const failure = rangeFailure(read.value, range);
  return failure ? { ok: false, message: `${label}: ${failure}` } : read;
}
