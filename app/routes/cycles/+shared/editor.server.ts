/**
 * The cycle editor's server side, one for a new cycle and an existing one: the page's data, the
 * cycle of the address (or the 404 page), and the save (field errors with status 400, or a redirect
 * to the list with a flash message).
 */
import { data, href } from "react-router";
import type { Database } from "~/db/client.server";
import { requireFormBody } from "~/lib/body.server";
import { redirectWithFlash } from "~/lib/flash.server";
import type { FieldErrors } from "~/lib/form-errors";
import { rowOfParam } from "~/lib/not-found";
import { configurationChoices } from "~/services/cycles/configurations.server";
import {
  committeeOf,
  createCycle,
  findCycleByName,
  getCycle,
  reviewerChoices,
  updateCycle,
} from "~/services/cycles/cycles.server";
import { blankCycleValues, cycleFormValues, parseCycleForm, valuesOfCycle } from "~/services/cycles/form";

type StoredCycle = NonNullable<Awaited<ReturnType<typeof getCycle>>>;

/** The cycle `raw` names, or the 404 page. */
export function cycleOfParam(db: Database, raw: string | undefined): Promise<StoredCycle> {
  return rowOfParam(raw, (cycleId) => getCycle(db, { cycleId }), "No cycle with this number.");
}

/** The configurations to offer, and the form's values: the cycle's, or a blank form offering them all. */
export async function cycleEditorPage(db: Database, cycle: StoredCycle | null) {
  const [configurations, reviewers, committee] = await Promise.all([
    configurationChoices(db),
    reviewerChoices(db),
    cycle ? committeeOf(db, { cycleId: cycle.id }) : Promise.resolve([]),
  ]);
  const values = cycle ? valuesOfCycle({ ...cycle, committee: committee.map((m) => m.id) }) : blankCycleValues();
  return { configurations, reviewers, values };
}

/** Checks the posted form and creates the cycle (`cycle` null) or updates it. */
export async function saveCycle(
  request: Request,
  db: Database,
  { cycle, createdById }: { cycle: StoredCycle | null; createdById: number },
) {
  const ids = (await configurationChoices(db)).map((c) => c.id);
  const reviewerIds = (await reviewerChoices(db)).map((r) => r.id);
  const values = cycleFormValues(await requireFormBody(request), ids);
  const refuse = (errors: FieldErrors) => data({ values, errors }, { status: 400 });
  const parsed = parseCycleForm(values, ids, reviewerIds);
  if (!parsed.ok) return refuse(parsed.errors);
  const input = parsed.value;
  const clash = await findCycleByName(db, input.name);
  if (clash && clash.id !== cycle?.id) return refuse({ name: `Name: a cycle called ${input.name} exists already` });
  if (!cycle) {
    // A new cycle is prepared first; the chair opens it for proposals on its page.
    const created = await createCycle(db, { ...input, state: "draft" }, createdById);
    return redirectWithFlash(href("/cycles"), {
      kind: "success",
      text: `Cycle ${created.name} created. Open it for proposals on its page when it is ready.`,
    });
  }
  const result = await updateCycle(db, { cycleId: cycle.id, input });
  if (!result.ok) {
    if (result.blocked.length) {
      const blocked = result.blocked.join(", ");
      return refuse({ offered: `Configurations: proposals already request ${blocked}; keep them on offer` });
    }
    return refuse(result.errors);
  }
  return redirectWithFlash(href("/cycles"), { kind: "success", text: `Cycle ${input.name} saved.` });
}
