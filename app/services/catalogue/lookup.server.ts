/**
 * Star names for the pages and the API: resolving a typed name, and what to offer while one is being
 * typed. Both run on the in-memory catalogue (decision 009); a lookup takes well under a millisecond.
 */
import { designationsOf, foldText, type ResolveResponse, resolveStar, suggestStars } from "~/engine";
import { loadCatalogue } from "./data.server";
import type { StarSuggestions } from "./wire";

export type NameResolution = { ok: true; star: ResolveResponse } | { ok: false; message: string };

/**
 * A typed name → the star, or the contract's reason (`no star called "…" (did you mean …?)`). The text is
 * trimmed; an empty text is not looked up.
 */
export function resolveName(text: string): NameResolution {
  const result = resolveStar(loadCatalogue(), text);
  return result.ok ? { ok: true, star: result.value } : { ok: false, message: result.message };
}

/** Most suggestions returned. */
export const MAX_SUGGESTIONS = 8;

/** What the name field shows for a text (see StarSuggestions). */
export function starSuggestions(text: string, limit = MAX_SUGGESTIONS): StarSuggestions {
  const query = text.trim();
  if (query === "") return { query, star: null, message: null, suggestions: [] };
  const catalogue = loadCatalogue();
  const resolved = resolveName(query);
  const suggestions = suggestStars(catalogue, query, limit).map((s) => {
    const row = catalogue.rowOfHip(s.hip);
    const also = designationsOf(catalogue, row).find((d) => d !== s.name && !d.startsWith("HIP ")) ?? null;
    return { hip: s.hip, name: s.name, also, vMag: s.vMag };
  });
  // Half a name ("betel", "sir") is neither a typo of another star ("Belel") nor an unknown name: while
  // the text begins a name on offer, only an exact match is given as the answer.
  const folded = foldText(query);
  const typing = suggestions.some((s) => [s.name, s.also ?? ""].some((n) => foldText(n).startsWith(folded)));
  if (typing && (!resolved.ok || resolved.star.matchedBy === "typo")) {
    return { query, star: null, message: null, suggestions };
  }
  return {
    query,
    star: resolved.ok ? resolved.star : null,
    message: resolved.ok ? null : resolved.message,
    suggestions,
  };
}
