import { describe, expect, it } from "vitest";
import { DEMO_CONFIGURATIONS, DEMO_INSTRUMENTS, DEMO_SITE, DEMO_STATIONS } from "~/db/seed/scenario";
import { parseCoverageRequest, parseEphemerisRequest, parseTrianglesRequest } from "~/engine";
import { apiErrorText, inputForApiField } from "~/services/sketch/api-errors";
import { sizeFailure } from "~/services/sketch/limits";
import { modelFromState } from "~/services/sketch/model-input";
import type { RegistryLike } from "~/services/sketch/registry";
import {
  buildCoverageRequest,
  buildEphemerisRequest,
  buildTrianglesRequest,
  hourAngleList,
} from "~/services/sketch/request";
import { ALL_STATIONS, readSketchState, readTriangleState } from "~/services/sketch/state";

const registry: RegistryLike = {
  site: DEMO_SITE,
  stations: DEMO_STATIONS,
  configurations: DEMO_CONFIGURATIONS.map((c) => ({ name: c.name, stationNames: c.stations })),
  instruments: DEMO_INSTRUMENTS.map((i) => ({ name: i.name, maxTelescopes: i.maxTelescopes, bands: i.bands })),
};
const defaults = { date: "2027-03-15", config: "compact-3", instrument: "Brasa", band: "H" };
const sketch = (q: string) => readSketchState(new URLSearchParams(q), defaults);

/** The coverage body of the sketch at address `q`, which must build. */
function builtBody(q: string) {
  const built = buildCoverageRequest(sketch(q), registry);
  expect(built.ok).toBe(true);
  if (!built.ok) throw new Error(`the sketch did not build: ${JSON.stringify(built.errors)}`);
  return built.body;
}

/** The API's reading of a body sent as JSON. */
const sent = (body: unknown) => parseCoverageRequest(JSON.parse(JSON.stringify(body)));

describe("coverage request of a sketch", () => {
  it("builds a body the API accepts, with the configuration's stations in order and the band's channels", () => {
    const b = builtBody("name=Test&ra=05:36:12&dec=-01:12:07&model=uniformDisk&diam=3");
    expect(b.stations.map((s) => s.name)).toEqual(["C04", "C10", "C17"]);
    expect(b.target).toMatchObject({ name: "Test", model: { type: "uniformDisk", diameterMas: 3 } });
    // 05h36m12s × 15 = 84.05°; −(1 + 12/60 + 7/3600)° = −1.20194° (common practice).
    expect(b.target.raDeg).toBeCloseTo(84.05, 10);
    expect(b.target.decDeg).toBeCloseTo(-1.201944, 5);
    expect(b.wavelengthsM).toHaveLength(6);
    expect(b.night).toEqual({ date: "2027-03-15", stepMin: 10 });
    expect(b.minElevationDeg).toBe(30);
    expect(b.delayLineStrokeM).toBe(200);
    expect(b.beam).toEqual({ gridSize: 256, weighting: "natural", includeImages: true });
    expect(sent(b).ok).toBe(true);
  });

  it("uses a free pick in registry order, an hour-angle range and the options", () => {
    const body = builtBody("ra=84.05&dec=-1.2&st=X02,C01&ha=-2,2,1&dl=off&minel=45&wt=uniform");
    expect(body.stations.map((s) => s.name)).toEqual(["C01", "X02"]);
    expect(body.hourAnglesH).toEqual([-2, -1, 0, 1, 2]);
    expect(body.night).toBeUndefined();
    expect(body.delayLineStrokeM).toBeNull();
    expect(body.minElevationDeg).toBe(45);
    expect(body.beam?.weighting).toBe("uniform");
    expect(sent(body).ok).toBe(true);
  });

  it("waits quietly until a target is typed", () => {
    const built = buildCoverageRequest(sketch(""), registry);
    expect(built).toEqual({ ok: false, errors: {}, waiting: true });
  });

  it("names the input of every problem it can see before asking", () => {
    const built = buildCoverageRequest(sketch("ra=25:00:00&dec=-1&model=gaussian&fwhm=wide&st=C01&step=x"), registry);
    expect(built.ok).toBe(false);
    if (built.ok) return;
    expect(built.errors.ra).toBe("Right ascension: hours must be from 0 to 23 (got 25)");
    expect(built.errors["model.fwhmMas"]).toBe('FWHM: must be a number in mas (got "wide")');
    expect(built.errors.stations).toBe("Stations: pick at least 2 stations (1 picked)");
    expect(built.errors.step).toBe('Time step: must be a number in minutes (got "x")');
  });

  it("refuses more stations than the instrument combines", () => {
    // The mid-infrared demo combiner takes 4 telescopes; the extended configuration has 6.
    const built = buildCoverageRequest(sketch("ra=84&dec=-1&config=extended-6&inst=Ascua&band=N"), registry);
    expect(built.ok).toBe(false);
    if (built.ok) return;
    expect(built.errors.stations).toBe(
      "Stations: Ascua combines at most 4 telescopes (6 in extended-6); pick fewer stations or another instrument",
    );
  });

  it("checks the hour-angle range", () => {
    const back = buildCoverageRequest(sketch("ra=84&dec=-1&ha=3,-3,1"), registry);
    expect(!back.ok && back.errors.ha).toBe('Hour-angle range: "to" (-3 h) must not be before "from" (3 h)');
    const many = buildCoverageRequest(sketch("ra=84&dec=-1&ha=-12,12,0.001"), registry);
    expect(!many.ok && many.errors.ha).toMatch(/^Hour-angle range: 24001 samples; at most 2000/);
    expect(hourAngleList(-1, 1, 0.5)).toEqual([-1, -0.5, 0, 0.5, 1]);
    expect(hourAngleList(0, 1, 0.1)).toHaveLength(11);
  });

  it("checks the physical ranges before asking, with the API's own ranges and words", () => {
    // The page refuses what the API would refuse (~/engine MODEL_RANGES), beside the input, with the range.
    const tooBig = buildCoverageRequest(sketch("ra=84&dec=-1&model=uniformDisk&diam=1e9"), registry);
    expect(!tooBig.ok && tooBig.errors["model.diameterMas"]).toBe(
      "Diameter: must be above 0 and at most 1000 mas (got 1000000000 mas)",
    );
    const negative = buildCoverageRequest(sketch("ra=84&dec=-1&model=uniformDisk&diam=-2"), registry);
    expect(!negative.ok && negative.errors["model.diameterMas"]).toBe(
      "Diameter: must be above 0 and at most 1000 mas (got -2 mas)",
    );
    // The API says the same of the same value, and the page puts it beside the same input.
    const body = builtBody("ra=84&dec=-1&model=uniformDisk&diam=2");
    const refused = sent({ ...body, target: { ...body.target, model: { type: "uniformDisk", diameterMas: 1e9 } } });
    expect(refused.ok).toBe(false);
    if (refused.ok) return;
    expect(inputForApiField(refused.field)).toBe("model.diameterMas");
    expect(apiErrorText(refused.field, refused.message)).toBe(!tooBig.ok && tooBig.errors["model.diameterMas"]);

    const ratio = buildCoverageRequest(sketch("ra=84&dec=-1&model=binary&sep=4&pa=400&ratio=250"), registry);
    expect(!ratio.ok && ratio.errors).toMatchObject({
      "model.positionAngleDeg": "Position angle: must be from -360° to 360° (got 400°)",
      "model.fluxRatio": "Flux ratio: must be from 0 to 100 (got 250)",
    });
    const second = buildCoverageRequest(sketch("ra=84&dec=-1&c2=point&c2flux=2000&c2east=5000"), registry);
    expect(!second.ok && second.errors).toMatchObject({
      "second.flux": "Relative flux: must be above 0 and at most 1000 (got 2000)",
      "second.east": "Offset east: must be from -1000 to 1000 mas (got 5000 mas)",
    });
    const minEl = buildCoverageRequest(sketch("ra=84&dec=-1&minel=95"), registry);
    expect(!minEl.ok && minEl.errors.minElevation).toBe("Minimum elevation: must be from 0° to 90° (got 95°)");
    const step = buildCoverageRequest(sketch("ra=84&dec=-1&step=0.5"), registry);
    expect(!step.ok && step.errors.step).toBe("Time step: must be from 1 to 120 min (got 0.5 min)");

    // The edges of each range are accepted.
    expect(buildCoverageRequest(sketch("ra=84&dec=-1&model=uniformDisk&diam=1000&minel=90"), registry).ok).toBe(true);
    expect(buildCoverageRequest(sketch("ra=84&dec=-1&model=binary&sep=0&pa=-360&ratio=100"), registry).ok).toBe(true);

    // What the page does not check itself still reaches the API, whose 400 names the field.
    const r3 = sent(builtBody("ra=84&dec=-1&ha=-13,0,1"));
    expect(!r3.ok && inputForApiField(r3.field, "hourAngle")).toBe("ha");
  });

  it("maps every API field path to an input", () => {
    expect(inputForApiField("target.decDeg")).toBe("dec");
    expect(inputForApiField("target.raDeg")).toBe("ra");
    expect(inputForApiField("target.model.components[1].flux")).toBe("second.flux");
    expect(inputForApiField("target.model.components[1].offsetNorthMas")).toBe("second.north");
    expect(inputForApiField("target.model.components[1].model.fwhmMas")).toBe("second.fwhmMas");
    expect(inputForApiField("target.model.components[0].model.diameterMas")).toBe("model.diameterMas");
    expect(inputForApiField("target.model.coefficient")).toBe("model.coefficient");
    expect(inputForApiField("night.date")).toBe("date");
    expect(inputForApiField("date")).toBe("date"); // the ephemeris request
    expect(inputForApiField("night.stepMin")).toBe("step");
    expect(inputForApiField("stations[2].name")).toBe("stations");
    expect(inputForApiField("wavelengthsM")).toBe("band");
    expect(inputForApiField("beam.weighting")).toBe("weighting");
    expect(inputForApiField(null)).toBe("form");
    expect(apiErrorText(null, "request body is not valid JSON")).toBe("request body is not valid JSON");
    expect(apiErrorText("night.date", "night.date: must be a real calendar date")).toBe(
      "Night: must be a real calendar date",
    );
  });

  it("builds a two-component sum with the second component's flux and offset", () => {
    const s = sketch("model=uniformDisk&diam=2&c2=gaussian&c2fwhm=8&c2flux=0.25&c2east=1.5&c2north=-3");
    expect(modelFromState(s)).toEqual({
      type: "sum",
      components: [
        { model: { type: "uniformDisk", diameterMas: 2 }, flux: 1, offsetEastMas: 0, offsetNorthMas: 0 },
        { model: { type: "gaussian", fwhmMas: 8 }, flux: 0.25, offsetEastMas: 1.5, offsetNorthMas: -3 },
      ],
    });
  });
});

describe("size limits of the API (docs/cli.md)", () => {
  it("counts uv points and closure phases as the API does", () => {
    // 24 stations: 276 baselines and 2024 triangles (N(N−1)/2 and N(N−1)(N−2)/6, Monnier 2003).
    expect(sizeFailure(24, 145, 8)).toBeNull();
    expect(sizeFailure(24, 721, 30)).toMatch(/^276 baselines × 721 samples × 30 channels = 5969880 uv points/);
    expect(sizeFailure(24, 721, 6)).toMatch(/^2024 triangles × 721 samples × 6 channels = 8755824 closure phases/);
  });
});

describe("triangle and ephemeris requests", () => {
  it("ranks a configuration or every station", () => {
    const t = readTriangleState(new URLSearchParams("ra=11:00:00&dec=-35&pool=medium-4"), defaults);
    const built = buildTrianglesRequest(t, registry);
    expect(built.ok && built.body.stations.map((s) => s.name)).toEqual(["C07", "C11", "X01", "X06"]);
    const all = buildTrianglesRequest({ ...t, pool: ALL_STATIONS }, registry);
    expect(all.ok && all.body.stations).toHaveLength(24);
    if (all.ok) expect(parseTrianglesRequest(JSON.parse(JSON.stringify(all.body))).ok).toBe(true);
  });

  it("refuses a pool the API could not answer in one request", () => {
    const t = readTriangleState(
      new URLSearchParams(`ra=11:00:00&dec=-35&pool=${ALL_STATIONS}&inst=Ascua&band=N&step=2`),
      defaults,
    );
    const built = buildTrianglesRequest(t, registry);
    expect(!built.ok && built.errors.step).toMatch(/^Time step: 276 baselines × 721 samples × 30 channels/);
  });

  it("asks the ephemeris for the site and night", () => {
    const body = buildEphemerisRequest({ date: "2027-03-15" }, registry);
    expect(body).toEqual({ site: { latitudeDeg: -31.4, longitudeDeg: -68.9, altitudeM: 2450 }, date: "2027-03-15" });
    expect(parseEphemerisRequest(body).ok).toBe(true);
    expect(buildEphemerisRequest({ date: "15/03/2027" }, registry)).toBeNull();
  });
});
