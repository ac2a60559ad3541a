/**
 * Wire schema of `reconstruct` (CLI and POST /api/reconstruct): the data in the shape of the `simulate`
 * response, the image options and, optionally, the model the data came from (for the fidelity figure and
 * the verdict). Failures are one line `field.path: reason`; unknown keys are ignored (a whole simulate
 * response can be passed as `data`).
 */
import * as v from "valibot";
import type {
  ClosurePhaseDatum,
  ImageOptions,
  ImagingData,
  PriorInput,
  ReconstructInput,
  StartInput,
  Vis2Datum,
} from "../imaging/inputs";
import type { TargetModel } from "../inputs";
import { formatIssues, MAX_WAVELENGTH_M, type ParseResult, TargetModelSchema } from "./requests";

/** Most V² and closure-phase values one reconstruction accepts. */
export const MAX_RECONSTRUCT_VIS2 = 100_000;
export const MAX_RECONSTRUCT_CLOSURE_PHASES = 200_000;
export const DEFAULT_IMAGE_GRID = 64;
export const DEFAULT_MAX_ITERATIONS = 500;
export const DEFAULT_TOLERANCE = 1e-8;

const finite = () => v.pipe(v.number("must be a number"), v.finite("must be a finite number"));
const range = (min: number, max: number) =>
  v.pipe(
    finite(),
    v.minValue(min, `must be between ${min} and ${max}`),
    v.maxValue(max, `must be between ${min} and ${max}`),
  );
const integer = (min: number, max: number) =>
  v.pipe(
    v.number("must be a number"),
    v.integer("must be a whole number"),
    v.minValue(min, `must be between ${min} and ${max}`),
    v.maxValue(max, `must be between ${min} and ${max}`),
  );
const positive = () => v.pipe(finite(), v.gtValue(0, "must be positive"));
const wavelength = v.pipe(
  positive(),
  v.maxValue(MAX_WAVELENGTH_M, `must be at most ${MAX_WAVELENGTH_M} (wavelengths are in metres)`),
);
const error = v.pipe(finite(), v.minValue(0, "must be zero or positive"));
const stations = v.optional(v.array(v.string("must be a string"), "must be an array of station names"));

export const Vis2DatumSchema = v.object(
  {
    stations,
    hourAngleH: v.optional(finite()),
    uM: finite(),
    vM: finite(),
    wavelengthM: wavelength,
    vis2: finite(),
    vis2Err: error,
  },
  "must be an object",
);

export const ClosurePhaseDatumSchema = v.object(
  {
    stations,
    hourAngleH: v.optional(finite()),
    wavelengthM: wavelength,
    u1M: finite(),
    v1M: finite(),
    u2M: finite(),
    v2M: finite(),
    closurePhaseDeg: finite(),
    closurePhaseErrDeg: error,
  },
  "must be an object",
);

export const ImagingDataSchema = v.object(
  {
    vis2: v.pipe(
      v.array(Vis2DatumSchema, "must be an array of V² measurements"),
      v.minLength(1, "must have at least one V² measurement"),
      v.maxLength(MAX_RECONSTRUCT_VIS2, `must have at most ${MAX_RECONSTRUCT_VIS2} values`),
    ),
    closurePhases: v.optional(
      v.pipe(
        v.array(ClosurePhaseDatumSchema, "must be an array of closure-phase measurements"),
        v.maxLength(MAX_RECONSTRUCT_CLOSURE_PHASES, `must have at most ${MAX_RECONSTRUCT_CLOSURE_PHASES} values`),
      ),
      [],
    ),
  },
  "must be an object",
);

const PriorSchema: v.GenericSchema<unknown, PriorInput> = v.variant(
  "type",
  [v.object({ type: v.literal("flat") }), v.object({ type: v.literal("gaussian"), fwhmMas: positive() })],
  "must be flat or gaussian",
);

const StartSchema: v.GenericSchema<unknown, StartInput> = v.variant(
  "type",
  [
    v.object({ type: v.literal("flat") }),
    v.object({ type: v.literal("gaussian"), fwhmMas: v.optional(v.nullable(positive()), null) }),
    v.object({ type: v.literal("dirty") }),
  ],
  "must be flat, gaussian or dirty",
);

export const ImageOptionsSchema = v.object(
  {
    gridSize: v.optional(integer(32, 128), DEFAULT_IMAGE_GRID),
    pixelMas: v.optional(v.nullable(positive()), null),
    regularizer: v.optional(
      v.picklist(["entropy", "totalVariation", "compactness"], "must be entropy, totalVariation or compactness"),
      "entropy",
    ),
    weight: v.optional(
      v.union([v.literal("auto"), range(0, 1e6)], 'must be a number between 0 and 1000000 or "auto"'),
      "auto",
    ),
    maxIterations: v.optional(integer(1, 10_000), DEFAULT_MAX_ITERATIONS),
    seed: v.optional(integer(0, 4294967295), 1),
    prior: v.optional(PriorSchema, { type: "flat" }),
    start: v.optional(StartSchema, { type: "gaussian", fwhmMas: null }),
    tolerance: v.optional(v.pipe(positive(), v.maxValue(0.01, "must be at most 0.01")), DEFAULT_TOLERANCE),
    closurePhaseWeighting: v.optional(v.picklist(["amplitude", "given"], "must be amplitude or given"), "amplitude"),
  },
  "must be an object",
);

export const ReconstructRequestSchema = v.object(
  {
    data: ImagingDataSchema,
    image: v.optional(ImageOptionsSchema, {}),
    model: v.optional(v.nullable(TargetModelSchema), null),
  },
  "request must be a JSON object",
);

type Same<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
const schemaMatchesInputs: [
  Same<v.InferOutput<typeof Vis2DatumSchema>, Vis2Datum>,
  Same<v.InferOutput<typeof ClosurePhaseDatumSchema>, ClosurePhaseDatum>,
  Same<v.InferOutput<typeof ImagingDataSchema>, ImagingData>,
  Same<v.InferOutput<typeof ImageOptionsSchema>, ImageOptions>,
  Same<v.InferOutput<typeof ReconstructRequestSchema>, ReconstructInput>,
  Same<v.InferOutput<typeof TargetModelSchema>, TargetModel>,
] = [true, true, true, true, true, true];
void schemaMatchesInputs;

export type ReconstructRequest = ReconstructInput;

/** Validates a reconstruct request (already parsed from JSON). */
export function parseReconstructRequest(json: unknown): ParseResult<ReconstructRequest> {
  if (typeof json !== "object" || json === null || Array.isArray(json)) {
    return { ok: false, message: "request must be a JSON object", field: null };
  }
  const result = v.safeParse(ReconstructRequestSchema, json);
  if (!result.success) return { ok: false, ...formatIssues(result.issues) };
  const value = result.output;
  const longest = value.data.vis2.reduce((m, d) => Math.max(m, Math.hypot(d.uM, d.vM)), 0);
  if (!(longest > 0)) {
    return { ok: false, message: "data.vis2: every baseline has zero length: no image scale", field: "data.vis2" };
  }
  return { ok: true, value };
}
