// POST /api/coverage — uv coverage, model visibilities, closure phases and dirty beam.
// Request and response: docs/cli.md (same JSON as `npm run -s cli -- coverage`).

import { computeCoverage, parseCoverageRequest } from "~/engine";
import { requireApiUser } from "~/lib/guards.server";
import { methodNotAllowed } from "~/lib/json.server";
import { handleComputation } from "~/services/api/computation.server";
import type { Route } from "./+types/coverage";

export async function loader({ request }: Route.LoaderArgs) {
  await requireApiUser(request);
  return methodNotAllowed();
}

export async function action({ request }: Route.ActionArgs) {
  // A session cookie or an API token (Authorization: Bearer); 401 JSON otherwise.
  await requireApiUser(request, "sketch:use");
  return handleComputation(request, parseCoverageRequest, computeCoverage);
}
