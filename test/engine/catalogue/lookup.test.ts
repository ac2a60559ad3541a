import { describe, expect, it } from "vitest";
import {
  editDistance,
  foldText,
  lookupStar,
  parseDesignation,
  resolveStar,
  suggestStars,
  trigramSimilarity,
  trigramsOf,
} from "~/engine";
import { catalogue } from "./data";

const cat = catalogue();

/** HIP number a typed name resolves to, or null. */
function hipOf(name: string): number | null {
  const r = lookupStar(cat, name);
  return r.found ? cat.hip[r.row] : null;
}

describe("name lookup, every naming form against the data", () => {
  // starnames.json HIP 27989: name Betelgeuse, bayer α, flam 58, hd "HD 39801", c Ori.
  it("Betelgeuse = α Ori = 58 Ori = HD 39801 = HIP 27989, however written", () => {
    for (const name of [
      "HIP 27989",
      "hip27989",
      "HD 39801",
      "hd  39801",
      "alf Ori",
      "ALF ORI",
      "α Ori",
      "α Orionis",
      "Alpha Orionis",
      "alpha ori",
      "alp Ori",
      "58 Ori",
      "58 Orionis",
      "Betelgeuse",
      "  betelgeuse ",
    ]) {
      expect(hipOf(name), name).toBe(27989);
    }
  });

  it("resolves Bayer designations with component digits and two-word genitives", () => {
    // starnames.json: HIP 71683 bayer α1 Cen (Rigil Kentaurus), HIP 39953 γ2 Vel (Regor),
    // HIP 54061 bayer α UMa (Dubhe), HIP 37279 α CMi (Procyon).
    expect(hipOf("alf1 Cen")).toBe(71683);
    expect(hipOf("α¹ Cen")).toBe(71683);
    expect(hipOf("alpha 1 Centauri")).toBe(71683);
    expect(hipOf("gam2 Vel")).toBe(39953);
    expect(hipOf("Alpha Ursae Majoris")).toBe(54061);
    expect(hipOf("alf Canis Minoris")).toBe(37279);
    // "α Cen" without the digit: the components, brightest first.
    const both = lookupStar(cat, "alf Cen");
    expect(both.found && cat.hip[both.row]).toBe(71683);
    expect(both.found && both.alsoNamed.map((r) => cat.hip[r])).toEqual([71681]);
  });

  it("resolves Flamsteed, variable and Latin-letter designations, keeping the case of Latin letters", () => {
    expect(hipOf("1 Gem")).toBe(28734); // starnames.json HIP 28734: flam 1, c Gem
    expect(hipOf("V0822 Cas")).toBe(181); // var "V0822", c Cas
    expect(hipOf("V822 Cas")).toBe(181);
    expect(hipOf("CG And")).toBe(63); // var "CG", c And
    expect(hipOf("cg andromedae")).toBe(63);
    // bayer "A" Car is HIP 32761, bayer "a" Car is HIP 45080.
    expect(hipOf("A Car")).toBe(32761);
    expect(hipOf("a Car")).toBe(45080);
  });

  it("resolves proper names with accents and apostrophes in any spelling", () => {
    expect(hipOf("Sirius")).toBe(32349);
    expect(hipOf("Belenos")).toBe(hipOf("Bélénos"));
    // starnames.json HIP 31646: "Plaskett's Star"; HIP 60644: "Tupã".
    expect(hipOf("plasketts star")).toBe(31646);
    expect(hipOf("Plaskett’s Star")).toBe(31646);
    expect(hipOf("TUPA")).toBe(60644);
  });

  it("forgives small typos in names, never in numbers", () => {
    expect(hipOf("Betelgeuze")).toBe(27989);
    expect(hipOf("Sirus")).toBe(32349);
    expect(hipOf("Alpha Orionsi")).toBe(27989);
    const t = lookupStar(cat, "Betelgeuze");
    expect(t.found && t.matchedBy).toBe("typo");
    // HD 39802 is not HD 39801; a well-formed designation no star has is not corrected.
    expect(hipOf("HD 39802")).toBeNull();
    expect(hipOf("zet Oph1")).toBeNull();
    expect(hipOf("HIP 1")).toBeNull();
  });

  it("says a name is unknown, with near matches when there are some", () => {
    const r = resolveStar(cat, "Betelgoosey");
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(/^no star called "Betelgoosey" \(did you mean .*Betelgeuse.*\?\)$/);
    const none = resolveStar(cat, "§§§");
    expect(!none.ok && none.message).toBe('no star called "§§§"');
  });

  it("suggests names while they are typed", () => {
    const s = suggestStars(cat, "Betel");
    expect(s[0]).toMatchObject({ hip: 27989, name: "Betelgeuse" });
    expect(suggestStars(cat, "alf Or").map((x) => x.hip)).toContain(27989);
    expect(suggestStars(cat, "")).toEqual([]);
  });

  it("answers a lookup within 50 ms, typo and miss included", () => {
    const names = ["HD 39801", "alf Ori", "Betelgeuse", "Betelgeuze", "Alpha Orionsi", "Zorgon Prime", "V822 Cas"];
    for (const n of names) {
      const t0 = performance.now();
      lookupStar(cat, n);
      expect(performance.now() - t0, n).toBeLessThan(50);
    }
  });
});

describe("text matching helpers", () => {
  it("extracts trigrams as PostgreSQL's pg_trgm does", () => {
    // pg_trgm documentation, F.35: show_trgm('cat') → {"  c"," ca","at ","cat"}.
    expect(trigramsOf("cat").sort()).toEqual(["  c", " ca", "at ", "cat"].sort());
    // Reference values printed by PostgreSQL 15's pg_trgm similarity() (run once on a local cluster).
    expect(trigramSimilarity("betelgeuse", "betelgeuze")).toBeCloseTo(0.5714286, 6);
    expect(trigramSimilarity("sirius", "sirus")).toBeCloseTo(0.44444445, 6);
    expect(trigramSimilarity("alf orionis", "alf orionsi")).toBeCloseTo(0.6, 6);
    expect(trigramSimilarity("word", "two words")).toBeCloseTo(0.36363637, 6);
    expect(trigramSimilarity("word", "word")).toBe(1);
    expect(trigramSimilarity("abc", "xyz")).toBe(0);
  });

  it("measures the optimal string alignment distance", () => {
    // Textbook cases (from memory): kitten → sitting is 3 edits; a swap of neighbours is 1; "CA" → "ABC"
    // is 3 under optimal string alignment (2 under unrestricted Damerau–Levenshtein).
    expect(editDistance("kitten", "sitting")).toBe(3);
    expect(editDistance("orionis", "orionsi")).toBe(1);
    expect(editDistance("ca", "abc")).toBe(3);
    expect(editDistance("", "abc")).toBe(3);
  });

  it("folds case, accents, superscripts and punctuation", () => {
    expect(foldText("  Bélénos ")).toBe("belenos");
    expect(foldText("α¹ Cen")).toBe("α1 cen");
    expect(foldText("Barnard's  Star")).toBe("barnards star");
    expect(parseDesignation("Alpha Orionis")).toMatchObject({ kind: "bayer", key: "alf ori" });
    expect(parseDesignation("58 Ori")).toMatchObject({ kind: "flamsteed", key: "58 ori" });
    expect(parseDesignation("HIP 27989")).toEqual({ kind: "hip", number: 27989 });
    expect(parseDesignation("Betelgeuse")).toBeNull();
  });
});
