/**
 * From the computation API's 400 answers back to the input that caused them (docs/cli.md): the
 * input a field path belongs to, the message with the path replaced by the input's label, and the
 * errors a page shows once its own checks and the API's answers are put together. Pure.
 */
import type { Built, FieldErrors, InputKey } from "./inputs";
import { INPUT_LABELS } from "./inputs";
import { isModelParam } from "./models";
import type { CommonState } from "./state";

type Mode = CommonState["sampling"];

/**
 * The input an API error belongs to, from the `field` of a 400 answer (docs/cli.md), e.g.
 * "target.decDeg" → "dec", "target.model.components[1].flux" → "second.flux", "night.date" → "date".
 */
export function inputForApiField(field: string | null, mode: Mode = "night"): InputKey {
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
    return isModelParam(second[2]) ? `second.${second[2]}` : "second";
  }
  const first = /^target\.model(?:\.components\[0\]\.model)?\.(\w+)/.exec(field);
  if (first) return isModelParam(first[1]) ? `model.${first[1]}` : "model";
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

/**
 * The API's message with its field path replaced by the input's label:
 * ("target.decDeg", "target.decDeg: must be between -90 and 90") → "Declination: must be between -90 and 90".
 */
export function apiErrorText(field: string | null, message: string, mode: Mode = "night"): string {
  const key = inputForApiField(field, mode);
  if (!field || key === "form") return message;
  const prefix = `${field}: `;
  const rest = message.startsWith(prefix) ? message.slice(prefix.length) : message;
  return `${INPUT_LABELS[key] ?? key}: ${rest}`;
}

/** A refusal of the API as the page keeps it: its message and the field path it names. */
export interface ApiRefusal {
  message: string;
  field: string | null;
}

/**
 * The errors a page shows: its own checks of the inputs first, then each API refusal beside the input
 * it names (unless that input has a message already), or as the form's error when it names none.
 */
export function inputErrors(
  built: Built<unknown>,
  refusals: readonly (ApiRefusal | null | undefined)[],
  mode: Mode,
): { errors: FieldErrors; formError: string | null } {
  const errors: FieldErrors = built.ok ? {} : { ...built.errors };
  let formError: string | null = null;
  for (const err of refusals) {
    if (!err) continue;
    const key = inputForApiField(err.field, mode);
    const text = apiErrorText(err.field, err.message, mode);
    if (key === "form") formError = text;
    else if (!errors[key]) errors[key] = text;
  }
  return { errors, formError };
}
