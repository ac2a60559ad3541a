/**
 * What a person chooses for an imaging preview, and the start request of POST /api/imaging/jobs.
 * Pure: shared by the API, the worker and the panel (which shows the defaults stated here).
 */
import * as v from "valibot";
import { DEFAULT_NOISE, type Regularizer, type SimulateRequest, type TargetModel } from "~/engine";
import { MAX_ROW_ID } from "~/lib/not-found";

/**
 * Defaults: a 64² grid (pixel λ/(4 B_max)), maximum entropy with a flat prior, the weight found
 * automatically (reduced χ² ≈ 1), seed 1, and the error bars of the `simulate` contract's defaults:
 * 5 % on V² and 2° on closure phases (common practice for a well calibrated night), every closure phase.
 */
export const IMAGING_DEFAULTS = {
  gridSize: 64,
  regularizer: "entropy" as Regularizer,
  weight: "auto" as number | "auto",
  seed: 1,
  vis2Relative: DEFAULT_NOISE.vis2Relative,
  closurePhaseDeg: DEFAULT_NOISE.closurePhaseDeg,
  closurePhaseTriangles: "all" as "all" | "independent",
  maxIterations: 300,
};

export const REGULARIZER_LABELS: Record<Regularizer, string> = {
  entropy: "Maximum entropy (flat prior)",
  totalVariation: "Total variation (edge-preserving)",
  compactness: "Compactness (flux near the centre)",
};

const between = (name: string, min: number, max: number) =>
  v.pipe(
    v.number(`${name} must be a number`),
    v.finite(`${name} must be a finite number`),
    v.minValue(min, `${name} must be between ${min} and ${max}`),
    v.maxValue(max, `${name} must be between ${min} and ${max}`),
  );
const whole = (name: string, min: number, max: number) =>
  v.pipe(between(name, min, max), v.integer(`${name} must be a whole number`));

export const ImagingSettingsSchema = v.object(
  {
    gridSize: v.optional(whole("Grid size", 32, 128), IMAGING_DEFAULTS.gridSize),
    regularizer: v.optional(
      v.picklist(
        ["entropy", "totalVariation", "compactness"],
        "Regularizer must be entropy, totalVariation or compactness",
      ),
      IMAGING_DEFAULTS.regularizer,
    ),
    weight: v.optional(
      v.union([v.literal("auto"), between("Weight", 0, 1e6)], 'Weight must be "auto" or a number from 0 to 1000000'),
      IMAGING_DEFAULTS.weight,
    ),
    seed: v.optional(whole("Seed", 0, 4294967295), IMAGING_DEFAULTS.seed),
    vis2Relative: v.optional(between("V² error", 0, 1), IMAGING_DEFAULTS.vis2Relative),
    closurePhaseDeg: v.optional(between("Closure-phase error", 0, 90), IMAGING_DEFAULTS.closurePhaseDeg),
    closurePhaseTriangles: v.optional(
      v.picklist(["all", "independent"], "Closure phases must be all or independent"),
      IMAGING_DEFAULTS.closurePhaseTriangles,
    ),
    maxIterations: v.optional(whole("Iterations", 10, 1000), IMAGING_DEFAULTS.maxIterations),
  },
  "settings must be an object",
);
export type ImagingSettings = v.InferOutput<typeof ImagingSettingsSchema>;

const id = (name: string) =>
  v.pipe(
    v.number(`${name} must be a number`),
    v.integer(`${name} must be a whole number`),
    v.minValue(1, `${name} must be a positive number`),
    v.maxValue(MAX_ROW_ID, `${name} is not a number of ours`),
  );

export const StartImagingSchema = v.object(
  {
    source: v.variant(
      "kind",
      [
        /** A Sketchpad request: the `coverage` body the Sketchpad computes (its beam is ignored). */
        v.object({
          kind: v.literal("sketch"),
          coverage: v.record(v.string(), v.unknown(), "coverage must be an object"),
        }),
        v.object({ kind: v.literal("proposalTarget"), proposalId: id("proposalId"), targetId: id("targetId") }),
        /** The chair: every imaging target of the cycle's submitted proposals. */
        v.object({ kind: v.literal("cycle"), cycleId: id("cycleId") }),
      ],
      "source.kind must be sketch, proposalTarget or cycle",
    ),
    settings: v.optional(ImagingSettingsSchema, {}),
  },
  "request must be a JSON object",
);
export type StartImaging = v.InferOutput<typeof StartImagingSchema>;

/** What a job stores and the worker runs: the validated simulate request, the model, the image options. */
export interface ImagingJobRequest {
  simulate: SimulateRequest;
  model: TargetModel;
  image: { gridSize: number; regularizer: Regularizer; weight: number | "auto"; seed: number; maxIterations: number };
}

/** The job request of validated settings and a simulate request built from them (noise, triangles). */
export function jobRequestOf(simulate: SimulateRequest, settings: ImagingSettings): ImagingJobRequest {
  return {
    simulate,
    model: simulate.target.model,
    image: {
      gridSize: settings.gridSize,
      regularizer: settings.regularizer,
      weight: settings.weight,
      seed: settings.seed,
      maxIterations: settings.maxIterations,
    },
  };
}

/** The simulate request's JSON of a coverage body and the settings (noise, seed, triangles, no beam). */
export function simulateBodyOf(coverage: Record<string, unknown>, settings: ImagingSettings) {
  return {
    ...coverage,
    beam: null,
    noise: { vis2Relative: settings.vis2Relative, closurePhaseDeg: settings.closurePhaseDeg, seed: settings.seed },
    closurePhaseTriangles: settings.closurePhaseTriangles,
  };
}

export type ImagingStateName = "queued" | "running" | "done" | "failed" | "cancelled";

/** A job as GET /api/imaging/jobs/:id answers it (docs/api.md); `result` only there and when done. */
export interface ImagingJobJson {
  id: number;
  state: ImagingStateName;
  source: "sketch" | "proposalTarget";
  label: string;
  proposalTargetId: number | null;
  cycleBatchId: number | null;
  /** True for a reader who is not the owner (no Cancel). */
  readOnly: boolean;
  settings: ImagingJobRequest["image"] & {
    vis2Relative: number;
    closurePhaseDeg: number;
    closurePhaseTriangles: "all" | "independent";
  };
  model: TargetModel;
  progress: { iteration: number; chi2: number | null; iterationBudget: number };
  attempts: number;
  error: string | null;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
  hasOifits: boolean;
  result: Record<string, unknown> | null;
}
