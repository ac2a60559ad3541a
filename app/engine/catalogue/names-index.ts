/**
 * The name index of the catalogue: an exact map from folded keys to rows, and a trigram index over
 * every written form of every name for typo-tolerant matching and suggestions.
 *
 * Exact keys carry a namespace: "d:alf ori" (Bayer, Flamsteed and variable designations, see
 * designations.ts), "n:betelgeuse" (proper names, folded), "c:hd39801" (catalogue numbers, compact).
 * Entries under one key are ordered brightest first.
 */
import type { StarNames } from "./build";
import { constellationByAbbr } from "./constellations";
import { foldText, fuzzyForm } from "./designations";
import { TrigramIndex } from "./trigram";

export interface IndexEntry {
  row: number;
  /** The designation prefix with its case as in the data ("A" of "A Car"); "" for names and numbers. */
  cased: string;
}

export interface NameIndex {
  exact: ReadonlyMap<string, readonly IndexEntry[]>;
  /** Trigram index over fuzzyForm() of every written form of every name. */
  fuzzy: TrigramIndex;
  /** Row of each text of the fuzzy index. */
  fuzzyRow: Int32Array;
}

interface IndexSource {
  names: ReadonlyMap<number, StarNames>;
  vMag: Float64Array;
}

/** Builds the exact and fuzzy indexes of the named rows. */
export function buildNameIndex(source: IndexSource): NameIndex {
  const exact = new Map<string, IndexEntry[]>();
  const add = (key: string, row: number, cased = "") => {
    const list = exact.get(key);
    if (!list) exact.set(key, [{ row, cased }]);
    else if (!list.some((e) => e.row === row)) list.push({ row, cased });
  };
  const texts: string[] = [];
  const textRows: number[] = [];
  const addText = (t: string, row: number) => {
    const f = fuzzyForm(t);
    if (f !== "") {
      texts.push(f);
      textRows.push(row);
    }
  };

  for (const [row, s] of source.names) {
    for (const name of s.proper) {
      add(`n:${foldText(name)}`, row);
      addText(name, row);
    }
    if (s.hd) add(`c:${foldText(s.hd).replace(/\s+/g, "")}`, row);
    if (s.gliese) add(`c:${foldText(s.gliese).replace(/\s+/g, "").replace(/^gl/, "gj")}`, row);
    const con = s.constellation ? constellationByAbbr(s.constellation) : null;
    if (!con) continue;
    const abbr = con.abbr.toLowerCase();
    const designations: { prefix: string; cased: string }[] = [];
    if (s.bayerKey) designations.push({ prefix: s.bayerKey.prefix, cased: s.bayerKey.cased });
    if (s.flamsteed) designations.push({ prefix: s.flamsteed.split(" ")[0], cased: "" });
    if (s.variable && s.variable !== s.bayer) {
      const p = s.variable.split(" ")[0];
      designations.push({ prefix: p.toLowerCase(), cased: p });
    }
    for (const d of designations) {
      add(`d:${d.prefix} ${abbr}`, row, d.cased);
      addText(`${d.prefix} ${abbr}`, row);
      addText(`${d.prefix} ${con.genitive}`, row);
    }
  }
  for (const list of exact.values()) list.sort((a, b) => source.vMag[a.row] - source.vMag[b.row] || a.row - b.row);
  return { exact, fuzzy: new TrigramIndex(texts), fuzzyRow: Int32Array.from(textRows) };
}
