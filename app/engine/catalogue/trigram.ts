/**
 * Fuzzy text matching for star names: trigram similarity to find candidates, and the optimal string
 * alignment distance (Damerau–Levenshtein restricted to non-overlapping transpositions) to judge whether
 * a typed name is a small typo of a candidate.
 *
 * Trigrams follow the definition of PostgreSQL's pg_trgm module (documentation, "F.35 pg_trgm"), so the
 * in-memory index and a future database index agree: the text is lower-cased, split into words of
 * letters and digits, each word padded with two spaces in front and one behind, and the set of
 * three-character substrings taken. Similarity = |A ∩ B| / |A ∪ B| (0..1).
 */

/** Distinct trigrams of a text (pg_trgm rules; input is expected already folded to lower case). */
export function trigramsOf(text: string): string[] {
  const out = new Set<string>();
  for (const word of text.split(/[^\p{L}\p{N}]+/u)) {
    if (word === "") continue;
    const padded = `  ${word} `;
    const chars = Array.from(padded);
    for (let i = 0; i + 3 <= chars.length; i++) out.add(chars[i] + chars[i + 1] + chars[i + 2]);
  }
  return Array.from(out);
}

/** pg_trgm similarity of two texts, 0 (nothing shared) .. 1 (same trigram set). */
export function trigramSimilarity(a: string, b: string): number {
  const ta = new Set(trigramsOf(a));
  const tb = trigramsOf(b);
  if (ta.size === 0 && tb.length === 0) return a === b ? 1 : 0;
  let shared = 0;
  for (const t of tb) if (ta.has(t)) shared++;
  return shared / (ta.size + tb.length - shared);
}

/**
 * Optimal string alignment distance: the fewest insertions, deletions, substitutions and swaps of two
 * neighbouring characters turning a into b (each substring edited once). Counts code points.
 */
export function editDistance(a: string, b: string): number {
  const s = Array.from(a);
  const t = Array.from(b);
  const n = s.length;
  const m = t.length;
  if (n === 0) return m;
  if (m === 0) return n;
  let prev2 = new Array<number>(m + 1).fill(0);
  let prev = Array.from({ length: m + 1 }, (_, j) => j);
  let cur = new Array<number>(m + 1).fill(0);
  for (let i = 1; i <= n; i++) {
    cur[0] = i;
    for (let j = 1; j <= m; j++) {
      const cost = s[i - 1] === t[j - 1] ? 0 : 1;
      let d = Math.min(prev[j] + 1, cur[j - 1] + 1, prev[j - 1] + cost);
      if (i > 1 && j > 1 && s[i - 1] === t[j - 2] && s[i - 2] === t[j - 1]) d = Math.min(d, prev2[j - 2] + 1);
      cur[j] = d;
    }
    [prev2, prev, cur] = [prev, cur, prev2];
  }
  return prev[m];
}

export interface TrigramHit {
  /** Index of the matching text in the list the index was built from. */
  id: number;
  similarity: number;
}

/**
 * An inverted trigram index over a fixed list of texts (the in-memory counterpart of a GIN trigram
 * index): a search counts the trigrams each text shares with the query through the posting lists.
 */
export class TrigramIndex {
  private readonly postings = new Map<string, Int32Array>();
  private readonly sizes: Uint16Array;

  constructor(readonly texts: readonly string[]) {
    const lists = new Map<string, number[]>();
    this.sizes = new Uint16Array(texts.length);
    texts.forEach((text, id) => {
      const grams = trigramsOf(text);
      this.sizes[id] = grams.length;
      for (const g of grams) {
        const list = lists.get(g);
        if (list) list.push(id);
        else lists.set(g, [id]);
      }
    });
    for (const [g, list] of lists) this.postings.set(g, Int32Array.from(list));
  }

  /**
   * Texts whose similarity to the query is at least minSimilarity, best first (ties by id), at most
   * limit of them.
   */
  search(query: string, minSimilarity: number, limit: number): TrigramHit[] {
    const grams = trigramsOf(query);
    if (grams.length === 0) return [];
    const shared = new Map<number, number>();
    for (const g of grams) {
      const list = this.postings.get(g);
      if (!list) continue;
      for (let k = 0; k < list.length; k++) shared.set(list[k], (shared.get(list[k]) ?? 0) + 1);
    }
    const hits: TrigramHit[] = [];
    for (const [id, count] of shared) {
      const similarity = count / (grams.length + this.sizes[id] - count);
      if (similarity >= minSimilarity) hits.push({ id, similarity });
    }
    hits.sort((a, b) => b.similarity - a.similarity || a.id - b.id);
    return hits.slice(0, limit);
  }
}
