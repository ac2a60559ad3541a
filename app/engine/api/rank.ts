/**
 * Wire schema of the `rank` request (command line and POST /api/rank): the cycle's score scale and the
 * reviews. Pure: no I/O. Unknown keys are ignored. Every failure is one line naming the field, e.g.
 * `reviews[3].score: must lie within the scale 1–5` or `scale: is required`.
 */
import * as v from "valibot";
import type { RankInput, ScoreScale } from "../committee/inputs";
import { findDuplicateReview } from "../committee/rank";
import { finiteNumber, type ParseResult, parseRequest } from "./blocks";

/** Most reviews one request may carry. */
export const MAX_RANK_REVIEWS = 100_000;
/** Longest reviewer or proposal id, characters. */
export const MAX_RANK_ID_LENGTH = 200;

const id = () =>
  v.pipe(
    v.string("must be a string"),
    v.minLength(1, "must not be empty"),
    v.maxLength(MAX_RANK_ID_LENGTH, `must be at most ${MAX_RANK_ID_LENGTH} characters`),
  );

export const ScoreScaleSchema = v.object(
  { best: finiteNumber(), worst: finiteNumber() },
  "must be an object {best, worst}",
);

export const ReviewScoreSchema = v.object(
  { reviewer: id(), proposal: id(), score: finiteNumber() },
  "must be an object {reviewer, proposal, score}",
);

export const RankRequestSchema = v.object(
  {
    scale: ScoreScaleSchema,
    reviews: v.pipe(
      v.array(ReviewScoreSchema, "must be an array"),
      v.maxLength(MAX_RANK_REVIEWS, `must hold at most ${MAX_RANK_REVIEWS} reviews`),
    ),
  },
  "request must be a JSON object",
);

/** "1–5" for either order of the ends. */
function scaleText(scale: ScoreScale): string {
  return `${Math.min(scale.best, scale.worst)}–${Math.max(scale.best, scale.worst)}`;
}

/** Cross-field rules: distinct ends, every score inside the scale, one review per (reviewer, proposal). */
export function rankRuleFailure(r: RankInput): { field: string; message: string } | null {
  const { best, worst } = r.scale;
  if (best === worst) return { field: "scale.worst", message: "must differ from scale.best" };
  const lo = Math.min(best, worst);
  const hi = Math.max(best, worst);
  for (let i = 0; i < r.reviews.length; i++) {
    const s = r.reviews[i].score;
    if (s < lo || s > hi)
      return { field: `reviews[${i}].score`, message: `must lie within the scale ${scaleText(r.scale)}` };
  }
  const dup = findDuplicateReview(r.reviews);
  if (dup) {
    const { reviewer, proposal } = r.reviews[dup.index];
    return {
      field: `reviews[${dup.index}]`,
      message: `repeats reviews[${dup.firstIndex}]: reviewer "${reviewer}" already scored proposal "${proposal}" (one review per reviewer and proposal)`,
    };
  }
  return null;
}

/** Validates a `rank` request (already parsed from JSON). */
export function parseRankRequest(json: unknown): ParseResult<RankInput> {
  return parseRequest(RankRequestSchema, json, rankRuleFailure);
}
