/**
 * Review normalization and ranking (the `rank` contract).
 *
 * Per reviewer r: μ_r and σ_r are the mean and population standard deviation of r's scores in the
 * request. Each review gets z = (score − μ_r)/σ_r, or z = 0 when r has fewer than 2 reviews or σ_r = 0
 * (nothing to calibrate against). A proposal's `normalizedScore` is the mean z of its reviews; its
 * `meanScore` the mean raw score and `spread` the population SD of its raw scores (0 for one review).
 *
 * Orientation: z keeps the direction of the scale — lower is better when `best < worst`, higher when
 * `best > worst` — so no sign is flipped; only the sort direction follows the scale.
 *
 * Rank 1 = best: by normalizedScore toward the better end, then meanScore toward the better end, then
 * proposal id (ascending by UTF-16 code units, independent of locale). Every number is rounded to
 * {@link RANK_DECIMALS} decimals and the ranking compares those rounded values, so scores that agree
 * to 1e-10 (exact ties that floating-point sums left an ulp apart) count as tied and the printed
 * order is always consistent with the printed numbers.
 *
 * Proposals are listed by rank, reviewers by id. The request must be valid (see api/rank.ts); a repeated
 * (reviewer, proposal) pair throws a RangeError.
 */
import { roundTo } from "../math";
import type { RankInput, ReviewScore } from "./inputs";
import { meanAndPopulationSd } from "./stats";

/** Decimals kept in every number of the ranking (and used for its comparisons). */
export const RANK_DECIMALS = 10;

export interface RankedProposal {
  proposal: string;
  /** Number of reviews of the proposal. */
  reviews: number;
  meanScore: number;
  /** Population SD of the proposal's scores; 0 for one review. */
  spread: number;
  /** Mean z-score of the proposal's reviews. */
  normalizedScore: number;
  /** 1 = best; 1..n, each once. */
  rank: number;
}

export interface ReviewerCalibration {
  reviewer: string;
  reviews: number;
  meanScore: number;
  /** Population SD of the reviewer's scores; 0 for one review. */
  sdScore: number;
}

export interface RankResult {
  /** In rank order. */
  proposals: RankedProposal[];
  /** In id order. */
  reviewers: ReviewerCalibration[];
}

/** Ordering of ids by UTF-16 code units (locale-independent, stable across machines). */
export function compareIds(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

/** The first review repeating an earlier (reviewer, proposal) pair, with the index of the earlier one. */
export function findDuplicateReview(
  reviews: readonly Pick<ReviewScore, "reviewer" | "proposal">[],
): { index: number; firstIndex: number } | null {
  const seen = new Map<string, Map<string, number>>();
  for (let i = 0; i < reviews.length; i++) {
    const { reviewer, proposal } = reviews[i];
    let byProposal = seen.get(reviewer);
    if (!byProposal) {
      byProposal = new Map();
      seen.set(reviewer, byProposal);
    }
    const first = byProposal.get(proposal);
    if (first !== undefined) return { index: i, firstIndex: first };
    byProposal.set(proposal, i);
  }
  return null;
}

function groupIndices(reviews: readonly ReviewScore[], key: "reviewer" | "proposal"): Map<string, number[]> {
  const out = new Map<string, number[]>();
  for (let i = 0; i < reviews.length; i++) {
    const k = reviews[i][key];
    const list = out.get(k);
    if (list) list.push(i);
    else out.set(k, [i]);
  }
  return out;
}

const scoresAt = (reviews: readonly ReviewScore[], idx: readonly number[]) =>
  Float64Array.from(idx, (i) => reviews[i].score);

/**
 * z-score of each review (same order as `reviews`), unrounded: (score − μ_r)/σ_r, or 0 for a reviewer
 * with fewer than 2 reviews or σ_r = 0.
 */
export function reviewZScores(reviews: readonly ReviewScore[]): Float64Array {
  const z = new Float64Array(reviews.length);
  for (const idx of groupIndices(reviews, "reviewer").values()) {
    const { n, mean, sd } = meanAndPopulationSd(scoresAt(reviews, idx));
    if (n < 2 || sd === 0) continue;
    for (const i of idx) z[i] = (reviews[i].score - mean) / sd;
  }
  return z;
}

/** Normalizes and ranks the reviews of a validated `rank` request. */
export function rankReviews(input: RankInput): RankResult {
  const { scale, reviews } = input;
  if (!(scale.best !== scale.worst)) throw new RangeError("scale.worst: must differ from scale.best");
  const dup = findDuplicateReview(reviews);
  if (dup) throw new RangeError(`reviews[${dup.index}]: repeats reviews[${dup.firstIndex}]`);

  const r = (x: number) => roundTo(x, RANK_DECIMALS) + 0; // + 0 turns −0 into 0
  const z = reviewZScores(reviews);

  const reviewers: ReviewerCalibration[] = [];
  for (const [reviewer, idx] of groupIndices(reviews, "reviewer")) {
    const { n, mean, sd } = meanAndPopulationSd(scoresAt(reviews, idx));
    reviewers.push({ reviewer, reviews: n, meanScore: r(mean), sdScore: r(sd) });
  }
  reviewers.sort((a, b) => compareIds(a.reviewer, b.reviewer));

  const proposals: RankedProposal[] = [];
  for (const [proposal, idx] of groupIndices(reviews, "proposal")) {
    const { n, mean, sd } = meanAndPopulationSd(scoresAt(reviews, idx));
    let zSum = 0;
    for (const i of idx) zSum += z[i];
    proposals.push({ proposal, reviews: n, meanScore: r(mean), spread: r(sd), normalizedScore: r(zSum / n), rank: 0 });
  }
  // Toward the better end: ascending when lower scores are better, descending otherwise.
  const dir = scale.best < scale.worst ? 1 : -1;
  proposals.sort(
    (a, b) =>
      dir * (a.normalizedScore - b.normalizedScore) ||
      dir * (a.meanScore - b.meanScore) ||
      compareIds(a.proposal, b.proposal),
  );
  proposals.forEach((p, i) => {
    p.rank = i + 1;
  });
  return { proposals, reviewers };
}
