import { cli, cliOk, requestFiles } from "@test/cli";
import { demoSite, demoStations } from "@test/demo-array";
import { describe, expect, it } from "vitest";

const { file } = requestFiles("cli");

const coverageRequest = {
  site: demoSite(),
  stations: demoStations("C01", "C02", "W1"),
  target: { raDeg: 84.05, decDeg: -1.2, model: { type: "uniformDisk", diameterMas: 3.0 } },
  wavelengthsM: [1.65e-6, 2.2e-6],
  hourAnglesH: [-3, -2.5, -2],
  minElevationDeg: 30,
  delayLineStrokeM: null,
  beam: { gridSize: 64, weighting: "natural" },
};

describe("command line", { timeout: 60_000 }, () => {
  it("coverage --input FILE prints one JSON object with the contract fields", () => {
    const r = cliOk(["coverage", "--input", file("cov.json", coverageRequest)]);
    expect(r.stdout.trim().split("\n")).toHaveLength(1);
    const out = JSON.parse(r.stdout);
    expect(out.samples[0]).toMatchObject({ hourAngleH: -3, observable: true, reason: null });
    expect(out.baselines[0].stations).toEqual(["C01", "C02"]);
    expect(Object.keys(out.baselines[0].points[0])).toEqual(
      expect.arrayContaining(["hourAngleH", "uM", "vM", "wM", "vis2"]),
    );
    expect(out.baselines[0].points[0].vis2).toHaveLength(2);
    expect(out.closurePhases[0].stations).toEqual(["C01", "C02", "W1"]);
    expect(out.closurePhases[0].points[0].closurePhaseDeg).toHaveLength(2);
    expect(Object.keys(out.beam)).toEqual(
      expect.arrayContaining(["fwhmMajorMas", "fwhmMinorMas", "positionAngleDeg", "peakSidelobe"]),
    );
  });

  it("ephemeris reads standard input", () => {
    const r = cli(["ephemeris"], JSON.stringify({ site: coverageRequest.site, date: "2027-03-15" }));
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    for (const key of ["sunsetUtc", "astronomicalDuskUtc", "astronomicalDawnUtc", "sunriseUtc"])
      expect(out[key]).toMatch(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\dZ$/);
    expect(typeof out.lstAtDuskH).toBe("number");
    expect(typeof out.moonIlluminatedFraction).toBe("number");
  });

  it("triangles ranks the single triangle", () => {
    const r = cli(["triangles", "--input", file("tri.json", coverageRequest)]);
    expect(r.status).toBe(0);
    expect(JSON.parse(r.stdout).triangles[0].stations).toEqual(["C01", "C02", "W1"]);
  });

  const bad: [string, string[], string | undefined, RegExp][] = [
    [
      "a validation failure",
      ["coverage", "--input", "BAD"],
      undefined,
      /^error: target\.decDeg: must be between -90 and 90$/,
    ],
    ["invalid JSON", ["coverage"], "{oops", /^error: the request is not valid JSON/],
    [
      "a request over the cost budget",
      ["coverage"],
      JSON.stringify({
        ...coverageRequest,
        target: {
          ...coverageRequest.target,
          model: {
            type: "sum",
            components: Array.from({ length: 50 }, () => ({ model: { type: "point" }, flux: 1 })),
          },
        },
        hourAnglesH: Array.from({ length: 20_000 }, (_, i) => -6 + (12 * i) / 20_000),
        wavelengthsM: Array.from({ length: 10 }, (_, i) => 1.5e-6 + i * 1e-8),
      }),
      /^error: target\.model: 50 components × 600 000 uv points = 30 000 000 component evaluations \(limit 10 000 000\); use fewer components, stations, samples or channels$/,
    ],
    ["an unknown command", ["cover", "--input", "x.json"], undefined, /^error: unknown command "cover"/],
    ["a missing file", ["ephemeris", "--input", "/nonexistent/req.json"], undefined, /^error: input file not found/],
  ];
  for (const [name, args, stdin, pattern] of bad) {
    it(`exits non-zero with one line on stderr and nothing on stdout for ${name}`, () => {
      const badFile = file("bad.json", { ...coverageRequest, target: { ...coverageRequest.target, decDeg: 95 } });
      const r = cli(
        args.map((a) => (a === "BAD" ? badFile : a)),
        stdin,
      );
      expect(r.status).toBe(2);
      expect(r.stdout).toBe("");
      const lines = r.stderr.trimEnd().split("\n");
      expect(lines).toHaveLength(1);
      expect(lines[0]).toMatch(pattern);
    });
  }
});
