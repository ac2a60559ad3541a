// POST /api/calibrators — the Calibrator shortlist of a target, best first.
// Request and response: docs/cli-catalogue.md (same JSON as `npm run -s cli -- calibrators`).

import { calibratorsAction } from "~/services/api/catalogue.server";
import { computationLoader } from "~/services/api/computation.server";

export const loader = computationLoader;

export const action = calibratorsAction;
