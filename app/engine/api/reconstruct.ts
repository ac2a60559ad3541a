/**
 * Wire schema of `reconstruct` (CLI and POST /api/reconstruct): the data in the shape of the `simulate`
 * response, the image options and, optionally, the model the data came from (for the fidelity figure and
 * the verdict). Failures are one line `field.path: reason`; unknown keys are ignored (a whole simulate
 * response can be passed as `data`).
 */
import * as v from "valibot";
import type { PriorInput, ReconstructInput, StartInput } from "../imaging/inputs";
import {
  between,
  finiteNumber,
  nonNegative,
  type ParseResult,
  parseRequest,
  positive,
  positiveUpTo,
  wavelengthUpTo,
  wholeBetween,
} from "./blocks";
import { MAX_WAVELENGTH_M } from "./limits";
import { TargetModelSchema } from "./requests";

/** Most V² and closure-phase values one reconstruction accepts. */
export const MAX_RECONSTRUCT_VIS2 = 100_000;
export const MAX_RECONSTRUCT_CLOSURE_PHASES = 200_000;
export const DEFAULT_IMAGE_GRID = 64;
export const DEFAULT_MAX_ITERATIONS = 500;
export const DEFAULT_TOLERANCE = 1e-8;

const wavelength = wavelengthUpTo(MAX_WAVELENGTH_M);
const error = nonNegative();
const stations = v.optional(v.array(v.string("must be a string"), "must be an array of station names"));

export const Vis2DatumSchema = v.object(
  {
    stations,
    hourAngleH: v.optional(finiteNumber()),
    uM: finiteNumber(),
    vM: finiteNumber(),
    wavelengthM: wavelength,
    vis2: finiteNumber(),
    vis2Err: error,
  },
  "must be an object",
);

export const ClosurePhaseDatumSchema = v.object(
  {
    stations,
    hourAngleH: v.optional(finiteNumber()),
    wavelengthM: wavelength,
    u1M: finiteNumber(),
    v1M: finiteNumber(),
    u2M: finiteNumber(),
    v2M: finiteNumber(),
    closurePhaseDeg: finiteNumber(),
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
    gridSize: v.optional(wholeBetween(32, 128), DEFAULT_IMAGE_GRID),
    pixelMas: v.optional(v.nullable(positive()), null),
    regularizer: v.optional(
      v.picklist(["entropy", "totalVariation", "compactness"], "must be entropy, totalVariation or compactness"),
      "entropy",
    ),
    weight: v.optional(
      v.union([v.literal("auto"), between(0, 1e6)], 'must be a number between 0 and 1000000 or "auto"'),
      "auto",
    ),
    maxIterations: v.optional(wholeBetween(1, 10_000), DEFAULT_MAX_ITERATIONS),
    seed: v.optional(wholeBetween(0, 4294967295), 1),
    prior: v.optional(PriorSchema, { type: "flat" }),
    start: v.optional(StartSchema, { type: "gaussian", fwhmMas: null }),
    tolerance: v.optional(positiveUpTo(0.01), DEFAULT_TOLERANCE),
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

export type ReconstructRequest = ReconstructInput;

/** Validates a reconstruct request (already parsed from JSON). */
export function parseReconstructRequest(json: unknown): ParseResult<ReconstructRequest> {
  return parseRequest(ReconstructRequestSchema, json, imageScaleFailure);
}

/** The image scale comes from the longest baseline: the data need one of non-zero length. */
function imageScaleFailure(value: ReconstructInput): { field: string; message: string } | null {
  const longest = value.data.vis2.reduce((m, d) => Math.max(m, Math.hypot(d.uM, d.vM)), 0);
  return longest > 0 ? null : { field: "data.vis2", message: "every baseline has zero length: no image scale" };
}
