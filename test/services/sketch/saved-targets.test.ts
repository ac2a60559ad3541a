import { describe, expect, it } from "vitest";
import { modelInputsOf } from "~/services/sketch/models";

describe("filling the Sketchpad from a saved target", () => {
  it("keeps a simple model's parameters", () => {
    const out = modelInputsOf({ type: "binary", separationMas: 12, positionAngleDeg: 40, fluxRatio: 0.4 });
    expect(out.second).toBeNull();
    expect(out.model.type).toBe("binary");
    expect([out.model.params.separationMas, out.model.params.positionAngleDeg, out.model.params.fluxRatio]).toEqual([
      "12",
      "40",
      "0.4",
    ]);
  });

  it("turns a two-component sum into a model and a second component relative to the first", () => {
    const out = modelInputsOf({
      type: "sum",
      components: [
        { model: { type: "uniformDisk", diameterMas: 3 }, flux: 2, offsetEastMas: 1, offsetNorthMas: 0 },
        { model: { type: "gaussian", fwhmMas: 8 }, flux: 1, offsetEastMas: 4, offsetNorthMas: -2 },
      ],
    });
    expect(out.model).toMatchObject({ type: "uniformDisk", params: { diameterMas: "3" } });
    expect(out.second).toMatchObject({
      type: "gaussian",
      flux: "0.5",
      east: "3",
      north: "-2",
      params: { fwhmMas: "8" },
    });
  });

  it("falls back to a point source for a model it cannot show", () => {
    expect(modelInputsOf({ type: "mystery" }).model.type).toBe("point");
  });
});
