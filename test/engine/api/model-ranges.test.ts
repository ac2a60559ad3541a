import { goodCoverageRequest as good } from "@test/coverage-request";
import * as v from "valibot";
import { describe, expect, it } from "vitest";
import { MODEL_RANGES, parseCoverageRequest, parseTrianglesRequest, rangeText, TargetModelSchema } from "~/engine";

/** The API's answer to the good request with its model replaced. */
function withModel(model: unknown) {
  const r = good();
  r.target.model = model;
  return parseCoverageRequest(r);
}

// The limits are the ones stated in app/engine/api/model-ranges.ts (1″: the field a metre-class
// telescope passes at 2 µm, from memory); these tests check that every path applies them alike.
describe("physical ranges of a target model", () => {
  it("refuses an absurd size naming the field and the range", () => {
    const out = withModel({ type: "uniformDisk", diameterMas: 1e9 });
    expect(out).toEqual({
      ok: false,
      field: "target.model.diameterMas",
      message: "target.model.diameterMas: must be above 0 and at most 1000 mas (got 1000000000 mas)",
    });
    const tri = parseTrianglesRequest({
      ...good(),
      stations: good().stations,
      target: { ...good().target, model: { type: "gaussian", fwhmMas: 5000 } },
    });
    expect(!tri.ok && tri.field).toBe("target.model.fwhmMas");
  });

  it("checks each parameter and a sum's components at their own path", () => {
    const cases: [unknown, string, string][] = [
      [
        { type: "binary", separationMas: 2000, positionAngleDeg: 0, fluxRatio: 0.5 },
        "separationMas",
        "from 0 to 1000 mas (got 2000 mas)",
      ],
      [
        { type: "binary", separationMas: 2, positionAngleDeg: 720, fluxRatio: 0.5 },
        "positionAngleDeg",
        "from -360° to 360° (got 720°)",
      ],
      [
        { type: "binary", separationMas: 2, positionAngleDeg: 0, fluxRatio: 1e6 },
        "fluxRatio",
        "from 0 to 100 (got 1000000)",
      ],
      [{ type: "ring", diameterMas: 1001 }, "diameterMas", "above 0 and at most 1000 mas (got 1001 mas)"],
    ];
    for (const [model, key, range] of cases) {
      const out = withModel(model);
      expect(out).toMatchObject({
        ok: false,
        field: `target.model.${key}`,
        message: `target.model.${key}: must be ${range}`,
      });
    }
    const sum = (second: Record<string, unknown>) => ({
      type: "sum",
      components: [
        { model: { type: "point" }, flux: 1 },
        { model: { type: "point" }, flux: 0.5, offsetEastMas: 0, offsetNorthMas: 0, ...second },
      ],
    });
    expect(withModel(sum({ flux: 5000 }))).toMatchObject({ field: "target.model.components[1].flux" });
    expect(withModel(sum({ offsetNorthMas: -1500 }))).toMatchObject({
      field: "target.model.components[1].offsetNorthMas",
      message: "target.model.components[1].offsetNorthMas: must be from -1000 to 1000 mas (got -1500 mas)",
    });
    expect(withModel(sum({ model: { type: "uniformDisk", diameterMas: 1e4 } }))).toMatchObject({
      field: "target.model.components[1].model.diameterMas",
    });
  });

  it("accepts the edges of every range, and the same schema guards saved models", () => {
    expect(withModel({ type: "uniformDisk", diameterMas: 1000 }).ok).toBe(true);
    expect(withModel({ type: "binary", separationMas: 0, positionAngleDeg: -360, fluxRatio: 100 }).ok).toBe(true);
    expect(withModel({ type: "limbDarkenedDisk", diameterMas: 0.001, coefficient: 1 }).ok).toBe(true);
    expect(v.safeParse(TargetModelSchema, { type: "gaussian", fwhmMas: 1e5 }).success).toBe(false);
    expect(rangeText(MODEL_RANGES.diameterMas)).toBe("above 0 and at most 1000 mas");
    expect(rangeText(MODEL_RANGES.positionAngleDeg)).toBe("from -360° to 360°");
  });
});
