// POST /api/rank — review normalization and ranking (z-scores per reviewer, ranks, reviewer calibration).
// Request and response: docs/cli-rank.md (same JSON as `npm run -s cli -- rank`); the Ranking board uses the
// same computation.

import { computationAction, computationLoader } from "~/services/api/computation.server";

export const loader = computationLoader;

export const action = computationAction("rank");
