import { reconstructionRequest } from "@test/reconstruction";
import { SIX_STATIONS as SIX } from "@test/six-stations";
import { describe, expect, it } from "vitest";
import { computeReconstruction, type TargetModel } from "~/engine";

// Thresholds of the imaging preview (issue 14): binary separation within one pixel and position angle
// within 5°; disk diameter within 10 %; a sparse coverage clearly below a rich one in fidelity.
const SEPARATION_TOLERANCE_PIXELS = 1;
const POSITION_ANGLE_TOLERANCE_DEG = 5;
const DIAMETER_TOLERANCE = 0.1;
const RICH_FIDELITY_AT_LEAST = 0.9;
const SPARSE_FIDELITY_GAP_AT_LEAST = 0.3;

/** A good coverage: 6 stations × 30 hour angles × 8 channels; a sparse one: 3 stations × 3 × 1. */
function reconstruct(model: TargetModel, sparse = false, image: Record<string, unknown> = {}) {
  const observing = {
    stations: sparse ? [SIX[0], SIX[3], SIX[4]] : SIX,
    wavelengthsM: sparse ? [1.65e-6] : Array.from({ length: 8 }, (_, i) => 1.5e-6 + (0.9e-6 * i) / 7),
    hourAnglesH: sparse ? [-1, 0, 1] : Array.from({ length: 30 }, (_, i) => -4 + (8 * i) / 29),
    closurePhaseTriangles: "independent",
    noise: { vis2Relative: 0.05, closurePhaseDeg: 2, seed: 3 },
  };
  return computeReconstruction(reconstructionRequest(model, observing, image));
}

describe("reconstruction of synthetic targets from a good coverage", { timeout: 120_000 }, () => {
  it("recovers a binary's separation and position angle", () => {
    const model: TargetModel = { type: "binary", separationMas: 2.5, positionAngleDeg: 56, fluxRatio: 0.5 };
    const out = reconstruct(model);
    // the contract's image: gridSize² non-negative values summing to 1
    expect(out.gridSize).toBe(64);
    expect(out.image).toHaveLength(64 * 64);
    expect(out.image.every((v) => v >= 0)).toBe(true);
    expect(out.image.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 8);
    const b = out.fidelity!.binary!;
    expect(Math.abs(b.separationMas - 2.5) / out.pixelMas).toBeLessThanOrEqual(SEPARATION_TOLERANCE_PIXELS);
    expect(Math.abs(b.positionAngleDeg - 56)).toBeLessThanOrEqual(POSITION_ANGLE_TOLERANCE_DEG);
    expect(out.fidelity!.verdict).toBe("the coverage recovers the binary's separation and position angle");
    expect(out.fidelity!.recovered).toBe(true);
    expect(out.chi2Vis2).toBeLessThan(3);
    expect(out.chi2ClosurePhase).toBeLessThan(3);
  });

  it("recovers a uniform disk's diameter", () => {
    const model: TargetModel = { type: "uniformDisk", diameterMas: 1.4 };
    const out = reconstruct(model);
    expect(Math.abs(out.fidelity!.diameterMas! - 1.4) / 1.4).toBeLessThanOrEqual(DIAMETER_TOLERANCE);
    expect(out.fidelity!.verdict).toBe("the coverage recovers the disk's diameter");
    expect(out.fidelity!.ncc).toBeGreaterThan(RICH_FIDELITY_AT_LEAST);
  });

  it("gives a clearly lower fidelity from a sparse coverage than from a rich one", () => {
    const model: TargetModel = {
      type: "sum",
      components: [
        { model: { type: "uniformDisk", diameterMas: 1.2 }, flux: 1, offsetEastMas: 0, offsetNorthMas: 0 },
        { model: { type: "gaussian", fwhmMas: 0.5 }, flux: 0.35, offsetEastMas: 2.1, offsetNorthMas: -1.4 },
      ],
    };
    const rich = reconstruct(model).fidelity!;
    const sparse = reconstruct(model, true).fidelity!;
    expect(rich.ncc).toBeGreaterThanOrEqual(RICH_FIDELITY_AT_LEAST);
    expect(rich.ncc - sparse.ncc).toBeGreaterThanOrEqual(SPARSE_FIDELITY_GAP_AT_LEAST);
    expect(sparse.verdict).not.toBe(rich.verdict);
  });

  it("reconstructs with each regularizer at a given weight, reproducibly from the seed", () => {
    const model: TargetModel = { type: "binary", separationMas: 2.5, positionAngleDeg: 56, fluxRatio: 0.5 };
    for (const regularizer of ["totalVariation", "compactness"] as const) {
      const out = reconstruct(model, false, { regularizer, weight: 0.1, gridSize: 48, maxIterations: 150 });
      expect(out.gridSize).toBe(48);
      expect(out.weight).toBe(0.1);
      expect(out.weightAuto).toBe(false);
      expect(out.fidelity!.recovered, regularizer).toBe(true);
    }
    const a = reconstruct(model, false, { weight: 0.1, maxIterations: 40, seed: 9 });
    const b = reconstruct(model, false, { weight: 0.1, maxIterations: 40, seed: 9 });
    expect(a.image).toEqual(b.image);
  });
});
