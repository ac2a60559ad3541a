// GET /api/imaging/jobs/:id — one imaging preview: state, progress and, when done, its result.

import { dbContext } from "~/context";
import { requireApiUser } from "~/lib/guards.server";
import { jobResponse } from "~/services/api/imaging.server";
import type { Route } from "./+types/imaging-job";

export async function loader({ request, params, context }: Route.LoaderArgs) {
  const viewer = await requireApiUser(request);
  return jobResponse(context.get(dbContext), { viewer, idParam: params.id });
}
