import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { meanAndPopulationSd, type RankInput, type RankResult, rankReviews, reviewZScores } from "~/engine";

const scale15 = { best: 1, worst: 5 };
const rv = (reviewer: string, proposal: string, score: number) => ({ reviewer, proposal, score });
const byId = (res: RankResult) => new Map(res.proposals.map((p) => [p.proposal, p]));

describe("population mean and standard deviation", () => {
  it("matches the textbook example {2,4,4,4,5,5,7,9}: mean 5, population SD 2", () => {
    // Source: the worked example of the population standard deviation in the Wikipedia article
    // "Standard deviation" (eight values, Σ(x − 5)² = 32, σ = √(32/8) = 2).
    const r = meanAndPopulationSd([2, 4, 4, 4, 5, 5, 7, 9]);
    expect(r.mean).toBe(5);
    expect(r.sd).toBeCloseTo(2, 14);
  });

  it("gives exactly 0 for equal values, even where the floating mean is an ulp off", () => {
    // 0.1 + 0.1 + 0.1 = 0.30000000000000004, / 3 ≠ 0.1: the two-pass SD would be ~1e-17, not 0.
    expect(meanAndPopulationSd([0.1, 0.1, 0.1])).toEqual({ n: 3, mean: 0.1, sd: 0 });
    expect(meanAndPopulationSd([3])).toEqual({ n: 1, mean: 3, sd: 0 });
  });
});

describe("rank: hand-worked cases", () => {
  // r1 scores P1 = 1, P2 = 3, P3 = 5: μ = 3, σ = √((4 + 0 + 4)/3) = √(8/3) = 1.6329931619;
  //   z = −2/σ = −√(3/2) = −1.2247448714, 0, +1.2247448714.
  // r2 scores P1 = 2, P2 = 2: σ = 0 → z = 0, 0.   r3 scores P3 = 4 only: fewer than 2 reviews → z = 0.
  // P1: z̄ = (−1.2247448714 + 0)/2 = −0.6123724357, mean (1 + 2)/2 = 1.5, spread √(((1−1.5)² + (2−1.5)²)/2) = 0.5
  // P2: z̄ = 0, mean 2.5, spread 0.5.   P3: z̄ = +0.6123724357, mean 4.5, spread 0.5.
  const caseA: RankInput = {
    scale: scale15,
    reviews: [
      rv("r1", "P1", 1),
      rv("r1", "P2", 3),
      rv("r1", "P3", 5),
      rv("r2", "P1", 2),
      rv("r2", "P2", 2),
      rv("r3", "P3", 4),
    ],
  };

  it("z-scores per reviewer, means, spreads and ranks (1 = best, best = 1)", () => {
    const res = rankReviews(caseA);
    expect(res.proposals.map((p) => p.proposal)).toEqual(["P1", "P2", "P3"]);
    const p = byId(res);
    expect(p.get("P1")).toMatchObject({ reviews: 2, meanScore: 1.5, spread: 0.5, rank: 1 });
    expect(p.get("P1")!.normalizedScore).toBeCloseTo(-0.6123724357, 9);
    expect(p.get("P2")).toMatchObject({ reviews: 2, meanScore: 2.5, spread: 0.5, normalizedScore: 0, rank: 2 });
    expect(p.get("P3")!.normalizedScore).toBeCloseTo(0.6123724357, 9);
    expect(p.get("P3")).toMatchObject({ meanScore: 4.5, spread: 0.5, rank: 3 });
    expect(res.reviewers).toEqual([
      { reviewer: "r1", reviews: 3, meanScore: 3, sdScore: expect.closeTo(1.6329931619, 9) },
      { reviewer: "r2", reviews: 2, meanScore: 2, sdScore: 0 },
      { reviewer: "r3", reviews: 1, meanScore: 4, sdScore: 0 },
    ]);
    const z = reviewZScores(caseA.reviews);
    expect(Array.from(z)).toEqual([expect.closeTo(-1.2247448714, 9), 0, expect.closeTo(1.2247448714, 9), 0, 0, 0]);
  });

  it("orients by the scale: with best = 5 the same scores rank the other way", () => {
    const res = rankReviews({ ...caseA, scale: { best: 5, worst: 1 } });
    expect(res.proposals.map((p) => [p.proposal, p.rank])).toEqual([
      ["P3", 1],
      ["P2", 2],
      ["P1", 3],
    ]);
    // z keeps the scale's direction: P3 (highest scores) still has z̄ = +0.61, now the better end.
    expect(res.proposals[0].normalizedScore).toBeCloseTo(0.6123724357, 9);
  });

  // Ties. r1: P1 = 1, P2 = 3 → μ = 2, σ = 1 → z = −1, +1;  r2: P1 = 3, P2 = 1 → z = +1, −1.
  // P1: z̄ = 0, mean 2; P2: z̄ = 0, mean 2 (tied on both) → by id. r3 scores P3 = 1 alone: z = 0, mean 1.
  const ties: RankInput = {
    scale: scale15,
    reviews: [rv("r1", "P2", 3), rv("r2", "P2", 1), rv("r1", "P1", 1), rv("r2", "P1", 3), rv("r3", "P3", 1)],
  };

  it("breaks a normalized-score tie by the mean toward the better end, then by proposal id", () => {
    // best = 1: all z̄ = 0; means P3 = 1 < P1 = P2 = 2 → P3, then P1, P2 by id.
    expect(rankReviews(ties).proposals.map((p) => p.proposal)).toEqual(["P3", "P1", "P2"]);
    // best = 5: higher mean is better → P1, P2 (mean 2, by id), then P3 (mean 1).
    expect(rankReviews({ ...ties, scale: { best: 5, worst: 1 } }).proposals.map((p) => p.proposal)).toEqual([
      "P1",
      "P2",
      "P3",
    ]);
  });

  it("a proposal with one review has spread 0; an empty request ranks nothing", () => {
    expect(byId(rankReviews(ties)).get("P3")).toMatchObject({ reviews: 1, spread: 0, normalizedScore: 0 });
    expect(rankReviews({ scale: scale15, reviews: [] })).toEqual({ proposals: [], reviewers: [] });
  });

  it("lists reviewers by id and compares ids by code units, not locale", () => {
    const res = rankReviews({ scale: scale15, reviews: [rv("b", "p", 1), rv("B", "p2", 1), rv("a", "P", 1)] });
    expect(res.reviewers.map((r) => r.reviewer)).toEqual(["B", "a", "b"]);
    // All z = 0 (single reviews); means 1 → order by id: "P" < "p" < "p2".
    expect(res.proposals.map((p) => p.proposal)).toEqual(["P", "p", "p2"]);
  });

  it("refuses a repeated (reviewer, proposal) pair", () => {
    expect(() => rankReviews({ scale: scale15, reviews: [rv("r1", "P1", 1), rv("r1", "P1", 2)] })).toThrow(
      /reviews\[1\]: repeats reviews\[0\]/,
    );
  });
});

// ---------------------------------------------------------------- properties

const REVIEWERS = ["r1", "r2", "r3", "r4", "r5"];
const PROPOSALS = ["P01", "P02", "P03", "P04", "P05", "P06", "P07", "P08"];
const reviewsArb = (scoreArb: fc.Arbitrary<number>) =>
  fc.uniqueArray(
    fc.record({ reviewer: fc.constantFrom(...REVIEWERS), proposal: fc.constantFrom(...PROPOSALS), score: scoreArb }),
    { selector: (r) => `${r.reviewer}/${r.proposal}`, minLength: 1, maxLength: 30 },
  );
const integerScores = reviewsArb(fc.integer({ min: 1, max: 5 }));

/** Independent z-scores: one-pass sums, σ² = E[x²] − μ² (common practice), no shared code. */
function naiveNormalized(reviews: { reviewer: string; proposal: string; score: number }[]): Map<string, number> {
  const stats = new Map<string, { n: number; s: number; s2: number }>();
  for (const r of reviews) {
    const t = stats.get(r.reviewer) ?? { n: 0, s: 0, s2: 0 };
    t.n++;
    t.s += r.score;
    t.s2 += r.score * r.score;
    stats.set(r.reviewer, t);
  }
  const acc = new Map<string, { n: number; z: number }>();
  for (const r of reviews) {
    const t = stats.get(r.reviewer)!;
    const mu = t.s / t.n;
    const variance = Math.max(0, t.s2 / t.n - mu * mu);
    const z = t.n < 2 || variance < 1e-12 ? 0 : (r.score - mu) / Math.sqrt(variance);
    const a = acc.get(r.proposal) ?? { n: 0, z: 0 };
    a.n++;
    a.z += z;
    acc.set(r.proposal, a);
  }
  return new Map([...acc].map(([p, a]) => [p, a.z / a.n]));
}

describe("rank: properties (fast-check)", () => {
  it("ranks form the permutation 1..n, listed in rank order", () => {
    fc.assert(
      fc.property(integerScores, (reviews) => {
        const res = rankReviews({ scale: scale15, reviews });
        const n = new Set(reviews.map((r) => r.proposal)).size;
        expect(res.proposals.map((p) => p.rank)).toEqual(Array.from({ length: n }, (_, i) => i + 1));
        expect(res.proposals.reduce((s, p) => s + p.reviews, 0)).toBe(reviews.length);
      }),
    );
  });

  it("normalized scores agree with an independent one-pass computation", () => {
    fc.assert(
      fc.property(integerScores, (reviews) => {
        const naive = naiveNormalized(reviews);
        for (const p of rankReviews({ scale: scale15, reviews }).proposals)
          expect(p.normalizedScore).toBeCloseTo(naive.get(p.proposal)!, 8);
      }),
    );
  });

  it("adding a constant to one reviewer's scores leaves every normalized score unchanged", () => {
    const scale = { best: 0, worst: 100 };
    fc.assert(
      fc.property(
        reviewsArb(fc.integer({ min: 0, max: 50 })),
        fc.constantFrom(...REVIEWERS),
        fc.double({ min: 0, max: 50, noNaN: true }),
        (reviews, who, c) => {
          const shifted = reviews.map((r) => (r.reviewer === who ? { ...r, score: r.score + c } : r));
          const a = byId(rankReviews({ scale, reviews }));
          const b = byId(rankReviews({ scale, reviews: shifted }));
          for (const [id, p] of a) expect(b.get(id)!.normalizedScore).toBeCloseTo(p.normalizedScore, 8);
        },
      ),
    );
  });

  it("swapping best and worst reverses the order of proposals whose scores differ", () => {
    fc.assert(
      fc.property(integerScores, (reviews) => {
        const low = rankReviews({ scale: { best: 1, worst: 5 }, reviews }).proposals;
        const high = byId(rankReviews({ scale: { best: 5, worst: 1 }, reviews }));
        for (let i = 0; i < low.length; i++)
          for (let j = i + 1; j < low.length; j++) {
            const a = low[i];
            const b = low[j];
            const tied = a.normalizedScore === b.normalizedScore && a.meanScore === b.meanScore;
            // Distinct keys: the order flips. Tied keys: proposal id decides both times.
            if (tied) expect(high.get(a.proposal)!.rank < high.get(b.proposal)!.rank).toBe(a.proposal < b.proposal);
            else expect(high.get(a.proposal)!.rank).toBeGreaterThan(high.get(b.proposal)!.rank);
          }
      }),
    );
  });
});
