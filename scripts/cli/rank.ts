/**
 * `npm run -s cli -- rank --input FILE`: review normalization and ranking (docs/cli-rank.md).
 * Validates the request with the engine's wire schema and returns the ranking as a plain object.
 */
import { CliRequestError } from "./errors";

export async function runRank(json: unknown): Promise<unknown> {
  const { parseRankRequest, rankReviews } = await import("../../app/engine");
  const parsed = parseRankRequest(json);
  if (!parsed.ok) throw new CliRequestError(parsed.message);
  return rankReviews(parsed.value);
}
