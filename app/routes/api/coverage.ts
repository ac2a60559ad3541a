// POST /api/coverage — uv coverage, model visibilities, closure phases and dirty beam.
// Request and response: docs/cli.md (same JSON as `npm run -s cli -- coverage`).
import type { Route } from "./+types/coverage";
import { handleComputation, methodNotAllowed } from "~/services/api-json.server";
import { requireApiUser } from "~/services/auth.server";
import { computeCoverage } from "~/services/interferometry";
import { parseCoverageRequest } from "~/services/requests";

export async function loader({ request }: Route.LoaderArgs) {
  await requireApiUser(request);
  return methodNotAllowed();
}

export async function action({ request }: Route.ActionArgs) {
  // A session cookie or an API token (Authorization: Bearer); 401 JSON otherwise.
  await requireApiUser(request, "sketch:use");
  return handleComputation(request, parseCoverageRequest, computeCoverage);
}
