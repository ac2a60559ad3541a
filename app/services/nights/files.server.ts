/**
 * A night plan's export for whoever asks: the scheduler gets the whole plan (any state), a member of a
 * program's team only the blocks of their programs in a published or executed plan; anybody else, or
 * a night without such a plan, gets nothing (null), so no plan is revealed to a stranger.
 */
import type { DbOrTx } from "~/db/client.server";
import type { Role } from "~/db/schema/users";
import { planFile } from "./exports";
import { planExport } from "./queries.server";
import type { ExportFormat } from "./schemas";

export type FileViewer = {
  user: { id: number; email: string };
  roles: readonly Role[];
  permissions: ReadonlySet<string>;
};

/** The export file of the night of `date` in `format`, or null when the viewer may see nothing of it. */
export async function nightPlanFile(
  db: DbOrTx,
  { date, format, viewer }: { date: string; format: ExportFormat; viewer: FileViewer },
) {
  const plan = await planExport(db, {
    date,
    viewer: { user: viewer.user, roles: viewer.roles, scheduler: viewer.permissions.has("nights:build") },
  });
  return plan ? planFile(plan, format) : null;
}
