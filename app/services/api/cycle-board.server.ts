/**
 * GET /api/cycles/:cycleId/board?format=json|csv — the Ranking board of a cycle for the chair (session
 * or API token with the Ranking board's permission): the same computation as the page.
 */

import type { Database } from "~/db/client.server";
import { requireApiUser } from "~/lib/guards.server";
import { jsonResponse } from "~/lib/json.server";
import { toId } from "~/lib/not-found";
import { loadBoard } from "~/services/committee/board.server";
import { boardCsv, boardJson } from "~/services/committee/board-export";

export async function cycleBoardResponse(
  db: Database,
  { request, url, cycleIdParam }: { request: Request; url: URL; cycleIdParam: string | undefined },
): Promise<Response> {
  await requireApiUser(request, "ranking:board");
  const format = url.searchParams.get("format") ?? "json";
  if (format !== "json" && format !== "csv")
    return jsonResponse({ error: "format: must be json or csv", field: "format" }, 400);
  const cycleId = toId(cycleIdParam);
  const board = cycleId === null ? null : await loadBoard(db, { cycleId });
  if (!board) return jsonResponse({ error: "No cycle with this number.", field: "cycleId" }, 404);
  if (format === "json") return jsonResponse(boardJson(board));
  const name = board.cycle.name.replace(/[^\w.-]+/g, "_");
  return new Response(boardCsv(board), {
    status: 200,
    headers: {
      "Content-Type": "text/csv; charset=utf-8",
      "Content-Disposition": `attachment; filename="ranking-board-${name}.csv"`,
      "Cache-Control": "no-store",
    },
  });
}
