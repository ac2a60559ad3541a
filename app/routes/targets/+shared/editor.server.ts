/**
 * The target editor's server side, one for adding a target (the list page) and for editing one: the
 * viewer's target of the address (or the 404 page), the save (field errors with status 400, or a
 * redirect to the list with a flash message), and the removal.
 */
import { data, href } from "react-router";
import type { Database } from "~/db/client.server";
import { redirectWithFlash } from "~/lib/flash.server";
import { invariantResponse, toId } from "~/lib/not-found";
import { readTargetForm, targetFormValues } from "~/services/targets/form.server";
import {
  bandNames,
  createTarget,
  deleteTarget,
  getTarget,
  nameTaken,
  updateTarget,
} from "~/services/targets/targets.server";

type StoredTarget = NonNullable<Awaited<ReturnType<typeof getTarget>>>;

/** The viewer's own target, or 404 (someone else's target is not revealed). */
export async function ownTarget(db: Database, ownerId: number, raw: string | undefined): Promise<StoredTarget> {
  const targetId = toId(raw);
  const target = targetId === null ? null : await getTarget(db, { ownerId, targetId });
  invariantResponse(target, "No such target in your list.");
  return target;
}

/** The target card's post: checks the target form and adds the target (`target` null) or updates it. */
export async function saveTarget(
  db: Database,
  form: FormData,
  { ownerId, target }: { ownerId: number; target: StoredTarget | null },
) {
  const bands = await bandNames(db);
  const values = targetFormValues(form, bands);
  const read = readTargetForm(values, bands);
  const name = read.target?.name;
  if (name && (await nameTaken(db, { ownerId, name, exceptId: target?.id }))) {
    read.errors.name = `Name: you already have a target called ${name}`;
  }
  if (!read.target || Object.keys(read.errors).length) return data({ values, errors: read.errors }, { status: 400 });
  if (target) await updateTarget(db, { ownerId, targetId: target.id, target: read.target });
  else await createTarget(db, ownerId, read.target);
  const text = target ? `${read.target.name} saved.` : `${read.target.name} added to My targets.`;
  return redirectWithFlash(href("/targets"), { kind: "success", text });
}

/** The "Remove" card's post, once confirmed in its dialog. */
export async function removeTarget(db: Database, ownerId: number, target: StoredTarget, form: FormData) {
  if (form.get("confirm") !== "yes")
    return data({ removeError: "Confirm the removal in the dialog." }, { status: 400 });
  await deleteTarget(db, { ownerId, targetId: target.id });
  return redirectWithFlash(href("/targets"), { kind: "success", text: `${target.name} removed from My targets.` });
}
