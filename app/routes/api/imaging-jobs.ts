// GET /api/imaging/jobs — the caller's imaging previews (?source=sketch), a proposal's (?proposalId=)
// or the chair's queue of a cycle (?cycleId=); POST — start one (docs/api.md).

import { dbContext } from "~/context";
import { requireApiUser } from "~/lib/guards.server";
import { listResponse, startResponse } from "~/services/api/imaging.server";
import type { Route } from "./+types/imaging-jobs";

export async function loader({ request, url, context }: Route.LoaderArgs) {
  const viewer = await requireApiUser(request);
  return listResponse(context.get(dbContext), { viewer, url });
}

export async function action({ request, context }: Route.ActionArgs) {
  const viewer = await requireApiUser(request, "sketch:use");
  return startResponse(context.get(dbContext), { viewer, request });
}
