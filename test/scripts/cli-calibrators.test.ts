import { cli, cliOk, expectRefused, requestFiles } from "@test/cli";
import { describe, expect, it } from "vitest";

const { file } = requestFiles("cli-calibrators");

/** The request of the contract (../shared/CONVENTIONS.md). */
const example = {
  target: { raDeg: 88.79, decDeg: 7.41 },
  wavelengthM: 1.65e-6,
  longestBaselineM: 160,
  site: { latitudeDeg: -31.4, longitudeDeg: -68.9, altitudeM: 2450 },
  date: "2027-01-10",
  minElevationDeg: 30,
  maxDistanceDeg: 10,
  minVis2: 0.8,
  limit: 20,
};

const FIELDS = [
  "name",
  "hip",
  "raDeg",
  "decDeg",
  "distanceDeg",
  "vMag",
  "bv",
  "bandMag",
  "diameterMas",
  "vis2",
  "observableHours",
  "score",
  "reasons",
];

describe("cli calibrators", { timeout: 60_000 }, () => {
  it("answers the contract's example, best first, never the target", () => {
    const r = cliOk(["calibrators", "--input", file("ex.json", example)]);
    const out = JSON.parse(r.stdout);
    expect(out.target).toBeTypeOf("object");
    expect(out.calibrators).toHaveLength(20);
    for (const c of out.calibrators) {
      expect(Object.keys(c)).toEqual(expect.arrayContaining(FIELDS));
      expect(c.distanceDeg).toBeLessThanOrEqual(10);
      expect(c.vis2).toBeGreaterThanOrEqual(0.8);
      expect(c.hip).not.toBe(27989);
    }
    for (let i = 1; i < out.calibrators.length; i++)
      expect(out.calibrators[i].score).toBeLessThanOrEqual(out.calibrators[i - 1].score);
  });

  it("takes a target by name and applies the defaults", () => {
    const { maxDistanceDeg: _d, minVis2: _v, limit: _l, ...rest } = example;
    const r = cli(["calibrators"], JSON.stringify({ ...rest, target: { name: "Betelgeuse" } }));
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.target).toMatchObject({ hip: 27989, name: "Betelgeuse" });
    expect(out.calibrators.length).toBeLessThanOrEqual(20);
    expect(out.calibrators.map((c: { hip: number }) => c.hip)).not.toContain(27989);
  });

  const bad: [string, unknown, RegExp][] = [
    [
      "an unknown target name",
      { ...example, target: { name: "Betelgoosey" } },
      /^error: target\.name: no star called "Betelgoosey" \(did you mean .*\?\)$/,
    ],
    [
      "a target with neither name nor coordinates",
      { ...example, target: {} },
      /^error: target: needs a name, or both raDeg and decDeg$/,
    ],
    [
      "a declination out of range",
      { ...example, target: { raDeg: 10, decDeg: 95 } },
      /^error: target\.decDeg: must be between -90 and 90$/,
    ],
    ["a missing wavelength", { ...example, wavelengthM: undefined }, /^error: wavelengthM: is required$/],
    ["micrometres typed as metres", { ...example, wavelengthM: 1.65 }, /^error: wavelengthM: must be at most 0\.001/],
    ["a negative baseline", { ...example, longestBaselineM: -5 }, /^error: longestBaselineM: must be positive$/],
    ["minVis2 above 1", { ...example, minVis2: 1.2 }, /^error: minVis2: must be between 0 and 1$/],
    ["a fractional limit", { ...example, limit: 2.5 }, /^error: limit: must be a whole number$/],
    ["an impossible date", { ...example, date: "2027-02-30" }, /^error: date: must be a real calendar date$/],
  ];
  for (const [what, body, message] of bad) {
    it(`rejects ${what} with exit 2 and one line on standard error`, () => {
      expectRefused(["calibrators", "--input", file("bad.json", body)], message);
    });
  }
});
