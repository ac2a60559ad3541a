// POST /api/resolve — a star's position, photometry and designations from a typed name.
// Request and response: docs/cli-catalogue.md (same JSON as `npm run -s cli -- resolve`).

import { resolveAction } from "~/services/api/catalogue.server";
import { computationLoader } from "~/services/api/computation.server";

export const loader = computationLoader;

export const action = resolveAction;
