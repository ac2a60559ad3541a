/**
 * The one skeleton of the registry's editors (site, station, configuration, instrument, band), for
 * creating and editing alike; read it as a namespace (`import * as editor`). The steps: the
 * administrator's guard, the record the address names or a 404, the post read through the capped
 * reader, the values checked by the feature's schemas, a name already taken answered on the name
 * field (checked first, and again should the insert hit the unique index), and a redirect with a
 * flash message. A refused post answers `EditorState`: the form shows the messages and keeps what
 * was typed.
 */
import { type ActionFunctionArgs, data, type LoaderFunctionArgs, type Params } from "react-router";
import * as v from "valibot";
import { dbContext } from "~/context";
import type { Database } from "~/db/client.server";
import { readFormBody } from "~/lib/body.server";
import { redirectWithFlash } from "~/lib/flash.server";
import { type FieldErrors, fieldErrors } from "~/lib/form-errors";
import { requirePermission } from "~/lib/guards.server";
import { idParam, invariantResponse, toId } from "~/lib/not-found";
import { isUniqueViolation, PG_FOREIGN_KEY_VIOLATION, pgCode } from "~/lib/pg-errors";
import { deleteRecord } from "~/services/registry/commands.server";
import { getSite, nameTaken, type RegistryEntity, resolveSite } from "~/services/registry/queries.server";

export type FormValues = Record<string, string>;

/** A refused post: messages by field ("form" for the whole form), what was typed, a refused delete. */
export type EditorState = { errors: FieldErrors; values: FormValues; deleteRefused: string | null };

export const refuse = (errors: FieldErrors, values: FormValues = {}, status = 400) =>
  data<EditorState>({ errors, values, deleteRefused: null }, { status });

/** Where a saved or deleted record sends the administrator, and what the next page says. */
export type Done = { to: string; text: string; kind?: "success" | "info" };

export const sendOn = (done: Done) => redirectWithFlash(done.to, { kind: done.kind ?? "success", text: done.text });

type Answer = Response | ReturnType<typeof refuse>;

/** The database, and the administrator whose changes go into the audit log. */
export type Admin = { db: Database; actorId: number };

/** Every editor action starts here: the administrator's guard, then the database and who is asking. */
export async function admin({ request, context }: LoaderFunctionArgs): Promise<Admin> {
  const viewer = await requirePermission(request, "registry:edit");
  return { db: context.get(dbContext), actorId: viewer.user.id };
}

/** Every editor loader starts here: the administrator's guard, then the database. */
export async function adminDb(args: LoaderFunctionArgs): Promise<Database> {
  return (await admin(args)).db;
}

/** The record a route parameter names, or the 404 page "There is no {what} with that number." */
export async function loadOr404<T>(
  db: Database,
  what: string,
  raw: string | undefined,
  get: (db: Database, where: { id: number }) => Promise<T | null>,
): Promise<T> {
  const row = await get(db, { id: idParam(raw, what) });
  invariantResponse(row, `There is no ${what} with that number.`);
  return row;
}

/** An edit page's loader starts here: the guard, then the record its address names (or the 404 page). */
export async function editing<T>(args: LoaderFunctionArgs, load: (db: Database, params: Params) => Promise<T>) {
  const db = await adminDb(args);
  return { db, row: await load(db, args.params) };
}

/** The text of a form field ("" when it is missing or a file). */
export const formText = (form: FormData, key: string) => {
  const value = form.get(key);
  return typeof value === "string" ? value : "";
};

/** The text fields of a form, as typed, for the schema and for refilling the form. */
export const formValues = (form: FormData, keys: readonly string[]): FormValues =>
  Object.fromEntries(keys.map((k) => [k, formText(form, k)]));

/** A site's name for a message, "this site" should it have gone meanwhile. */
export async function siteName(db: Database, siteId: number): Promise<string> {
  return (await getSite(db, { id: siteId }))?.name ?? "this site";
}

/** The site a new page is for: `?site=<id>`, or the first site; null when there is none yet; 404 for a wrong id. */
export async function siteOfPage(db: Database, url: URL) {
  const param = url.searchParams.get("site");
  const site = await resolveSite(db, { param });
  invariantResponse(site || !param, "There is no site with that number.");
  return site ? { id: site.id, name: site.name } : null;
}

export type Post<T> = Admin & { form: FormData; row: T };
type Handler<T> = (post: Post<T>) => Promise<Answer>;
const Intent = v.picklist(["save", "delete"], "Unknown action.");

/**
 * An editor's action: guard, the record (`load` throws the 404), the post; an edit page (one with a
 * `delete` handler) also names its intent, save or delete.
 */
export function action<T>(
  load: (db: Database, params: Params) => Promise<T>,
  handlers: { save: Handler<T>; delete?: Handler<T> },
) {
  return async (args: ActionFunctionArgs): Promise<Answer> => {
    const who = await admin(args);
    const row = await load(who.db, args.params);
    const body = await readFormBody(args.request, { tooLargeMessage: "The form is too large to be a registry entry." });
    if (!body.ok) return refuse({ form: body.error }, {}, body.status);
    const post = { ...who, form: body.form, row };
    if (!handlers.delete) return handlers.save(post);
    const intent = v.safeParse(Intent, body.form.get("intent"));
    if (!intent.success) return refuse({ form: intent.issues[0].message });
    if (intent.output === "delete" && body.form.get("confirm") !== "yes")
      return refuse({ form: "Confirm the deletion in the dialog." });
    return intent.output === "delete" ? handlers.delete(post) : handlers.save(post);
  };
}

/** A new page's record: none. */
export const nothing = async () => null;

/**
 * The action of a new page for a record of a site (a station, configuration or instrument): the
 * site is the form's `siteId`, and a site deleted meanwhile refuses the post.
 */
export function newAtSiteAction(
  read: (form: FormData) => FormValues,
  save: (who: Admin, values: FormValues, siteId: number) => Promise<Answer>,
) {
  return action(nothing, {
    save: async ({ db, actorId, form }) => {
      const values = read(form);
      const id = toId(formText(form, "siteId"));
      const site = id === null ? null : await getSite(db, { id });
      if (!site) return refuse({ form: "the site was not found; it may have been deleted" }, values);
      return save({ db, actorId }, values, site.id);
    },
  });
}

/**
 * The new and the edit action of a record of a site (a station, configuration or instrument):
 * `save` writes the form as `read` takes it, for the site and the record (null when new).
 */
export function atSiteActions<T extends { siteId: number }>(
  read: (form: FormData) => FormValues,
  load: (db: Database, params: Params) => Promise<T>,
  save: (who: Admin, values: FormValues, siteId: number, row: T | null) => Promise<Answer>,
  remove: Handler<T>,
) {
  return [
    newAtSiteAction(read, (who, values, siteId) => save(who, values, siteId, null)),
    action(load, {
      save: ({ db, actorId, form, row }) => save({ db, actorId }, read(form), row.siteId, row),
      delete: remove,
    }),
  ] as const;
}

/** How a record is saved: its schema, the scope its name is unique in, and the write itself. */
export type SaveSpec<T extends { name: string }> = {
  schema: v.GenericSchema<unknown, T>;
  unique: { entity: RegistryEntity; scopeId?: number; exceptId?: number };
  /** The name field's message when another record of the scope has the name. */
  taken: (name: string) => string | Promise<string>;
  /** Writes the checked values: where to go next, or messages for the fields. */
  write: (record: T) => Promise<Done | { refused: FieldErrors }>;
};

/** The save step of every editor: check, name taken, write, flash. */
export async function saveRecord<T extends { name: string }>(
  db: Database,
  values: FormValues,
  spec: SaveSpec<T>,
): Promise<Answer> {
  const parsed = v.safeParse(spec.schema, values);
  if (!parsed.success) return refuse(fieldErrors(parsed.issues), values);
  const { name } = parsed.output;
  const taken = async () => refuse({ name: await spec.taken(name) }, values);
  if (await nameTaken(db, { ...spec.unique, name })) return taken();
  let done: Awaited<ReturnType<SaveSpec<T>["write"]>>;
  try {
    done = await spec.write(parsed.output);
  } catch (e) {
    if (isUniqueViolation(e)) return taken();
    throw e;
  }
  return "refused" in done ? refuse(done.refused, values) : sendOn(done);
}

/**
 * The save step of a station or a configuration, as `atSiteActions` takes it: the name unique at the
 * site (the refusal names the site) among the others than the record edited (null when new).
 */
export function siteSaver<Row extends { id: number }, T extends { name: string }>(spec: {
  schema: v.GenericSchema<unknown, T>;
  entity: "station" | "configuration";
  write: (who: Admin, record: T, siteId: number, existing: Row | null) => ReturnType<SaveSpec<T>["write"]>;
}) {
  return (who: Admin, values: FormValues, siteId: number, existing: Row | null): Promise<Answer> =>
    saveRecord(who.db, values, {
      schema: spec.schema,
      unique: { entity: spec.entity, scopeId: siteId, exceptId: existing?.id },
      taken: async (name) => `${name} is already a ${spec.entity} at ${await siteName(who.db, siteId)}`,
      write: (record) => spec.write(who, record, siteId, existing),
    });
}

/**
 * Deletes a configuration, an instrument or a band unless other records still refer to it: then
 * `refusal` stands on the form (status 409) and nothing goes.
 */
export async function deleteUnlessReferenced(
  { db, actorId }: Admin,
  record: { entity: "configuration" | "instrument" | "band"; id: number },
  refusal: string,
  done: Done,
): Promise<Answer> {
  return deleteOrRefuse(() => deleteRecord(db, { actorId, ...record }), { form: refusal }, done);
}

/** Runs `remove` unless other records still refer to what it deletes: then `refusal` (status 409), nothing deleted. */
export async function deleteOrRefuse(
  remove: () => Promise<unknown>,
  refusal: FieldErrors,
  done: Done,
  values: FormValues = {},
): Promise<Answer> {
  try {
    await remove();
  } catch (e) {
    if (pgCode(e) !== PG_FOREIGN_KEY_VIOLATION) throw e;
    return refuse(refusal, values, 409);
  }
  return sendOn(done);
}
