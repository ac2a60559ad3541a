/**
 * From the typed model inputs to the target model the API expects: one component, or with a second
 * component a two-component sum. Text that is not a number is reported beside its input. Pure.
 */
import { MODEL_RANGES, type RangedParam, type TargetModel } from "~/engine";
import { type FieldErrors, INPUT_LABELS, readNumberIn } from "./inputs";
import { MODEL_PARAMS, type ModelParam, type ModelState, PARAM_INFO, SECOND_INFO } from "./models";
import type { CommonState } from "./state";

/** A typed number checked against the range of the model parameter `param` (the API's own, ~/engine). */
export function readInRange(text: string, label: string, param: RangedParam, unit?: string) {
  return readNumberIn(text, label, MODEL_RANGES[param], unit);
}

/** The single model (no second component) as the API expects it, or the failing inputs. */
function simpleModel(m: ModelState, prefix: "model" | "second", errors: FieldErrors): TargetModel | null {
  const values: Partial<Record<ModelParam, number>> = {};
  let ok = true;
  for (const p of MODEL_PARAMS[m.type]) {
    const info = PARAM_INFO[p];
    const read = readInRange(m.params[p], info.label, p, info.unit);
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
  const sec = s.second;
  const own = (k: keyof typeof SECOND_INFO, unit?: string) =>
    readInRange(sec[k], INPUT_LABELS[`second.${k}`], SECOND_INFO[k].range, unit);
  const flux = own("flux");
  const east = own("east", "mas");
  const north = own("north", "mas");
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
