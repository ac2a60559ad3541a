/**
 * Star designations: text folding, Greek letters, and the parsing of a typed designation into the key
 * under which the catalogue indexes it.
 *
 * Keys (all lower case, one space between prefix and constellation abbreviation):
 *  - Bayer:      "alf ori", "kap1 cen" (Greek letters by their three-letter abbreviation, component digit
 *                appended); Latin-letter Bayer "c psc" (the case is kept beside the key to tell "A Car"
 *                from "a Car").
 *  - Flamsteed:  "58 ori".
 *  - Variable:   "cg and", "v822 cas" (leading zeros of V numbers dropped).
 * Catalogue numbers use a compact key without spaces: "hd39801", "hip27989", "gj4.2a".
 */
import { CONSTELLATIONS, type Constellation } from "./constellations";

/** The 24 Greek letters: symbol, the three-letter abbreviation used in designations, and the name. */
export const GREEK_LETTERS: readonly { symbol: string; abbr: string; name: string }[] = [
  ["α", "alf", "alpha"],
  ["β", "bet", "beta"],
  ["γ", "gam", "gamma"],
  ["δ", "del", "delta"],
  ["ε", "eps", "epsilon"],
  ["ζ", "zet", "zeta"],
  ["η", "eta", "eta"],
  ["θ", "tet", "theta"],
  ["ι", "iot", "iota"],
  ["κ", "kap", "kappa"],
  ["λ", "lam", "lambda"],
  ["μ", "mu", "mu"],
  ["ν", "nu", "nu"],
  ["ξ", "ksi", "xi"],
  ["ο", "omi", "omicron"],
  ["π", "pi", "pi"],
  ["ρ", "rho", "rho"],
  ["σ", "sig", "sigma"],
  ["τ", "tau", "tau"],
  ["υ", "ups", "upsilon"],
  ["φ", "phi", "phi"],
  ["χ", "chi", "chi"],
  ["ψ", "psi", "psi"],
  ["ω", "ome", "omega"],
].map(([symbol, abbr, name]) => ({ symbol, abbr, name }));

/** Every accepted spelling of a Greek letter (symbol, abbreviation, name, common variants) → abbreviation. */
const GREEK_SPELLINGS = new Map<string, string>([
  ...GREEK_LETTERS.flatMap((g) => [[g.symbol, g.abbr] as const, [g.abbr, g.abbr] as const, [g.name, g.abbr] as const]),
  ["alp", "alf"],
  ["the", "tet"],
  ["xi", "ksi"],
  ["ς", "sig"],
  ["omc", "omi"],
]);

const GREEK_SYMBOL = new Map(GREEK_LETTERS.map((g) => [g.abbr, g.symbol]));
const GREEK_NAME = new Map(GREEK_LETTERS.map((g) => [g.abbr, g.name]));

/** The Greek symbol of an abbreviation ("alf" → "α"), or null. */
export function greekSymbol(abbr: string): string | null {
  return GREEK_SYMBOL.get(abbr) ?? null;
}

/** The Greek letter name of an abbreviation ("alf" → "alpha"), or null. */
export function greekName(abbr: string): string | null {
  return GREEK_NAME.get(abbr) ?? null;
}

/** The abbreviation of a Greek symbol or spelling ("α", "alpha", "Alf" → "alf"), or null. */
export function greekAbbr(spelling: string): string | null {
  return GREEK_SPELLINGS.get(spelling.toLowerCase()) ?? null;
}

/**
 * Folds text for matching: compatibility decomposition (superscript ¹ → 1), accents dropped
 * (Bélénos → belenos, Boötes → bootes), lower case, apostrophes removed, other punctuation turned into
 * spaces, runs of spaces collapsed. Greek letters stay Greek.
 */
export function foldText(text: string): string {
  return text
    .normalize("NFKD")
    .replace(/\p{M}+/gu, "")
    .toLowerCase()
    .replace(/['’`]/g, "")
    .replace(/[^\p{L}\p{N}.]+/gu, " ")
    .replace(/(^|\s)\.+|\.+(\s|$)/g, " ")
    .replace(/\s+/g, " ")
    .trim();
}

/** Folded constellation forms (abbreviation, name, genitive) → constellation. */
const CONSTELLATION_FORMS = new Map<string, Constellation>(
  CONSTELLATIONS.flatMap((c) => [
    [c.abbr.toLowerCase(), c] as const,
    [foldText(c.name), c] as const,
    [foldText(c.genitive), c] as const,
  ]),
);

/** A typed designation understood as Bayer, Flamsteed, variable or catalogue number. */
export type ParsedDesignation =
  | { kind: "bayer" | "flamsteed" | "variable"; key: string; typedPrefix: string; constellation: Constellation }
  | { kind: "hip"; number: number }
  | { kind: "catalogue"; key: string };

/** Splits a leading Greek spelling and a component digit: "alf1" → ["alf", "1"], "α" → ["alf", ""]. */
function splitGreek(token: string): [string, string] | null {
  const m = /^(\p{L}+?)0*(\d?)$/u.exec(token);
  if (!m) return null;
  const abbr = GREEK_SPELLINGS.get(m[1]);
  return abbr ? [abbr, m[2]] : null;
}

/** Prefix tokens (before the constellation) → the key's prefix, or null when not a designation prefix. */
function parsePrefix(
  tokens: string[],
  raw: string[],
): { kind: "bayer" | "flamsteed" | "variable"; prefix: string; typed: string } | null {
  const joined = tokens.join("");
  const typed = raw.join("");
  if (tokens.length === 0 || tokens.length > 2) return null;
  if (tokens.length === 2 && !/^\d{1,2}$/.test(tokens[1])) return null;
  const greek = splitGreek(joined);
  if (greek) return { kind: "bayer", prefix: greek[0] + greek[1], typed };
  if (/^\d{1,3}$/.test(joined)) return { kind: "flamsteed", prefix: String(Number(joined)), typed };
  const vNumber = /^v0*(\d{3,4})$/.exec(joined);
  if (vNumber) return { kind: "variable", prefix: `v${vNumber[1]}`, typed };
  if (/^\p{L}\d?$/u.test(joined)) return { kind: "bayer", prefix: joined, typed };
  if (/^\p{L}{2}$/u.test(joined)) return { kind: "variable", prefix: joined, typed };
  return null;
}

/**
 * Parses typed text as a designation, or returns null when it is not one (a proper name, say).
 * Accepts "HIP 27989", "HD 39801", "GJ 411", "alf Ori", "α Ori", "Alpha Orionis", "α¹ Cen", "kap 1 Cen",
 * "58 Ori", "58 Orionis", "V0822 Cas", "CG And"; case and spacing are free.
 */
export function parseDesignation(text: string): ParsedDesignation | null {
  const folded = foldText(text);
  const compact = folded.replace(/\s+/g, "");
  const hip = /^hip(\d{1,6})$/.exec(compact);
  if (hip) return { kind: "hip", number: Number(hip[1]) };
  if (/^(hd\d{1,6}|(gj|gl|nn|wo)\d[\d.]*[a-z]?)$/.test(compact)) {
    return { kind: "catalogue", key: compact.replace(/^gl/, "gj") };
  }
  const tokens = folded.split(" ");
  const rawTokens = text
    .normalize("NFKD")
    .replace(/\p{M}+/gu, "")
    .trim()
    .split(/[\s_.,-]+/);
  for (const width of [2, 1]) {
    if (tokens.length <= width) continue;
    const constellation = CONSTELLATION_FORMS.get(tokens.slice(-width).join(" "));
    if (!constellation) continue;
    const prefix = parsePrefix(tokens.slice(0, -width), rawTokens.slice(0, Math.max(0, rawTokens.length - width)));
    if (!prefix) continue;
    return {
      kind: prefix.kind,
      key: `${prefix.prefix} ${constellation.abbr.toLowerCase()}`,
      typedPrefix: prefix.typed,
      constellation,
    };
  }
  return null;
}

/**
 * Text used for fuzzy matching: folded, Greek symbols and spellings replaced by their abbreviation
 * ("Alpha Orionsi" → "alf orionsi").
 */
export function fuzzyForm(text: string): string {
  return foldText(text)
    .split(" ")
    .map((t) => {
      const g = splitGreek(t);
      return g ? g[0] + g[1] : t;
    })
    .join(" ");
}
