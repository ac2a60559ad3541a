// GET /nights/:date/export/plan.csv | plan.json | plan.ics — the night plan as a file (resource route).
// The scheduler gets the whole plan; a program's team the blocks of its programs once the plan is published.
import * as v from "valibot";
import { dbContext } from "~/context";
import { requireUser } from "~/lib/guards.server";
import { notFound } from "~/lib/not-found";
import { nightPlanFile } from "~/services/nights/files.server";
import { EXPORT_FORMATS, NightDate } from "~/services/nights/schemas";
import type { Route } from "./+types/export";

export async function loader({ request, params, context }: Route.LoaderArgs) {
  const viewer = await requireUser(request);
  const match = /^plan\.(\w+)$/.exec(params.file ?? "");
  const format = v.safeParse(v.picklist(EXPORT_FORMATS), match?.[1]);
  const date = v.safeParse(NightDate, params.date ?? "");
  if (!format.success || !date.success)
    notFound("There is no such export: plan.csv, plan.json or plan.ics of a night YYYY-MM-DD.");
  const file = await nightPlanFile(context.get(dbContext), { date: date.output, format: format.output, viewer });
  if (!file) notFound("There is no plan of that night for you to see.");
  return new Response(file.body, {
    headers: {
      "Content-Type": file.contentType,
      "Content-Disposition": `attachment; filename="${file.filename}"`,
      "Cache-Control": "no-store",
    },
  });
}
