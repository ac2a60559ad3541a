import { cli, requestFiles } from "@test/cli";
import { describe, expect, it } from "vitest";

const { file } = requestFiles("cli-plan");

/** The contract's example request, with a second station and target so that there is work to do. */
const request = {
  site: { latitudeDeg: -31.4, longitudeDeg: -68.9, altitudeM: 2450 },
  date: "2027-03-15",
  stations: [
    { name: "C01", eastM: 0, northM: 0, upM: 0, pathOffsetM: 0 },
    { name: "C02", eastM: 16, northM: 0, upM: 0, pathOffsetM: 2 },
  ],
  delayLineStrokeM: 90,
  minElevationDeg: 30,
  moonMinSeparationDeg: 10,
  scienceBlockMin: 40,
  calibratorBlockMin: 15,
  targets: [
    {
      name: "T1",
      raDeg: 84.05,
      decDeg: -1.2,
      priority: 1,
      hoursOwed: 2.0,
      minElevationDeg: null,
      calibrators: [{ name: "K1", raDeg: 86.1, decDeg: -3.0 }],
    },
    { name: "T2", raDeg: 200, decDeg: 80, priority: 2, hoursOwed: 1, minElevationDeg: null, calibrators: [] },
  ],
};

describe("cli plan", { timeout: 60_000 }, () => {
  it("prints one JSON object with the contract's fields", () => {
    const r = cli(["plan", "--input", file("plan.json", request)]);
    expect(r.stderr).toBe("");
    expect(r.status).toBe(0);
    expect(r.stdout.trim().split("\n")).toHaveLength(1);
    const out = JSON.parse(r.stdout);
    expect(Object.keys(out)).toEqual(expect.arrayContaining(["night", "blocks", "unplaced", "warnings"]));
    expect(Object.keys(out.night)).toEqual(
      expect.arrayContaining(["date", "astronomicalDuskUtc", "astronomicalDawnUtc", "moonIlluminatedFraction"]),
    );
    expect(out.blocks.length).toBeGreaterThanOrEqual(3);
    expect(Object.keys(out.blocks[0])).toEqual(
      expect.arrayContaining([
        "kind",
        "target",
        "object",
        "startUtc",
        "endUtc",
        "startLstH",
        "hourAngleStartH",
        "hourAngleEndH",
        "elevationStartDeg",
        "elevationEndDeg",
        "airmassStart",
        "airmassEnd",
        "moonSeparationDeg",
      ]),
    );
    expect(out.blocks.slice(0, 3).map((b: { kind: string; object: string }) => `${b.kind}:${b.object}`)).toEqual([
      "calibrator:K1",
      "science:T1",
      "calibrator:K1",
    ]);
    expect(out.unplaced).toEqual([{ target: "T2", code: "elevation", reason: expect.stringMatching(/^never above/) }]);
    expect(out.warnings.join(" ")).toMatch(/safety rules/);
  });

  it("reads standard input too", () => {
    const r = cli(["plan"], JSON.stringify(request));
    expect(r.status).toBe(0);
    expect(JSON.parse(r.stdout).night.date).toBe("2027-03-15");
  });

  it("exits 2 with one line naming the field for a bad request", () => {
    const bad = { ...request, targets: [{ ...request.targets[0], decDeg: -95 }] };
    const r = cli(["plan", "--input", file("bad.json", bad)]);
    expect(r.status).toBe(2);
    expect(r.stdout).toBe("");
    expect(r.stderr).toBe("error: targets[0].decDeg: must be between -90 and 90\n");
  });

  it("exits 2 for a cross-field failure and for a missing field", () => {
    const dup = { ...request, targets: [request.targets[0], request.targets[0]] };
    const r = cli(["plan", "--input", file("dup.json", dup)]);
    expect(r.status).toBe(2);
    expect(r.stdout).toBe("");
    expect(r.stderr).toBe('error: targets[1].name: "T1" appears more than once\n');
    const { date: _date, ...noDate } = request;
    const s = cli(["plan", "--input", file("nodate.json", noDate)]);
    expect(s.status).toBe(2);
    expect(s.stderr).toBe("error: date: is required\n");
  });
});
