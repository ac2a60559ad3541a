/** The band editor's loaders and actions (new and edit), on the registry's editor skeleton. */
import type { LoaderFunctionArgs, Params } from "react-router";
import type { Database } from "~/db/client.server";
import { insertRecord, updateRecord } from "~/services/registry/commands.server";
import { getBand } from "~/services/registry/queries.server";
import { BandFormSchema, micronsToMetres } from "~/services/registry/schemas";
import * as editor from "./editor.server";
import { BAND_FIELDS, namesOf } from "./fields";
import { loadInstrument } from "./instrument-editor.server";
import { instrumentHref } from "./links";

const loadBand = (db: Database, params: Params) => editor.loadOr404(db, "band", params.bandId, getBand);
type Band = Awaited<ReturnType<typeof loadBand>>["band"];
type Instrument = { id: number; name: string };

export async function newBandLoader(args: LoaderFunctionArgs) {
  const instrument = await loadInstrument(await editor.adminDb(args), args.params);
  return { instrument: { id: instrument.id, name: instrument.name } };
}

export async function editBandLoader(args: LoaderFunctionArgs) {
  const { band, instrument } = (await editor.editing(args, loadBand)).row;
  return { band, instrument: { id: instrument.id, name: instrument.name } };
}

/** Saves a band typed in micrometres; it is kept in metres. */
function save({ db, actorId }: editor.Admin, form: FormData, instrument: Instrument, band: Band | null) {
  return editor.saveRecord(db, editor.formValues(form, namesOf(BAND_FIELDS)), {
    schema: BandFormSchema,
    unique: { entity: "band", scopeId: instrument.id, exceptId: band?.id },
    taken: (name) => `${instrument.name} already has a band named ${name}`,
    write: async ({ centralWavelengthUm, bandwidthUm, ...rest }) => {
      const values = {
        ...rest,
        centralWavelengthM: micronsToMetres(centralWavelengthUm),
        bandwidthM: micronsToMetres(bandwidthUm),
      };
      if (band) await updateRecord(db, { actorId, entity: "band", id: band.id, values });
      else await insertRecord(db, { actorId, entity: "band", values: { ...values, instrumentId: instrument.id } });
      const text = band
        ? `Band ${values.name} of ${instrument.name} saved.`
        : `Band ${values.name} added to ${instrument.name}.`;
      return { to: instrumentHref(instrument.id), text };
    },
  });
}

export const newBandAction = editor.action(loadInstrument, {
  save: ({ form, row, ...who }) => save(who, form, row, null),
});

export const editBandAction = editor.action(loadBand, {
  save: ({ form, row, ...who }) => save(who, form, row.instrument, row.band),
  delete: ({ form: _form, row: { band, instrument }, ...who }) =>
    editor.deleteUnlessReferenced(
      who,
      { entity: "band", id: band.id },
      `band ${band.name} is still referred to elsewhere (for example by proposals); nothing was deleted`,
      { to: instrumentHref(instrument.id), text: `Band ${band.name} deleted from ${instrument.name}.` },
    ),
});
