import { dbContext } from "~/context";
import { requirePermission } from "~/lib/guards.server";
import { targetsToCsv } from "~/services/targets/csv";
import { listTargets } from "~/services/targets/targets.server";
import type { Route } from "./+types/export";

/** My targets as CSV, in the columns the import reads. */
export async function loader({ request, context }: Route.LoaderArgs) {
  const viewer = await requirePermission(request, "proposals:own");
  const list = await listTargets(context.get(dbContext), viewer.user.id);
  return new Response(targetsToCsv(list), {
    headers: {
      "Content-Type": "text/csv; charset=utf-8",
      "Content-Disposition": 'attachment; filename="my-targets.csv"',
      "Cache-Control": "no-store",
    },
  });
}
