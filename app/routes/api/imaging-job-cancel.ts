// POST /api/imaging/jobs/:id/cancel — stops a queued or running imaging preview (its owner only).

import { dbContext } from "~/context";
import { requireApiUser } from "~/lib/guards.server";
import { methodNotAllowed } from "~/lib/json.server";
import { cancelResponse } from "~/services/api/imaging.server";
import type { Route } from "./+types/imaging-job-cancel";

export async function loader({ request }: Route.LoaderArgs) {
  await requireApiUser(request);
  return methodNotAllowed();
}

export async function action({ request, params, context }: Route.ActionArgs) {
  const viewer = await requireApiUser(request);
  return cancelResponse(context.get(dbContext), { viewer, idParam: params.id });
}
