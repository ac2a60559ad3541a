import { describe, expect, it } from "vitest";
import { CONSTELLATIONS, constellationByAbbr, DEG_TO_RAD, designationsOf, displayName, VARIABILITY } from "~/engine";
import { catalogue, rawNames, rawStars } from "./data";

describe("catalogue build from the bundled star data", () => {
  it("reads every star and every name record of the package (counted independently in the raw text)", () => {
    const cat = catalogue();
    // Independent count: one `"type":"Feature"` per star in the FeatureCollection text.
    const starCount = rawStars.match(/"type":"Feature"/g)?.length ?? 0;
    expect(starCount).toBeGreaterThan(40_000);
    expect(cat.counts.stars).toBe(starCount);
    expect(cat.size).toBe(starCount);
    // Independent count: one `"hip":"HIP…"` field per name record.
    const nameCount = rawNames.match(/"hip":"HIP/g)?.length ?? 0;
    expect(cat.counts.nameRecords).toBe(nameCount);
    // Name records whose HIP number is among the stars (the others have no position in the V ≤ 8 file).
    const ids = new Set(Array.from(rawStars.matchAll(/"id":(\d+)/g), (m) => Number(m[1])));
    const keys = Array.from(rawNames.matchAll(/"(\d+)":\{"name"/g), (m) => Number(m[1]));
    expect(keys.length).toBe(nameCount);
    expect(cat.counts.namedStars).toBe(keys.filter((k) => ids.has(k)).length);
  });

  it("stores positions in radians on [0, 2π), V, and B−V with NaN where the data give none", () => {
    const cat = catalogue();
    const row = cat.rowOfHip(27989);
    // stars.8.json, feature 27989: coordinates [88.7929, 7.4071], mag 0.45, bv "1.500".
    expect(cat.raRad[row]).toBeCloseTo(88.7929 * DEG_TO_RAD, 12);
    expect(cat.decRad[row]).toBeCloseTo(7.4071 * DEG_TO_RAD, 12);
    expect(cat.vMag[row]).toBe(0.45);
    expect(cat.bv[row]).toBe(1.5);
    let bad = 0;
    for (let i = 0; i < cat.size; i++) {
      if (!(cat.raRad[i] >= 0 && cat.raRad[i] < 2 * Math.PI)) bad++;
      if (Math.abs(Math.hypot(cat.unitX[i], cat.unitY[i], cat.unitZ[i]) - 1) > 1e-12) bad++;
    }
    expect(bad).toBe(0);
    // A negative RA of the file gets 360° added: find one in the raw text and check it.
    const m = /"id":(\d+),"properties":\{[^}]*\},"geometry":\{"type":"Point","coordinates":\[(-\d+\.\d+),/.exec(
      rawStars,
    );
    expect(m).not.toBeNull();
    const r = cat.rowOfHip(Number(m?.[1]));
    expect(cat.raRad[r]).toBeCloseTo((Number(m?.[2]) + 360) * DEG_TO_RAD, 12);
    const missing = rawStars.match(/"bv":""/g)?.length ?? 0;
    expect(Array.from(cat.bv).filter(Number.isNaN).length).toBe(missing);
    expect(cat.rowOfHip(1)).toBe(-1);
  });

  it("keeps the designations of a named star in display form", () => {
    const cat = catalogue();
    const row = cat.rowOfHip(27989);
    expect(displayName(cat, row)).toBe("Betelgeuse");
    expect(designationsOf(cat, row)).toEqual(["Betelgeuse", "α Ori", "58 Ori", "HD 39801", "HIP 27989"]);
    // starnames.json HIP 181: var "V0822", c "Cas" → V822 Cas, a variable.
    const v = cat.rowOfHip(181);
    expect(designationsOf(cat, v)).toContain("V822 Cas");
    expect(cat.variability[v]).toBe(VARIABILITY.variable);
    expect(cat.variability[row]).toBe(VARIABILITY.none);
    // An unnamed star is called by its HIP number.
    expect(displayName(cat, cat.rowOfHip(3))).toBe("HIP 3");
  });
});

describe("constellation list", () => {
  it("has the 88 constellations, each abbreviation, name and genitive distinct", () => {
    expect(CONSTELLATIONS).toHaveLength(88);
    expect(new Set(CONSTELLATIONS.map((c) => c.abbr)).size).toBe(88);
    expect(new Set(CONSTELLATIONS.map((c) => c.name)).size).toBe(88);
    expect(new Set(CONSTELLATIONS.map((c) => c.genitive)).size).toBe(88);
    expect(constellationByAbbr("uma")?.genitive).toBe("Ursae Majoris");
  });

  it("knows every constellation abbreviation the name data use", () => {
    const used = new Set(Array.from(rawNames.matchAll(/"c":"([A-Za-z]{3})"/g), (m) => m[1]));
    expect(used.size).toBe(88);
    for (const abbr of used) expect(constellationByAbbr(abbr)?.abbr).toBe(abbr);
  });
});
