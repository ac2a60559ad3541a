// POST /api/plan — one night's plan of calibrator–science–calibrator blocks.
// Request and response: docs/cli-plan.md (the same JSON as `npm run -s cli -- plan`).

import { computationAction, computationLoader } from "~/services/api/computation.server";

export const loader = computationLoader;

export const action = computationAction("plan");
