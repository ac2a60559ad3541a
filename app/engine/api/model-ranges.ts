/**
 * The ranges a target model's parameters may take, checked wherever a model is validated (the
 * computation API, the command line, the Sketchpad and the Triangle finder, saved targets) and stated
 * in the pages' hints. The wire schema (requests.ts) checks the kind of each value first (a number,
 * positive, …); `withModelRanges` then refuses values no interferometer could make sense of, naming
 * the field and the allowed range, e.g. `target.model.diameterMas: must be above 0 and at most 1000 mas (got 1000000000 mas)`.
 *
 * Where the limits come from:
 * - angular sizes, separations and offsets up to 1000 mas (1″): an interferometer sees only the field
 *   of one telescope's diffraction pattern, λ/D, about 0.4″ for a 1 m telescope at 2.2 µm and 2″ at
 *   10 µm, and resolves out anything larger on every baseline; the largest stellar disks are a few
 *   tens of mas (from memory);
 * - position angles within ±360° (any angle has a representative there);
 * - binary flux ratio (secondary / primary) from 0 to 100: above 1 the secondary is the brighter;
 * - relative flux of a component of a sum above 0 and at most 1000;
 * - linear limb-darkening coefficient from 0 (uniform disk) to 1 (the law's own range).
 * Pure: no I/O.
 */
import * as v from "valibot";
import type { TargetModel } from "../inputs";

/** An allowed interval; `above` makes the lower end exclusive. */
export interface ParamRange {
  min: number;
  max: number;
  above?: boolean;
  /** Unit as the message writes it after a number ("mas", "°"), empty for none. */
  unit: string;
}

/** The ranges of the model parameters (by their names on the wire) and of a sum's components. */
export const MODEL_RANGES = {
  diameterMas: { min: 0, max: 1000, above: true, unit: "mas" },
  fwhmMas: { min: 0, max: 1000, above: true, unit: "mas" },
  coefficient: { min: 0, max: 1, unit: "" },
  separationMas: { min: 0, max: 1000, unit: "mas" },
  positionAngleDeg: { min: -360, max: 360, unit: "°" },
  fluxRatio: { min: 0, max: 100, unit: "" },
  flux: { min: 0, max: 1000, above: true, unit: "" },
  offsetEastMas: { min: -1000, max: 1000, unit: "mas" },
  offsetNorthMas: { min: -1000, max: 1000, unit: "mas" },
} as const satisfies Record<string, ParamRange>;

export type RangedParam = keyof typeof MODEL_RANGES;

const withUnit = (x: number, unit: string) => (unit === "" ? String(x) : unit === "°" ? `${x}°` : `${x} ${unit}`);

/** The range in words: "from 0 to 1000 mas", "from -360° to 360°", "above 0 and at most 1000 mas". */
export function rangeText(r: ParamRange): string {
  const low = r.unit === "°" ? `${r.min}°` : String(r.min);
  return r.above ? `above ${low} and at most ${withUnit(r.max, r.unit)}` : `from ${low} to ${withUnit(r.max, r.unit)}`;
}

/** Null when `x` lies in `r`, else what is wrong with it: "must be from 0 to 100 (got 250)". */
export function rangeFailure(x: number, r: ParamRange): string | null {
  const low = r.above ? !(x > r.min) : !(x >= r.min);
  if (!low && x <= r.max) return null;
  return `must be ${rangeText(r)} (got ${withUnit(x, r.unit)})`;
}

type Found = { path: (string | number)[]; message: string };

/** The first parameter of this level of a model outside its range (nested models are checked on their own). */
export function modelRangeFailure(model: TargetModel): Found | null {
  const params = model as unknown as Record<string, unknown>;
  for (const key of Object.keys(MODEL_RANGES) as RangedParam[]) {
    const x = params[key];
    if (typeof x !== "number") continue;
    const message = rangeFailure(x, MODEL_RANGES[key]);
    if (message) return { path: [key], message };
  }
  if (model.type === "sum") {
    for (const [i, c] of model.components.entries()) {
      for (const key of ["flux", "offsetEastMas", "offsetNorthMas"] as const) {
        const message = rangeFailure(c[key], MODEL_RANGES[key]);
        if (message) return { path: ["components", i, key], message };
      }
    }
  }
  return null;
}

/** The model schema `schema` with the ranges checked after it, the issue placed at the failing field. */
export function withModelRanges(schema: v.GenericSchema<unknown, TargetModel>): v.GenericSchema<unknown, TargetModel> {
  return v.pipe(
    schema,
    v.rawCheck(({ dataset, addIssue }) => {
      if (!dataset.typed) return;
      const found = modelRangeFailure(dataset.value);
      if (!found) return;
      let value: unknown = dataset.value;
      const path = found.path.map((key) => {
        const input = value;
        value = (input as Record<string | number, unknown>)[key];
        return typeof key === "number"
          ? ({ type: "array", origin: "value", input: input as unknown[], key, value } as const)
          : ({ type: "object", origin: "value", input: input as Record<string, unknown>, key, value } as const);
      });
      addIssue({ message: found.message, path: path as unknown as [v.IssuePathItem, ...v.IssuePathItem[]] });
    }),
  );
}
