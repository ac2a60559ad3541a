import { describe, expect, it } from "vitest";
import { parseTargetCsv, targetsToCsv } from "~/services/targets/csv";
import type { StoredTarget } from "~/services/targets/schemas";

/** A stored target with the values a test names (a point at 05h, −10° by default). */
const stored = (t: Partial<StoredTarget>): StoredTarget => ({
  name: "T",
  raDeg: 75,
  decDeg: -10,
  model: { type: "point" },
  magnitudes: {},
  notes: "",
  ...t,
});

const header =
  "name,ra,dec,model,size_mas,ld_coefficient,separation_mas,position_angle_deg,flux_ratio,mag_H,mag_K,notes";

describe("target list CSV", () => {
  it("reads sexagesimal and decimal coordinates, models and magnitudes", () => {
    const csv = [
      header,
      "Lumbre Nova 12,05:36:12.8,-01:12:07,uniformDisk,3.0,,,,,4.2,3.9,compact star",
      "Ceniza Pair,84.05,-1.2,binary,,,12.5,45,0.3,6.1,,",
      "Brizna Shell,10:00:00,+20:00:00,limbDarkenedDisk,8,0.35,,,,,,",
      "Plain,1h,0,,,,,,,,,",
    ].join("\n");
    const out = parseTargetCsv(csv);
    expect(out.errors).toEqual([]);
    expect(out.targets).toHaveLength(4);
    // 05h36m12.8s = (5 + 36/60 + 12.8/3600) × 15° = 84.05333° (common practice: 1 h of RA = 15°).
    expect(out.targets[0].raDeg).toBeCloseTo(84.053333, 5);
    // −01°12′07″ = −(1 + 12/60 + 7/3600)° = −1.201944°.
    expect(out.targets[0].decDeg).toBeCloseTo(-1.201944, 5);
    expect(out.targets[0].model).toEqual({ type: "uniformDisk", diameterMas: 3 });
    expect(out.targets[0].magnitudes).toEqual({ H: 4.2, K: 3.9 });
    expect(out.targets[1].model).toEqual({ type: "binary", separationMas: 12.5, positionAngleDeg: 45, fluxRatio: 0.3 });
    expect(out.targets[2].model).toEqual({ type: "limbDarkenedDisk", diameterMas: 8, coefficient: 0.35 });
    expect(out.targets[3]).toMatchObject({ raDeg: 15, decDeg: 0, model: { type: "point" } });
  });

  it("reports a bad RA with its row and column, and keeps going", () => {
    const out = parseTargetCsv(
      [header, "Good,05:00:00,-10:00:00,,,,,,,,,", "Bad,25:00:00,-10:00:00,,,,,,,,,"].join("\n"),
    );
    expect(out.targets.map((t) => t.name)).toEqual(["Good"]);
    expect(out.errors).toHaveLength(1);
    expect(out.errors[0]).toMatchObject({ row: 3, column: "ra" });
    expect(out.errors[0].message).toMatch(/^Right ascension/);
  });

  it("names missing columns", () => {
    const out = parseTargetCsv("name,ra\nA,05:00:00");
    expect(out.errors).toEqual([
      { row: 1, column: "dec", message: "missing column dec (the header needs name, ra, dec)" },
    ]);
  });

  it("refuses duplicate names within the file and names already in the list", () => {
    const csv = [header, "Twin,05:00:00,-10,,,,,,,,,", "twin,06:00:00,-10,,,,,,,,,", "Old,07:00:00,-10,,,,,,,,,"].join(
      "\n",
    );
    // "Old" is in the list already, elsewhere in the sky: a clash unless the list is to be replaced.
    const existing = new Map([["old", stored({ name: "Old", raDeg: 100 })]]);
    const out = parseTargetCsv(csv, { existing });
    expect(out.errors.map((e) => `${e.row}:${e.column}`)).toEqual(["3:name", "4:name"]);
    expect(out.errors[0].message).toBe('"twin" appears twice (also line 2)');
    const replacing = parseTargetCsv(csv, { existing, replaceExisting: true });
    expect(replacing.errors.map((e) => e.row)).toEqual([3]);
  });

  it("numbers rows by the file's own lines: blank lines and quoted line breaks counted", () => {
    const csv = [
      header,
      "",
      'Quoted,05:00:00,-10,,,,,,,,,"a note',
      'on two lines"',
      "",
      "Bad,25:00:00,-10,,,,,,,,,",
    ].join("\n");
    const out = parseTargetCsv(csv);
    expect(out.targets.map((t) => [t.name, t.row])).toEqual([["Quoted", 3]]);
    // The bad row is on line 6 of the file: what an editor shows.
    expect(out.errors.map((e) => e.row)).toEqual([6]);
  });

  it("reports one problem per line, in the order of the file, with the header's own column names", () => {
    const csv = ["name,RA,Dec,model,size_mas,mag_H", "Late,05:00:00,-10,uniformDisk,,x", "Early,25:00:00,-99,,,"].join(
      "\n",
    );
    const out = parseTargetCsv(csv);
    expect(out.errors.map((e) => `${e.row}:${e.column}`)).toEqual(["2:size_mas", "3:RA"]);
    const mags = parseTargetCsv("name,ra,dec,mag_H\nA,05:00:00,-10,bright");
    expect(mags.errors).toEqual([expect.objectContaining({ row: 2, column: "mag_H" })]);
  });

  it("counts rows identical to targets in the list as unchanged, and writes nothing for them", () => {
    const csv = [header, "Same,05:00:00,-10:00:00,uniformDisk,3,,,,,4.2,,", "New,06:00:00,-10,,,,,,,,,"].join("\n");
    const first = parseTargetCsv(csv);
    const existing = new Map(first.targets.map((t) => [t.name.toLowerCase(), stored(t)]));
    const again = parseTargetCsv(csv, { existing });
    expect(again).toMatchObject({ errors: [], targets: [], unchanged: 2 });
    // One changed row: that one is a clash, the identical one stays unchanged.
    const changed = parseTargetCsv(csv.replace("4.2", "4.3"), { existing });
    expect(changed.unchanged).toBe(1);
    expect(changed.errors.map((e) => e.row)).toEqual([2]);
  });

  it("asks for the model's parameters and checks their ranges", () => {
    const out = parseTargetCsv(
      [
        header,
        "NoSize,05:00:00,-10,uniformDisk,,,,,,,,",
        "BadLd,05:00:00,-10,limbDarkenedDisk,3,1.5,,,,,,",
        "Weird,05:00:00,-10,blob,,,,,,,,",
      ].join("\n"),
    );
    expect(out.errors.map((e) => `${e.row}:${e.column}`)).toEqual(["2:size_mas", "3:ld_coefficient", "4:model"]);
    expect(out.targets).toEqual([]);
  });

  it("reports an empty file, a header without rows, and unknown columns as a warning", () => {
    expect(parseTargetCsv("  ").errors[0].message).toBe("the file is empty");
    expect(parseTargetCsv("name,ra,dec\n").errors[0].message).toBe("the file has a header but no targets");
    const out = parseTargetCsv("name,ra,dec,colour\nA,05:00:00,-10,red");
    expect(out.warnings).toEqual(["ignored column: colour"]);
    expect(out.targets).toHaveLength(1);
  });

  it("writes CSV that reads back to the same targets (round trip)", () => {
    const first = parseTargetCsv(
      [header, 'Lumbre Nova 12,05:36:12.8,-01:12:07,uniformDisk,3.0,,,,,4.2,3.9,"a, quoted note"'].join("\n"),
    );
    expect(first.errors).toEqual([]);
    const again = parseTargetCsv(targetsToCsv(first.targets));
    expect(again.errors).toEqual([]);
    expect(again.targets[0]).toMatchObject({
      name: "Lumbre Nova 12",
      model: first.targets[0].model,
      magnitudes: first.targets[0].magnitudes,
    });
    // Coordinates are written to 7 decimals of a degree (0.36 mas): 84.0533333, not 84.05333333333334.
    expect(targetsToCsv(first.targets)).toContain("84.0533333,-1.2019444");
    expect(again.targets[0].raDeg).toBeCloseTo(first.targets[0].raDeg, 7);
    expect(again.targets[0].decDeg).toBeCloseTo(first.targets[0].decDeg, 7);
    // Read back against the list it came from, every row is unchanged.
    const stored = new Map(first.targets.map((t) => [t.name.toLowerCase(), t]));
    expect(parseTargetCsv(targetsToCsv(first.targets), { existing: stored })).toMatchObject({ unchanged: 1 });
  });
});
