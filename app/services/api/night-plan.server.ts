/**
 * `GET /api/nights/:date/plan?format=csv|json|ics`: a stored night plan for scripts (API token or
 * session). The scheduler gets the whole plan, a program's team its own blocks of a published plan;
 * errors are JSON `{error, field}` (400 for a bad date or format, 404 when there is nothing to see).
 */
import * as v from "valibot";
import type { Database } from "~/db/client.server";
import type { Viewer } from "~/lib/guards.server";
import { jsonResponse } from "~/lib/json.server";
import { nightPlanFile } from "~/services/nights/files.server";
import { EXPORT_FORMATS, NightDate } from "~/services/nights/schemas";

export async function nightPlanResponse(
  db: Database,
  { date, format, viewer }: { date: string | undefined; format: string | null; viewer: Viewer },
): Promise<Response> {
  const d = v.safeParse(NightDate, date ?? "");
  if (!d.success) return jsonResponse({ error: "date: must be a night YYYY-MM-DD", field: "date" }, 400);
  const f = v.safeParse(v.picklist(EXPORT_FORMATS), format ?? "json");
  if (!f.success) return jsonResponse({ error: "format: must be csv, json or ics", field: "format" }, 400);
  const file = await nightPlanFile(db, { date: d.output, format: f.output, viewer });
  if (!file) return jsonResponse({ error: `no plan of the night of ${d.output} for you to see`, field: null }, 404);
  return new Response(file.body, {
    headers: {
      "Content-Type": file.contentType,
      "Content-Disposition": `inline; filename="${file.filename}"`,
      "Cache-Control": "no-store",
    },
  });
}
