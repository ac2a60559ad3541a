/**
 * A request to the `rank` computation (command line `rank`, `POST /api/rank`) on the scale 1 (best)
 * to 5 (worst), written as one `[reviewer, proposal, score]` triple a review.
 */
export function rankRequest(reviews: [reviewer: string, proposal: string, score: number][]) {
  return {
    scale: { best: 1, worst: 5 },
    reviews: reviews.map(([reviewer, proposal, score]) => ({ reviewer, proposal, score })),
  };
}
