// GET /api/imaging/jobs/:id/oifits — the simulated data of a finished preview as an OIFITS 2 file.

import { dbContext } from "~/context";
import { requireApiUser } from "~/lib/guards.server";
import { oifitsResponse } from "~/services/api/imaging.server";
import type { Route } from "./+types/imaging-job-oifits";

export async function loader({ request, params, context }: Route.LoaderArgs) {
  const viewer = await requireApiUser(request);
  return oifitsResponse(context.get(dbContext), { viewer, idParam: params.id });
}
