/** The instrument editor's loaders and actions (new and edit), on the registry's editor skeleton. */
import type { LoaderFunctionArgs, Params } from "react-router";
import type { Database } from "~/db/client.server";
import { insertRecord, updateRecord } from "~/services/registry/commands.server";
import { getInstrument, getSite, largestConfiguration } from "~/services/registry/queries.server";
import { InstrumentSchema } from "~/services/registry/schemas";
import * as editor from "./editor.server";
import { INSTRUMENT_FIELDS, namesOf } from "./fields";
import { instrumentHref, overviewHref } from "./links";

/** The instrument a route parameter names, with its bands; or the 404 page. */
export const loadInstrument = (db: Database, params: Params) =>
  editor.loadOr404(db, "instrument", params.instrumentId, getInstrument);
type Instrument = Awaited<ReturnType<typeof loadInstrument>>;

export async function newInstrumentLoader(args: LoaderFunctionArgs) {
  return { site: await editor.siteOfPage(await editor.adminDb(args), args.url) };
}

export async function editInstrumentLoader(args: LoaderFunctionArgs) {
  const { db, row: instrument } = await editor.editing(args, loadInstrument);
  const [site, largest] = await Promise.all([
    getSite(db, { id: instrument.siteId }),
    largestConfiguration(db, { siteId: instrument.siteId }),
  ]);
  return { instrument, siteName: site?.name ?? "", largest };
}

function save({ db, actorId }: editor.Admin, values: editor.FormValues, siteId: number, instrument: Instrument | null) {
  return editor.saveRecord(db, values, {
    schema: InstrumentSchema,
    unique: { entity: "instrument", scopeId: siteId, exceptId: instrument?.id },
    taken: async (name) =>
      `${name} is already an instrument at ${instrument ? "this site" : await editor.siteName(db, siteId)}`,
    write: async (record) => {
      if (instrument) {
        await updateRecord(db, { actorId, entity: "instrument", id: instrument.id, values: record });
        return { to: overviewHref(siteId), text: `Instrument ${record.name} saved.` };
      }
      const id = await insertRecord(db, { actorId, entity: "instrument", values: { ...record, siteId } });
      return { to: instrumentHref(id), text: `Instrument ${record.name} added. Now add its bands.` };
    },
  });
}

const readInstrument = (form: FormData) => editor.formValues(form, namesOf(INSTRUMENT_FIELDS));

/** Deletes the instrument with its bands. Refused while proposals refer to one of them. */
const removeInstrument = ({ form: _form, row, ...who }: editor.Post<Instrument>) =>
  editor.deleteUnlessReferenced(
    who,
    { entity: "instrument", id: row.id },
    `${row.name} or one of its bands is still referred to elsewhere (for example by proposals); nothing was deleted`,
    { to: overviewHref(row.siteId), text: `Instrument ${row.name} and its bands deleted.` },
  );

export const [newInstrumentAction, editInstrumentAction] = editor.atSiteActions(
  readInstrument,
  loadInstrument,
  save,
  removeInstrument,
);
