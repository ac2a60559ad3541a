// POST /api/coverage — uv coverage, model visibilities, closure phases and dirty beam.
// Request and response: docs/cli.md (same JSON as `npm run -s cli -- coverage`).

import { computationAction, computationLoader } from "~/services/api/computation.server";

export const loader = computationLoader;

export const action = computationAction("coverage");
