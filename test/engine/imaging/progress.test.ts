/**
 * The reconstruction's progress callback (used by the imaging-preview worker): called once per
 * optimizer iteration with the running count and the reduced χ², and a `true` answer stops the run.
 */
import { reconstructionRequest } from "@test/reconstruction";
import { SIX_STATIONS as SIX } from "@test/six-stations";
import { describe, expect, it } from "vitest";
import { computeReconstruction, type TargetModel } from "~/engine";

const model: TargetModel = { type: "binary", separationMas: 2.5, positionAngleDeg: 56, fluxRatio: 0.5 };

function request(image: Record<string, unknown>) {
  return reconstructionRequest(
    model,
    {
      stations: SIX,
      wavelengthsM: [1.6e-6, 1.7e-6],
      hourAnglesH: Array.from({ length: 12 }, (_, i) => -3 + (6 * i) / 11),
      noise: { vis2Relative: 0.05, closurePhaseDeg: 2, seed: 5 },
    },
    image,
  );
}

describe("reconstruction progress", { timeout: 60_000 }, () => {
  it("reports every iteration in order with a finite reduced χ²", () => {
    const seen: [number, number][] = [];
    const out = computeReconstruction(request({ gridSize: 32, weight: 1, maxIterations: 40 }), (i, chi2) => {
      seen.push([i, chi2]);
      return false;
    });
    expect(seen.length).toBe(out.iterations);
    expect(seen.map(([i]) => i)).toEqual(seen.map((_, k) => k + 1));
    for (const [, chi2] of seen) expect(Number.isFinite(chi2) && chi2 > 0).toBe(true);
  });

  it("stops when the callback answers true (a fixed weight and the automatic one alike)", () => {
    for (const weight of [1, "auto"] as const) {
      let calls = 0;
      const out = computeReconstruction(request({ gridSize: 32, weight, maxIterations: 200 }), () => ++calls >= 5);
      expect(out.stopReason, String(weight)).toBe("stopped");
      expect(out.iterations, String(weight)).toBe(5);
      expect(calls).toBe(5);
    }
  });
});
