/**
 * The source model as the Sketchpad and the Triangle finder type it: a simple model type with its
 * parameters kept as strings, an optional second component, their defaults, and the inputs filled
 * from a saved target's stored model. Pure.
 */
import { MODEL_RANGES, type RangedParam, rangeText } from "~/engine";

export const SIMPLE_MODEL_TYPES = ["point", "uniformDisk", "gaussian", "limbDarkenedDisk", "ring", "binary"] as const;
export type SimpleModelType = (typeof SIMPLE_MODEL_TYPES)[number];

export const MODEL_PARAMS_LIST = [
  "diameterMas",
  "fwhmMas",
  "coefficient",
  "separationMas",
  "positionAngleDeg",
  "fluxRatio",
] as const;
export type ModelParam = (typeof MODEL_PARAMS_LIST)[number];

export const MODEL_LABELS: Record<SimpleModelType, string> = {
  point: "Point source",
  uniformDisk: "Uniform disk",
  gaussian: "Gaussian",
  limbDarkenedDisk: "Limb-darkened disk",
  ring: "Thin ring",
  binary: "Binary (two points)",
};

/** Parameters of each model type, in form order. */
export const MODEL_PARAMS: Record<SimpleModelType, readonly ModelParam[]> = {
  point: [],
  uniformDisk: ["diameterMas"],
  gaussian: ["fwhmMas"],
  limbDarkenedDisk: ["diameterMas", "coefficient"],
  ring: ["diameterMas"],
  binary: ["separationMas", "positionAngleDeg", "fluxRatio"],
};

const range = (p: RangedParam) => rangeText(MODEL_RANGES[p]);
const capital = (t: string) => t[0].toUpperCase() + t.slice(1);

export const PARAM_INFO: Record<
  ModelParam,
  { label: string; unit?: string; urlKey: string; fallback: string; hint: string }
> = {
  diameterMas: {
    label: "Diameter",
    unit: "mas",
    urlKey: "diam",
    fallback: "2",
    hint: `${capital(range("diameterMas"))}.`,
  },
  fwhmMas: { label: "FWHM", unit: "mas", urlKey: "fwhm", fallback: "2", hint: `${capital(range("fwhmMas"))}.` },
  coefficient: {
    label: "Limb-darkening coefficient",
    urlKey: "ld",
    fallback: "0.3",
    hint: `Linear law I(μ) = 1 − a(1 − μ); a ${range("coefficient")} (0: uniform disk).`,
  },
  separationMas: {
    label: "Separation",
    unit: "mas",
    urlKey: "sep",
    fallback: "4",
    hint: `${capital(range("separationMas"))}.`,
  },
  positionAngleDeg: {
    label: "Position angle",
    unit: "° east of north",
    urlKey: "pa",
    fallback: "60",
    hint: `${capital(range("positionAngleDeg"))}.`,
  },
  fluxRatio: {
    label: "Flux ratio",
    unit: "secondary / primary",
    urlKey: "ratio",
    fallback: "0.5",
    hint: `${capital(range("fluxRatio"))}; above 1 the secondary is the brighter.`,
  },
};

/** The second component's own inputs, the range each is checked against and its hint. */
export const SECOND_INFO = {
  flux: { label: "Relative flux", unit: "first component = 1", range: "flux", hint: `${capital(range("flux"))}.` },
  east: { label: "Offset east", unit: "mas", range: "offsetEastMas", hint: `${capital(range("offsetEastMas"))}.` },
  north: { label: "Offset north", unit: "mas", range: "offsetNorthMas", hint: `${capital(range("offsetNorthMas"))}.` },
} as const satisfies Record<string, { label: string; unit: string; range: RangedParam; hint: string }>;

export interface ModelState {
  type: SimpleModelType;
  /** Every parameter as typed; only the type's own ones are used. */
  params: Record<ModelParam, string>;
}

export interface SecondComponentState extends ModelState {
  /** Flux relative to the first component (which has flux 1). */
  flux: string;
  /** Offset of its centre from the phase centre, mas toward east and north. */
  east: string;
  north: string;
}

export function defaultModel(type: SimpleModelType = "uniformDisk"): ModelState {
  const params = Object.fromEntries(MODEL_PARAMS_LIST.map((p) => [p, PARAM_INFO[p].fallback])) as Record<
    ModelParam,
    string
  >;
  return { type, params };
}

export function defaultSecond(): SecondComponentState {
  return {
    ...defaultModel("gaussian"),
    params: { ...defaultModel().params, fwhmMas: "8" },
    flux: "0.2",
    east: "0",
    north: "0",
  };
}

export function isModelType(t: string | null): t is SimpleModelType {
  return t !== null && (SIMPLE_MODEL_TYPES as readonly string[]).includes(t);
}

/** True for the name of a model parameter (as the API's field paths spell it). */
export function isModelParam(x: string | undefined): x is ModelParam {
  return x !== undefined && x in PARAM_INFO;
}

/** A saved target as the Sketchpad and Triangle finder offer it ("From My targets"). */
export interface SavedTarget {
  id: number;
  name: string;
  raDeg: number;
  decDeg: number;
  model: { type: string; [key: string]: unknown };
}

function paramsFrom(model: { [key: string]: unknown }): Record<ModelParam, string> {
  const params = { ...defaultModel().params };
  for (const p of MODEL_PARAMS_LIST) {
    const x = model[p];
    if (typeof x === "number" && Number.isFinite(x)) params[p] = String(x);
  }
  return params;
}

/**
 * The model inputs for a stored model: simple types directly; a sum keeps its first two components
 * (the first at the phase centre, the second with its relative flux and offset). Anything else
 * falls back to a point source.
 */
export function modelInputsOf(model: SavedTarget["model"]): { model: ModelState; second: SecondComponentState | null } {
  if (isModelType(model.type)) return { model: { type: model.type, params: paramsFrom(model) }, second: null };
  const components = Array.isArray(model.components)
    ? (model.components as {
        model: SavedTarget["model"];
        flux: number;
        offsetEastMas?: number;
        offsetNorthMas?: number;
      }[])
    : [];
  const [a, b] = components;
  if (!a || !isModelType(a.model.type)) return { model: defaultModel("point"), second: null };
  const first: ModelState = { type: a.model.type, params: paramsFrom(a.model) };
  if (!b || !isModelType(b.model.type)) return { model: first, second: null };
  return {
    model: first,
    second: {
      type: b.model.type,
      params: paramsFrom(b.model),
      flux: String(b.flux / (a.flux || 1)),
      east: String((b.offsetEastMas ?? 0) - (a.offsetEastMas ?? 0)),
      north: String((b.offsetNorthMas ?? 0) - (a.offsetNorthMas ?? 0)),
    },
  };
}
