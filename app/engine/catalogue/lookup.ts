/**
 * Star lookup by name: catalogue numbers (HIP, HD, GJ), Bayer, Flamsteed and variable designations in any
 * of their written forms, and proper names; case, spacing and accents never matter.
 *
 * Order of the attempts:
 *  1. a designation or catalogue number (designations.ts) — exact key only: a well-formed designation
 *     that no star carries is not corrected to another one, it gets suggestions;
 *  2. a proper name, folded;
 *  3. a small typo: candidates by trigram similarity (pg_trgm's definition, threshold 0.3), then the one
 *     at the smallest optimal-string-alignment distance is taken when that distance is at most 1 (texts
 *     of 4–7 characters) or 2 (8 or more), it is the only star at that distance, and its digits are the
 *     typed digits (so "59 Ori" is never read as "58 Ori").
 * Otherwise: not found, with up to five suggestions (trigram similarity ≥ 0.2, best first).
 */
import { displayName, type StarCatalogue } from "./build";
import { foldText, fuzzyForm, greekSymbol, parseDesignation } from "./designations";
import type { IndexEntry } from "./names-index";
import { editDistance } from "./trigram";

export type LookupResult =
  | {
      found: true;
      row: number;
      /** How the name matched. */
      matchedBy: "catalogue number" | "designation" | "name" | "typo";
      /** Other stars under the same name (rows), brightest first; the brightest is the one returned. */
      alsoNamed: number[];
    }
  | { found: false; suggestions: string[] };

const CANDIDATE_SIMILARITY = 0.3;
const SUGGESTION_SIMILARITY = 0.2;
const MAX_SUGGESTIONS = 5;

function typoAllowance(length: number): number {
  if (length >= 8) return 2;
  if (length >= 4) return 1;
  return 0;
}

const digitsOf = (s: string) => s.replace(/\D+/g, " ").trim();

/** Entries under a designation key: the ones whose case matches what was typed, when there are any. */
function preferCase(entries: readonly IndexEntry[], typed: string): readonly IndexEntry[] {
  if (entries.length < 2) return entries;
  const same = entries.filter((e) => e.cased !== "" && e.cased === typed);
  return same.length > 0 ? same : entries;
}

function found(matchedBy: Extract<LookupResult, { found: true }>["matchedBy"], rows: readonly IndexEntry[]) {
  return { found: true as const, row: rows[0].row, matchedBy, alsoNamed: rows.slice(1).map((e) => e.row) };
}

/**
 * "alf Cen" when the data know only "alf1 Cen" and "alf2 Cen": the components of a Greek-letter
 * designation typed without its digit, brightest first.
 */
function bayerComponents(catalogue: StarCatalogue, key: string): IndexEntry[] {
  const [prefix, abbr] = key.split(" ");
  if (/\d$/.test(prefix) || greekSymbol(prefix) === null) return [];
  const out: IndexEntry[] = [];
  for (let d = 1; d <= 9; d++) for (const e of catalogue.index.exact.get(`d:${prefix}${d} ${abbr}`) ?? []) out.push(e);
  return out.sort((a, b) => catalogue.vMag[a.row] - catalogue.vMag[b.row]);
}

/** Display names of the stars nearest to a text by trigram similarity, best first, distinct stars. */
export function nearNames(catalogue: StarCatalogue, text: string, limit = MAX_SUGGESTIONS): string[] {
  const hits = catalogue.index.fuzzy.search(fuzzyForm(text), SUGGESTION_SIMILARITY, 200);
  const out: string[] = [];
  const seen = new Set<number>();
  for (const h of hits) {
    const row = catalogue.index.fuzzyRow[h.id];
    if (seen.has(row)) continue;
    seen.add(row);
    out.push(displayName(catalogue, row));
    if (out.length >= limit) break;
  }
  return out;
}

/** Looks a typed name up (see the file comment). Pure; about a millisecond for a fuzzy miss. */
export function lookupStar(catalogue: StarCatalogue, query: string): LookupResult {
  const exact = catalogue.index.exact;
  const parsed = parseDesignation(query);
  if (parsed?.kind === "hip") {
    const row = catalogue.rowOfHip(parsed.number);
    return row >= 0 ? found("catalogue number", [{ row, cased: "" }]) : { found: false, suggestions: [] };
  }
  if (parsed?.kind === "catalogue") {
    const rows = exact.get(`c:${parsed.key}`);
    return rows ? found("catalogue number", rows) : { found: false, suggestions: [] };
  }
  if (parsed) {
    const rows = exact.get(`d:${parsed.key}`);
    if (rows) return found("designation", preferCase(rows, parsed.typedPrefix));
    const components = bayerComponents(catalogue, parsed.key);
    if (components.length > 0) return found("designation", components);
  }
  const named = exact.get(`n:${foldText(query)}`);
  if (named) return found("name", named);
  if (!parsed) {
    const q = fuzzyForm(query);
    const allowance = typoAllowance(Array.from(q).length);
    if (allowance > 0) {
      let best = Number.POSITIVE_INFINITY;
      let bestRows = new Set<number>();
      for (const h of catalogue.index.fuzzy.search(q, CANDIDATE_SIMILARITY, 50)) {
        const text = catalogue.index.fuzzy.texts[h.id];
        if (digitsOf(text) !== digitsOf(q)) continue;
        const d = editDistance(q, text);
        const row = catalogue.index.fuzzyRow[h.id];
        if (d < best) {
          best = d;
          bestRows = new Set([row]);
        } else if (d === best) bestRows.add(row);
      }
      if (best <= allowance && bestRows.size === 1) {
        const [row] = bestRows;
        return found("typo", [{ row, cased: "" }]);
      }
    }
  }
  return { found: false, suggestions: nearNames(catalogue, query) };
}

/**
 * Names to offer while a name is being typed: the exact match first (not a typo correction), then names and designations that
 * begin with the text (brightest first), then trigram neighbours; distinct stars, at most `limit`.
 */
export function suggestStars(
  catalogue: StarCatalogue,
  text: string,
  limit = 8,
): { hip: number; name: string; vMag: number }[] {
  const rows: number[] = [];
  const add = (row: number) => {
    if (!rows.includes(row)) rows.push(row);
  };
  const q = fuzzyForm(text);
  if (q === "") return [];
  const hit = lookupStar(catalogue, text);
  if (hit.found && hit.matchedBy !== "typo") add(hit.row);
  const texts = catalogue.index.fuzzy.texts;
  const prefixed: number[] = [];
  for (let id = 0; id < texts.length; id++) if (texts[id].startsWith(q)) prefixed.push(catalogue.index.fuzzyRow[id]);
  prefixed.sort((a, b) => catalogue.vMag[a] - catalogue.vMag[b]);
  for (const row of prefixed) add(row);
  for (const h of catalogue.index.fuzzy.search(q, SUGGESTION_SIMILARITY, 50)) add(catalogue.index.fuzzyRow[h.id]);
  return rows.slice(0, limit).map((row) => ({
    hip: catalogue.hip[row],
    name: displayName(catalogue, row),
    vMag: catalogue.vMag[row],
  }));
}
