import { readFileSync } from "node:fs";
import { join } from "node:path";
import { cli, cliOk, requestFiles } from "@test/cli";
import { binaryTarget, demoSite, demoStations } from "@test/demo-array";
import { describe, expect, it } from "vitest";

const { dir, file } = requestFiles("cli-sim");

const request = {
  site: demoSite(),
  stations: demoStations("C01", "C02", "W1", "N2"),
  target: binaryTarget("Test binary"),
  wavelengthsM: [1.65e-6, 2.2e-6],
  hourAnglesH: [-3, -2, -1, 0],
  noise: { vis2Relative: 0.05, closurePhaseDeg: 2.0, seed: 1 },
};

describe("cli simulate", { timeout: 60_000 }, () => {
  it("prints the contract's response: one entry per observable sample and channel", () => {
    const r = cliOk(["simulate", "--input", file("sim.json", request)]);
    const out = JSON.parse(r.stdout);
    expect(out.vis2).toHaveLength(6 * 4 * 2);
    expect(out.closurePhases).toHaveLength(4 * 4 * 2);
    expect(Object.keys(out.vis2[0]).sort()).toEqual([
      "hourAngleH",
      "stations",
      "uM",
      "vM",
      "vis2",
      "vis2Err",
      "wavelengthM",
    ]);
    expect(out.closurePhases[0].stations).toEqual(["C01", "C02", "W1"]);
    expect(out.closurePhaseTriangles).toBe("all");
    // reproducible: the same request and seed print the same data
    expect(cli(["simulate", "--input", file("sim2.json", request)]).stdout).toBe(r.stdout);
  });

  it("writes an OIFITS 2 file with --oifits", () => {
    const target = join(dir, "out.fits");
    const r = cli([
      "simulate",
      "--input",
      file("sim3.json", { ...request, closurePhaseTriangles: "independent" }),
      "--oifits",
      target,
    ]);
    expect(r.status).toBe(0);
    expect(JSON.parse(r.stdout).closurePhaseTriangles).toBe("independent");
    const bytes = readFileSync(target);
    expect(bytes.length % 2880).toBe(0);
    const head = bytes.subarray(0, 2880).toString("latin1");
    expect(head.startsWith("SIMPLE  =                    T")).toBe(true);
    expect(head).toContain("CONTENT = 'OIFITS2 '");
    for (const ext of ["OI_TARGET", "OI_ARRAY", "OI_WAVELENGTH", "OI_VIS2", "OI_T3"])
      expect(bytes.toString("latin1")).toContain(`EXTNAME = '${ext}`);
  });

  const bad: [string, string[], unknown, RegExp][] = [
    [
      "a bad noise value",
      ["simulate", "--input", "FILE"],
      { ...request, noise: { closurePhaseDeg: -1 } },
      /^error: noise\.closurePhaseDeg: must be between 0 and 180$/,
    ],
    [
      "a bad triangle choice",
      ["simulate", "--input", "FILE"],
      { ...request, closurePhaseTriangles: "some" },
      /^error: closurePhaseTriangles: must be all or independent$/,
    ],
    [
      "--oifits on another command",
      ["coverage", "--input", "FILE", "--oifits", "x.fits"],
      request,
      /^error: --oifits applies to simulate only$/,
    ],
    [
      "--oifits without a file",
      ["simulate", "--input", "FILE", "--oifits"],
      request,
      /^error: --oifits needs a file name$/,
    ],
  ];
  for (const [name, args, body, pattern] of bad) {
    it(`exits 2 with one line on stderr and nothing on stdout for ${name}`, () => {
      const p = file("bad.json", body);
      const r = cli(args.map((a) => (a === "FILE" ? p : a)));
      expect(r.status).toBe(2);
      expect(r.stdout).toBe("");
      const lines = r.stderr.trimEnd().split("\n");
      expect(lines).toHaveLength(1);
      expect(lines[0]).toMatch(pattern);
    });
  }
});
