// GET /api/cycles/:cycleId/board?format=json|csv — the Ranking board of a cycle, for the chair's session
// or API token. The same computation as the Ranking board page (services/committee/board.ts).

import { dbContext } from "~/context";
import { cycleBoardResponse } from "~/services/api/cycle-board.server";
import type { Route } from "./+types/cycle-board";

export async function loader({ request, url, params, context }: Route.LoaderArgs) {
  return cycleBoardResponse(context.get(dbContext), { request, url, cycleIdParam: params.cycleId });
}
