import { cli, expectRefused, requestFiles } from "@test/cli";
import { describe, expect, it } from "vitest";

const { file } = requestFiles("cli-rec");

const simulateRequest = {
  site: { latitudeDeg: -31.4, longitudeDeg: -68.9, altitudeM: 2450 },
  stations: [
    { name: "C01", eastM: 0, northM: 0 },
    { name: "C02", eastM: 16, northM: 0 },
    { name: "W1", eastM: -182, northM: 64, upM: 1.2 },
    { name: "N2", eastM: 35, northM: 228, upM: 2.1 },
  ],
  target: {
    raDeg: 84.05,
    decDeg: -1.2,
    model: { type: "binary", separationMas: 4, positionAngleDeg: 60, fluxRatio: 0.4 },
  },
  wavelengthsM: [1.6e-6, 1.7e-6, 1.8e-6],
  hourAnglesH: [-3, -2, -1, 0, 1, 2, 3],
};

describe("cli reconstruct", { timeout: 120_000 }, () => {
  it("reconstructs the output of simulate and prints the contract's fields", () => {
    const sim = cli(["simulate", "--input", file("sim.json", simulateRequest)]);
    expect(sim.status).toBe(0);
    const data = JSON.parse(sim.stdout);
    const r = cli(
      ["reconstruct"],
      JSON.stringify({ data, image: { gridSize: 48, maxIterations: 200 }, model: simulateRequest.target.model }),
    );
    expect(r.status).toBe(0);
    expect(r.stderr).toBe("");
    const out = JSON.parse(r.stdout);
    for (const key of ["gridSize", "pixelMas", "image", "chi2Vis2", "chi2ClosurePhase", "iterations", "converged"])
      expect(out).toHaveProperty(key);
    expect(out.gridSize).toBe(48);
    expect(out.image).toHaveLength(48 * 48);
    expect(out.image.reduce((a: number, b: number) => a + b, 0)).toBeCloseTo(1, 8);
    // default pixel λ/(4 B_max): the longest spatial frequency of the data
    const rMax = Math.max(
      ...data.vis2.map((e: { uM: number; vM: number; wavelengthM: number }) => Math.hypot(e.uM, e.vM) / e.wavelengthM),
    );
    expect(out.pixelMas).toBeCloseTo((1 / (4 * rMax)) * (180 / Math.PI) * 3.6e6, 6);
    expect(typeof out.fidelity.verdict).toBe("string");
    expect(out.modelImage).toHaveLength(48 * 48);
  });

  const data = { vis2: [{ uM: 10, vM: 5, wavelengthM: 1.6e-6, vis2: 0.8, vis2Err: 0.04 }], closurePhases: [] };
  const bad: [string, unknown, RegExp][] = [
    [
      "a grid outside 32–128",
      { data, image: { gridSize: 16 } },
      /^error: image\.gridSize: must be between 32 and 128$/,
    ],
    [
      "an unknown regularizer",
      { data, image: { regularizer: "sharp" } },
      /^error: image\.regularizer: must be entropy, totalVariation or compactness$/,
    ],
    [
      "a weight that is neither a number nor auto",
      { data, image: { weight: "high" } },
      /^error: image\.weight: must be a number between 0 and 1000000 or "auto"$/,
    ],
    [
      "no V² data",
      { data: { vis2: [], closurePhases: [] } },
      /^error: data\.vis2: must have at least one V² measurement$/,
    ],
    [
      "a missing field of a measurement",
      { data: { vis2: [{ uM: 1, vM: 1, wavelengthM: 1e-6, vis2: 1 }] } },
      /^error: data\.vis2\[0\]\.vis2Err: is required$/,
    ],
  ];
  for (const [name, body, pattern] of bad) {
    it(`exits 2 with one line on stderr and nothing on stdout for ${name}`, () => {
      expectRefused(["reconstruct", "--input", file("bad.json", body)], pattern);
    });
  }
});
