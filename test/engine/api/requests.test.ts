import { goodCoverageRequest as good } from "@test/coverage-request";
import { describe, expect, it } from "vitest";
import { parseCoverageRequest, parseEphemerisRequest, parseTrianglesRequest } from "~/engine";

function failure(mutate: (r: Record<string, any>) => void) {
  const r = good();
  mutate(r);
  const out = parseCoverageRequest(r);
  if (out.ok) throw new Error("expected a validation failure");
  return { message: out.message, field: out.field };
}

/** A mutation that samples the night of `date` every `stepMin` minutes instead of the hour angles. */
const nightInstead = (date: string, stepMin: number) => (r: Record<string, any>) => {
  delete r.hourAnglesH;
  r.night = { date, stepMin };
};

describe("coverage request validation", () => {
  it("accepts the contract example and fills defaults", () => {
    const r = good();
    delete r.minElevationDeg;
    delete r.delayLineStrokeM;
    delete r.beam;
    delete r.stations[1].upM;
    const out = parseCoverageRequest(r);
    expect(out.ok).toBe(true);
    if (!out.ok) return;
    expect(out.value.minElevationDeg).toBe(30);
    expect(out.value.delayLineStrokeM).toBeNull();
    expect(out.value.beam).toEqual({ gridSize: 256, weighting: "natural", robust: 0, includeImages: false });
    expect(out.value.stations[1].upM).toBe(0);
    const nullBeam = parseCoverageRequest({ ...good(), beam: null });
    expect(nullBeam.ok && nullBeam.value.beam).toBeNull();
  });

  // One failing case per rule, with the message asserted.
  const cases: [string, (r: Record<string, any>) => void, string][] = [
    ["declination above 90", (r) => (r.target.decDeg = 91), "target.decDeg: must be between -90 and 90"],
    ["declination below −90", (r) => (r.target.decDeg = -90.5), "target.decDeg: must be between -90 and 90"],
    ["declination missing", (r) => delete r.target.decDeg, "target.decDeg: is required"],
    ["declination a string", (r) => (r.target.decDeg = "-1.2"), "target.decDeg: must be a number"],
    ["RA above 360", (r) => (r.target.raDeg = 360.5), "target.raDeg: must be between 0 and 360"],
    ["RA negative", (r) => (r.target.raDeg = -1), "target.raDeg: must be between 0 and 360"],
    ["one station", (r) => r.stations.splice(1), "stations: needs at least 2 stations"],
    [
      "duplicate station names",
      (r) => (r.stations[2].name = "C01"),
      'stations: station names must be distinct ("C01" appears more than once)',
    ],
    ["empty station name", (r) => (r.stations[1].name = " "), "stations[1].name: must not be empty"],
    ["station east not finite", (r) => (r.stations[0].eastM = null), "stations[0].eastM: must be a number"],
    ["wavelength zero", (r) => (r.wavelengthsM = [0]), "wavelengthsM[0]: must be positive"],
    ["wavelength negative", (r) => (r.wavelengthsM = [1.65e-6, -2.2e-6]), "wavelengthsM[1]: must be positive"],
    [
      "wavelength in micrometres",
      (r) => (r.wavelengthsM = [1.65]),
      "wavelengthsM[0]: must be at most 0.001 (wavelengths are in metres)",
    ],
    ["no wavelengths", (r) => (r.wavelengthsM = []), "wavelengthsM: must list at least one wavelength"],
    [
      "grid size not a power of two",
      (r) => (r.beam.gridSize = 300),
      "beam.gridSize: must be a power of two from 32 to 2048",
    ],
    ["grid size too small", (r) => (r.beam.gridSize = 16), "beam.gridSize: must be a power of two from 32 to 2048"],
    ["grid size too large", (r) => (r.beam.gridSize = 4096), "beam.gridSize: must be a power of two from 32 to 2048"],
    ["unknown weighting", (r) => (r.beam.weighting = "super"), "beam.weighting: must be natural, uniform or robust"],
    ["robust out of range", (r) => (r.beam.robust = 3), "beam.robust: must be between -2 and 2"],
    [
      "images on a grid above 512",
      (r) => (r.beam = { gridSize: 1024, includeImages: true }),
      "beam.includeImages: images are returned only for gridSize up to 512",
    ],
    [
      "more than 20000 hour angles",
      (r) => (r.hourAnglesH = new Array(20001).fill(0)),
      "hourAnglesH: must list at most 20000 hour-angle samples",
    ],
    ["hour angle out of range", (r) => (r.hourAnglesH = [13]), "hourAnglesH[0]: must be between -12 and 12"],
    [
      "both hour angles and night",
      (r) => (r.night = { date: "2027-03-15", stepMin: 5 }),
      "hourAnglesH: give either hourAnglesH or night, not both",
    ],
    [
      "neither hour angles nor night",
      (r) => delete r.hourAnglesH,
      "hourAnglesH: is required (or give night: {date, stepMin})",
    ],
    [
      "night step that could exceed 20000 samples",
      nightInstead("2027-03-15", 0.07),
      "night.stepMin: is too small: a night could need more than 20000 samples (use at least 0.073 minutes)",
    ],
    ["night step not positive", nightInstead("2027-03-15", 0), "night.stepMin: must be positive"],
    ["night date not a real date", nightInstead("2027-02-29", 5), "night.date: must be a real calendar date"],
    ["night date in another form", nightInstead("15/03/2027", 5), "night.date: must be a date in the form YYYY-MM-DD"],
    ["latitude out of range", (r) => (r.site.latitudeDeg = -91), "site.latitudeDeg: must be between -90 and 90"],
    ["longitude out of range", (r) => (r.site.longitudeDeg = 181), "site.longitudeDeg: must be between -180 and 180"],
    ["min elevation out of range", (r) => (r.minElevationDeg = 95), "minElevationDeg: must be between 0 and 90"],
    ["stroke not positive", (r) => (r.delayLineStrokeM = -5), "delayLineStrokeM: must be positive"],
    [
      "unknown model type",
      (r) => (r.target.model = { type: "blob" }),
      "target.model.type: must be one of point, uniformDisk, gaussian, limbDarkenedDisk, ring, binary, sum",
    ],
    [
      "disk diameter not positive",
      (r) => (r.target.model.diameterMas = 0),
      "target.model.diameterMas: must be positive",
    ],
    [
      "Gaussian FWHM negative",
      (r) => (r.target.model = { type: "gaussian", fwhmMas: -1 }),
      "target.model.fwhmMas: must be positive",
    ],
    ["ring diameter missing", (r) => (r.target.model = { type: "ring" }), "target.model.diameterMas: is required"],
    [
      "limb-darkening coefficient above 1",
      (r) => (r.target.model = { type: "limbDarkenedDisk", diameterMas: 2, coefficient: 1.2 }),
      "target.model.coefficient: must be between 0 and 1",
    ],
    [
      "negative flux ratio",
      (r) => (r.target.model = { type: "binary", separationMas: 3, positionAngleDeg: 10, fluxRatio: -0.1 }),
      "target.model.fluxRatio: must be zero or positive",
    ],
    [
      "negative separation",
      (r) => (r.target.model = { type: "binary", separationMas: -3, positionAngleDeg: 10, fluxRatio: 0.5 }),
      "target.model.separationMas: must be zero or positive",
    ],
    [
      "empty sum",
      (r) => (r.target.model = { type: "sum", components: [] }),
      "target.model.components: must have at least one component",
    ],
    [
      "invalid nested component",
      (r) =>
        (r.target.model = {
          type: "sum",
          components: [{ model: { type: "uniformDisk", diameterMas: -2 }, flux: 1 }],
        }),
      "target.model.components[0].model.diameterMas: must be positive",
    ],
    [
      "component flux zero",
      (r) => (r.target.model = { type: "sum", components: [{ model: { type: "point" }, flux: 0 }] }),
      "target.model.components[0].flux: must be positive",
    ],
    [
      "request too large",
      (r) => {
        r.hourAnglesH = new Array(20000).fill(0);
        r.wavelengthsM = new Array(100).fill(2e-6);
      },
      "wavelengthsM: request too large: 3 baselines × 20000 samples × 100 wavelengths = 6000000 uv points (limit 3000000)",
    ],
  ];

  for (const [name, mutate, message] of cases) {
    it(`rejects ${name}`, () => {
      const f = failure(mutate);
      expect(f.message).toBe(message);
      expect(f.message.split("\n")).toHaveLength(1);
      expect(f.field).toBe(message.split(":")[0]);
    });
  }

  it("rejects a body that is not an object", () => {
    expect(parseCoverageRequest([1, 2])).toEqual({ ok: false, message: "request must be a JSON object", field: null });
    expect(parseCoverageRequest("x")).toEqual({ ok: false, message: "request must be a JSON object", field: null });
  });
});

describe("ephemeris and triangle request validation", () => {
  it("accepts a site and a date", () => {
    expect(parseEphemerisRequest({ site: { latitudeDeg: -31.4, longitudeDeg: -68.9 }, date: "2027-03-15" }).ok).toBe(
      true,
    );
  });

  it("rejects a date that does not exist", () => {
    const out = parseEphemerisRequest({ site: { latitudeDeg: -31.4, longitudeDeg: -68.9 }, date: "2027-04-31" });
    expect(out).toEqual({ ok: false, message: "date: must be a real calendar date", field: "date" });
  });

  it("rejects a triangle request with fewer than 3 stations", () => {
    const r = good();
    r.stations.pop();
    const out = parseTrianglesRequest(r);
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.message).toBe("stations: needs at least 3 stations to form a triangle");
  });

  it("rejects a fractional maxTriangles", () => {
    const out = parseTrianglesRequest({ ...good(), maxTriangles: 2.5 });
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.message).toBe("maxTriangles: must be a whole number");
  });
});
