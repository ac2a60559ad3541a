// POST /api/ephemeris — a night's Sun events, sidereal time and Moon.
// Request and response: docs/cli.md (same JSON as `npm run -s cli -- ephemeris`).

import { computeEphemeris, parseEphemerisRequest } from "~/engine";
import { requireApiUser } from "~/lib/guards.server";
import { methodNotAllowed } from "~/lib/json.server";
import { handleComputation } from "~/services/api/computation.server";
import type { Route } from "./+types/ephemeris";

export async function loader({ request }: Route.LoaderArgs) {
  await requireApiUser(request);
  return methodNotAllowed();
}

export async function action({ request }: Route.ActionArgs) {
  // A session cookie or an API token (Authorization: Bearer); 401 JSON otherwise.
  await requireApiUser(request, "sketch:use");
  return handleComputation(request, parseEphemerisRequest, computeEphemeris);
}
