/**
 * One imaging preview from its stored request: simulate what the coverage would measure (seeded
 * noise), write those data as OIFITS 2, reconstruct an image from them and assess it against the model
 * (fidelity and verdict). Pure and synchronous (the engine only): the worker runs it on a thread of its
 * own (./preview.thread.ts) so it can report progress and be stopped.
 */
import {
  computeReconstruction,
  oifitsBytes,
  type ProgressCallback,
  parseReconstructRequest,
  type ReconstructResponse,
  simulateData,
  simulateResponse,
} from "~/engine";
import type { ImagingJobRequest } from "./schemas";

/** What the simulation made, shown beside the images. */
export interface SimulationSummary {
  vis2Count: number;
  closurePhaseCount: number;
  closurePhaseTriangles: "all" | "independent";
  vis2Relative: number;
  closurePhaseDeg: number;
  seed: number;
}

export type PreviewResult = ReconstructResponse & { simulation: SimulationSummary };

/** A preview that cannot be made from its request (no observable sample, …): the reason, for people. */
export class PreviewRefusal extends Error {}

/** Runs a preview; `progress` gets (iteration, reduced χ²) and returns true to stop. */
export function runPreview(
  request: ImagingJobRequest,
  progress: ProgressCallback,
  writtenUtc: string,
): { result: PreviewResult; oifits: Uint8Array } {
  const data = simulateData(request.simulate);
  const simulated = simulateResponse(data);
  if (simulated.vis2.length === 0) {
    throw new PreviewRefusal(
      "The target is never observable with this coverage (below the elevation limit, in daylight or beyond the delay lines): there is nothing to image.",
    );
  }
  const oifits = oifitsBytes(data, request.simulate, writtenUtc);
  const parsed = parseReconstructRequest({
    data: { vis2: simulated.vis2, closurePhases: simulated.closurePhases },
    image: { ...request.image, pixelMas: null },
    model: request.model,
  });
  if (!parsed.ok) throw new PreviewRefusal(parsed.message);
  const reconstruction = computeReconstruction(parsed.value, progress);
  const noise = request.simulate.noise;
  return {
    result: {
      ...reconstruction,
      simulation: {
        vis2Count: simulated.vis2.length,
        closurePhaseCount: simulated.closurePhases.length,
        closurePhaseTriangles: request.simulate.closurePhaseTriangles,
        vis2Relative: noise.vis2Relative,
        closurePhaseDeg: noise.closurePhaseDeg,
        seed: noise.seed,
      },
    },
    oifits,
  };
}
