// POST /api/triangles — ranked station triangles for a target.
// Request and response: docs/cli.md (same JSON as `npm run -s cli -- triangles`).

import { computationAction, computationLoader } from "~/services/api/computation.server";

export const loader = computationLoader;

export const action = computationAction("triangles");
