// POST /api/ephemeris — a night's Sun events, sidereal time and Moon.
// Request and response: docs/cli.md (same JSON as `npm run -s cli -- ephemeris`).
import type { Route } from "./+types/ephemeris";
import { handleComputation, methodNotAllowed } from "~/services/api-json.server";
import { requireApiUser } from "~/services/auth.server";
import { computeEphemeris } from "~/services/astro";
import { parseEphemerisRequest } from "~/services/requests";

export async function loader({ request }: Route.LoaderArgs) {
  await requireApiUser(request);
  return methodNotAllowed();
}

export async function action({ request }: Route.ActionArgs) {
  // A session cookie or an API token (Authorization: Bearer); 401 JSON otherwise.
  await requireApiUser(request, "sketch:use");
  return handleComputation(request, parseEphemerisRequest, computeEphemeris);
}
