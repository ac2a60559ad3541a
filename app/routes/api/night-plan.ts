// GET /api/nights/:date/plan?format=csv|json|ics — a stored night plan (session or API token).
// The scheduler gets the whole plan; a program's team the blocks of its programs once it is published.
import { dbContext } from "~/context";
import { requireApiUser } from "~/lib/guards.server";
import { nightPlanResponse } from "~/services/api/night-plan.server";
import type { Route } from "./+types/night-plan";

export async function loader({ request, params, context }: Route.LoaderArgs) {
  const viewer = await requireApiUser(request);
  const format = new URL(request.url).searchParams.get("format");
  return nightPlanResponse(context.get(dbContext), { date: params.date, format, viewer });
}
