/**
 * Wire schema of `simulate` (CLI and POST /api/simulate): the coverage request plus the error model,
 * the choice of closure phases and the descriptive OIFITS fields. Failures are one line
 * `field.path: reason`, as for the other requests.
 */
import * as v from "valibot";
import type { ClosurePhaseTriangles, NoiseInput, OifitsOptions, SimulateInput } from "../imaging/inputs";
import { between, type ParseResult, parseRequest, trimmedName, wholeBetween } from "./blocks";
import { coverageRuleFailure, sampleCountBound } from "./limits";
import { CoverageRequestSchema } from "./requests";

/** Most V² values a simulation may produce (baselines × samples × channels). */
export const MAX_SIMULATED_VIS2 = 100_000;
/** Most closure phases a simulation may produce (triangles × samples × channels). */
export const MAX_SIMULATED_CLOSURE_PHASES = 200_000;

/** Defaults of the error model: 5 % on V² and 2° on closure phases (common practice for a well calibrated night). */
export const DEFAULT_NOISE: NoiseInput = { vis2Relative: 0.05, closurePhaseDeg: 2.0, seed: 1 };

export const DEFAULT_OIFITS: OifitsOptions = {
  arrayName: "FRINGE-DOCKET",
  instrumentName: "SIMULATED",
  telescopeDiameterM: 1.0,
};

const fitsText = v.pipe(trimmedName(68), v.regex(/^[\x20-\x7e]*$/, "must be printable ASCII"));

export const NoiseSchema = v.object(
  {
    vis2Relative: v.optional(between(0, 10), DEFAULT_NOISE.vis2Relative),
    closurePhaseDeg: v.optional(between(0, 180), DEFAULT_NOISE.closurePhaseDeg),
    seed: v.optional(wholeBetween(0, 4294967295), DEFAULT_NOISE.seed),
  },
  "must be an object",
);

export const OifitsOptionsSchema = v.object(
  {
    arrayName: v.optional(fitsText, DEFAULT_OIFITS.arrayName),
    instrumentName: v.optional(fitsText, DEFAULT_OIFITS.instrumentName),
    telescopeDiameterM: v.optional(between(0.01, 100), DEFAULT_OIFITS.telescopeDiameterM),
  },
  "must be an object",
);

/** Simulate request; use parseSimulateRequest, which adds the cross-field rules. */
export const SimulateRequestSchema = v.object(
  {
    ...CoverageRequestSchema.entries,
    noise: v.optional(NoiseSchema, { ...DEFAULT_NOISE }),
    closurePhaseTriangles: v.optional(
      v.picklist(["all", "independent"], "must be all or independent"),
      "all" as ClosurePhaseTriangles,
    ),
    oifits: v.optional(OifitsOptionsSchema, { ...DEFAULT_OIFITS }),
  },
  "request must be a JSON object",
);

export type SimulateRequest = SimulateInput;

/** Validates a simulate request (already parsed from JSON). */
export function parseSimulateRequest(json: unknown): ParseResult<SimulateRequest> {
  return parseRequest(
    SimulateRequestSchema,
    json,
    (value) => coverageRuleFailure(value) ?? simulationSizeFailure(value),
  );
}

/** The simulation's own size limits (the response lists every value). */
function simulationSizeFailure(r: SimulateInput): { field: string; message: string } | null {
  const n = r.stations.length;
  const s = sampleCountBound(r);
  const c = r.wavelengthsM.length;
  const vis2 = ((n * (n - 1)) / 2) * s * c;
  if (vis2 > MAX_SIMULATED_VIS2) {
    return {
      field: "wavelengthsM",
      message: `request too large: up to ${vis2} V² values (limit ${MAX_SIMULATED_VIS2}); use fewer samples or channels`,
    };
  }
  const triangles = r.closurePhaseTriangles === "all" ? (n * (n - 1) * (n - 2)) / 6 : ((n - 1) * (n - 2)) / 2;
  const cp = Math.max(0, triangles) * s * c;
  if (cp > MAX_SIMULATED_CLOSURE_PHASES) {
    return {
      field: "closurePhaseTriangles",
      message: `request too large: up to ${cp} closure phases (limit ${MAX_SIMULATED_CLOSURE_PHASES}); use fewer samples or channels, or "independent"`,
    };
  }
  return null;
}
