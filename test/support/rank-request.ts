/**
 * A request to the `rank` computation (command line `rank`, `POST /api/rank`) on the scale 1 (best)
 * to 5 (worst), written as each reviewer's scores by proposal; the reviews follow in the order written.
 */
export function rankRequest(scores: Record<string, Record<string, number>>) {
  return {
    scale: { best: 1, worst: 5 },
    reviews: Object.entries(scores).flatMap(([reviewer, byProposal]) =>
      Object.entries(byProposal).map(([proposal, score]) => ({ reviewer, proposal, score })),
    ),
  };
}
