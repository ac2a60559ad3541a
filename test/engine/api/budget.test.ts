import { costliestCoverageRequest, costliestTrianglesRequest, typicalCoverageRequest } from "@test/compute-requests";
import { goodCoverageRequest as good } from "@test/coverage-request";
import * as v from "valibot";
import { describe, expect, it } from "vitest";
import { DEMO_STATIONS } from "~/db/seed/scenario";
import {
  computeCoverage,
  coverageBudgetFailure,
  coverageCost,
  DEG_TO_RAD,
  longestNightMinutes,
  MAX_MODEL_COMPONENTS,
  MAX_SUM_DEPTH,
  modelShape,
  nightEvents,
  parseCoverageRequest,
  parseTrianglesRequest,
  rankTriangles,
  TargetModelSchema,
  trianglesBudgetFailure,
  trianglesCost,
} from "~/engine";

const point = { type: "point" };
const sumOf = (models: unknown[]) => ({ type: "sum", components: models.map((model) => ({ model, flux: 1 })) });

/** A sum nested `depth` deep around a point, written as JSON text (JSON.stringify itself recurses). */
const nestedText = (depth: number) =>
  `${'{"type":"sum","components":[{"flux":1,"model":'.repeat(depth)}{"type":"point"}${"}]}".repeat(depth)}`;

function parsed(body: unknown) {
  const out = parseCoverageRequest(body);
  if (!out.ok) throw new Error(out.message);
  return out.value;
}

/** A coverage request of n demo stations × hour angles × channels (every sample observable). */
function sized(n: number, samples: number, channels: number, model: unknown = point) {
  return {
    ...good(),
    stations: DEMO_STATIONS.slice(0, n).map((s) => ({ ...s })),
    target: { raDeg: 201.37, decDeg: -30.2, model },
    hourAnglesH: Array.from({ length: samples }, (_, i) => -4 + (8 * i) / Math.max(1, samples - 1)),
    wavelengthsM: Array.from({ length: channels }, (_, i) => 1.5e-6 + i * 1e-9),
    minElevationDeg: 0,
    beam: null,
  };
}

describe("model shape: sum nesting and components in all", () => {
  it("counts the plain models at every depth and the levels of sums", () => {
    expect(modelShape(point)).toEqual({ components: 1, sumDepth: 0 });
    expect(modelShape(sumOf([point, sumOf([point, point])]))).toEqual({ components: 3, sumDepth: 2 });
  });

  it(`accepts ${MAX_SUM_DEPTH} levels of sums and refuses ${MAX_SUM_DEPTH + 1}`, () => {
    expect(v.safeParse(TargetModelSchema, JSON.parse(nestedText(MAX_SUM_DEPTH))).success).toBe(true);
    const r = good();
    r.target.model = JSON.parse(nestedText(MAX_SUM_DEPTH + 1));
    expect(parseCoverageRequest(r)).toEqual({
      ok: false,
      message: "target.model: sums nested 5 deep (at most 4 levels of sums)",
      field: "target.model",
    });
  });

  it("refuses a sum nested 1000 deep, and 45 000 deep (a 2 MB body), with the field and no stack overflow", () => {
    for (const [depth, shown] of [
      [1000, "1 000"],
      [45_000, "45 000"],
    ] as const) {
      const text = `{"site":{"latitudeDeg":-31.4,"longitudeDeg":-68.9},"stations":[{"name":"A","eastM":0,"northM":0},{"name":"B","eastM":10,"northM":0}],"target":{"raDeg":1,"decDeg":-30,"model":${nestedText(depth)}},"wavelengthsM":[1.65e-6],"hourAnglesH":[0]}`;
      if (depth === 45_000) expect(text.length).toBeGreaterThan(2_000_000);
      const out = parseCoverageRequest(JSON.parse(text));
      expect(out).toEqual({
        ok: false,
        message: `target.model: sums nested ${shown} deep (at most 4 levels of sums)`,
        field: "target.model",
      });
      expect(parseTrianglesRequest(JSON.parse(text)).ok).toBe(false);
    }
  });

  it("refuses the 2 500-component model (50 sums of 50) of the issue, counting nested components", () => {
    const r = good();
    r.target.model = sumOf(Array.from({ length: 50 }, () => sumOf(Array.from({ length: 50 }, () => point))));
    expect(parseCoverageRequest(r)).toEqual({
      ok: false,
      message: "target.model: 2 500 components in all, counting those of nested sums (at most 50)",
      field: "target.model",
    });
  });

  it(`accepts ${MAX_MODEL_COMPONENTS} components over two levels and refuses one more`, () => {
    const r = good();
    r.target.model = sumOf([
      sumOf(Array.from({ length: 25 }, () => point)),
      ...Array.from({ length: 25 }, () => point),
    ]);
    expect(parseCoverageRequest(r).ok).toBe(true);
    r.target.model.components.push({ model: point, flux: 1 });
    const out = parseCoverageRequest(r);
    expect(out.ok).toBe(false);
    if (!out.ok)
      expect(out.message).toBe("target.model: 51 components in all, counting those of nested sums (at most 50)");
  });
});

describe("cost budget of a coverage request", () => {
  it("refuses uv points × components over 10 000 000 component evaluations, naming the model", () => {
    // 15 baselines × 667 samples × 100 channels = 1 000 500 uv points; × 10 components just over the limit.
    const ten = sumOf(Array.from({ length: 10 }, () => ({ type: "uniformDisk", diameterMas: 1 })));
    expect(coverageBudgetFailure(parsed(sized(6, 667, 100, ten)))).toEqual({
      field: "target.model",
      message:
        "target.model: 10 components × 1 000 500 uv points = 10 005 000 component evaluations (limit 10 000 000); " +
        "use fewer components, stations, samples or channels",
    });
    // 666 samples: 9 990 000 component evaluations, accepted.
    expect(coverageBudgetFailure(parsed(sized(6, 666, 100, ten)))).toBeNull();
  });

  it("refuses a response estimated over 48 MB, naming the sampling", () => {
    // The request with a point model: 10 stations × 4 000 hour angles, one channel (46.6 MB measured).
    const failure = coverageBudgetFailure(parsed(sized(10, 4000, 1)));
    expect(failure?.field).toBe("hourAnglesH");
    expect(failure?.message).toBe(
      "hourAnglesH: the response would be about 49.8 MB (180 000 uv points and 480 000 closure phases from " +
        "4 000 samples) (limit 48 MB); use fewer samples, channels or stations",
    );
    const night = { ...sized(10, 1, 1), hourAnglesH: undefined, night: { date: "2027-03-15", stepMin: 0.1 } };
    expect(coverageBudgetFailure(parsed(night))?.field).toBe("night.stepMin");
  });

  it("accepts the benchmark case, the Sketchpad's default request and the costliest request of the load test", () => {
    // bench/run.ts (a): 6 stations × 600 hour angles × 100 channels, a sum of two disks.
    const twoDisks = sumOf([
      { type: "uniformDisk", diameterMas: 1.2 },
      { type: "uniformDisk", diameterMas: 0.6 },
    ]);
    expect(coverageBudgetFailure(parsed(sized(6, 600, 100, twoDisks)))).toBeNull();
    expect(coverageBudgetFailure(parsed(typicalCoverageRequest()))).toBeNull();
    const costliest = parsed(costliestCoverageRequest());
    expect(coverageBudgetFailure(costliest)).toBeNull();
    expect(coverageCost(costliest)).toMatchObject({ componentEvaluations: 9_900_000, beamCells: 2048 ** 2 });
  });

  it("estimates at least the length of the answer actually written (an upper bound)", () => {
    // Independent check: the estimate against JSON.stringify of the computed answer.
    const asymmetric = sumOf([
      { type: "uniformDisk", diameterMas: 2 },
      { type: "binary", separationMas: 3, positionAngleDeg: 40, fluxRatio: 0.3 },
    ]);
    const cases = [
      sized(6, 50, 20, asymmetric),
      sized(12, 40, 3, asymmetric),
      { ...sized(4, 1, 8, asymmetric), hourAnglesH: undefined, night: { date: "2027-03-15", stepMin: 10 } },
      { ...sized(5, 30, 2, asymmetric), beam: { gridSize: 128, includeImages: true } },
      typicalCoverageRequest(),
    ];
    for (const body of cases) {
      const req = parsed(body);
      const actual = JSON.stringify(computeCoverage(req)).length;
      const estimate = coverageCost(req).responseBytes;
      expect(estimate).toBeGreaterThanOrEqual(actual);
      expect(estimate).toBeLessThan(4 * actual + 40_000);
    }
  });
});

describe("cost budget of a triangle-finder request", () => {
  const tri = (body: unknown) => {
    const out = parseTrianglesRequest(body);
    if (!out.ok) throw new Error(out.message);
    return out.value;
  };

  it("refuses more than 4 000 000 closure phases to rank, naming the stations", () => {
    // 24 stations: 2 024 triangles × 248 samples × 8 channels = 4 015 616.
    expect(trianglesBudgetFailure(tri({ ...sized(24, 248, 8), maxTriangles: 10 }))).toEqual({
      field: "stations",
      message:
        "stations: 2 024 triangles × 248 samples × 8 wavelengths = 4 015 616 closure phases to rank " +
        "(limit 4 000 000); use fewer stations, samples or channels",
    });
    const costliest = tri(costliestTrianglesRequest());
    expect(trianglesBudgetFailure(costliest)).toBeNull();
    expect(trianglesCost(costliest).closurePhases).toBe(3_999_424);
  });

  it("applies the component evaluations to the triangle finder too", () => {
    const forty = sumOf(Array.from({ length: 40 }, () => point));
    expect(trianglesBudgetFailure(tri({ ...sized(12, 200, 20, forty), maxTriangles: 5 }))?.message).toMatch(
      /^target\.model: 40 components × 264 000 uv points = 10 560 000 component evaluations \(limit 10 000 000\)/,
    );
    expect(rankTriangles(tri({ ...sized(4, 5, 1, forty), maxTriangles: 5 })).triangles).toHaveLength(4);
  });
});

describe("samples of a night, counted before computing", () => {
  it("bounds every astronomical night of the year at a latitude (checked against the engine's twilight times)", () => {
    // Independent method: the dark interval (Sun below −18°) the engine computes for each night of 2027.
    for (const latitudeDeg of [-31.4, 0, 20, -45, 52]) {
      const bound = longestNightMinutes(latitudeDeg);
      let longest = 0;
      for (let day = 0; day < 365; day += 3) {
        const t = new Date(Date.UTC(2027, 0, 1 + day));
        const date = { year: t.getUTCFullYear(), month: t.getUTCMonth() + 1, day: t.getUTCDate() };
        const ev = nightEvents(date, latitudeDeg * DEG_TO_RAD, -68.9 * DEG_TO_RAD);
        if (ev.darkStartJd !== null && ev.darkEndJd !== null)
          longest = Math.max(longest, (ev.darkEndJd - ev.darkStartJd) * 1440);
      }
      expect(longest).toBeLessThanOrEqual(bound);
      expect(bound - longest).toBeLessThan(20);
    }
    // Near the pole the winter Sun stays below −18° all day (noon altitude 90° − 88° − 23.4° = −21.4°).
    expect(longestNightMinutes(88)).toBe(1440);
    expect(longestNightMinutes(80)).toBeLessThan(1440);
  });

  it("counts at least the samples the night sampling produces", () => {
    // The demo site's longest nights are near the June solstice (southern winter).
    for (const [date, stepMin, longest] of [
      ["2027-06-21", 1, true],
      ["2027-12-21", 5, false],
      ["2027-03-15", 0.5, false],
    ] as const) {
      const req = parsed({ ...sized(2, 1, 1), hourAnglesH: undefined, night: { date, stepMin } });
      const produced = computeCoverage(req).samples.length;
      expect(coverageCost(req).samples).toBeGreaterThanOrEqual(produced);
      if (longest) expect(coverageCost(req).samples).toBeLessThanOrEqual(produced + Math.ceil(20 / stepMin));
    }
  });
});
