/** The station editor's loaders and actions (new and edit), on the registry's editor skeleton. */
import { data, type LoaderFunctionArgs, type Params } from "react-router";
import type { Database } from "~/db/client.server";
import { deleteStation, insertRecord, updateRecord } from "~/services/registry/commands.server";
import { configurationsUsingStation, getStation, siteMap } from "~/services/registry/queries.server";
import { StationSchema } from "~/services/registry/schemas";
import * as editor from "./editor.server";
import { namesOf, STATION_FIELDS } from "./fields";
import { overviewHref, stationHref } from "./links";

const loadStation = (db: Database, params: Params) => editor.loadOr404(db, "station", params.stationId, getStation);
type Station = Awaited<ReturnType<typeof loadStation>>;

export async function newStationLoader(args: LoaderFunctionArgs) {
  const db = await editor.adminDb(args);
  const site = await editor.siteOfPage(db, args.url);
  return { site, stations: site ? (await siteMap(db, { siteId: site.id })).stations : [] };
}

export async function editStationLoader(args: LoaderFunctionArgs) {
  const { db, row: station } = await editor.editing(args, loadStation);
  const [map, usedBy] = await Promise.all([
    siteMap(db, { siteId: station.siteId }),
    configurationsUsingStation(db, { stationId: station.id }),
  ]);
  return { station, siteName: map.siteName, usedBy, stations: map.stations };
}

const saveStation = editor.siteSaver({
  schema: StationSchema,
  entity: "station",
  write: async ({ db, actorId }, record, siteId, station: Station | null) => {
    if (!station) await insertRecord(db, { actorId, entity: "station", values: { ...record, siteId } });
    else await updateRecord(db, { actorId, entity: "station", id: station.id, values: record });
    const text = `Station ${record.name} ${station ? "saved" : "added"}.`;
    return { to: station ? stationHref(station.id) : overviewHref(siteId), text };
  },
});

/** Deletes the station, unless a configuration uses it: then says which, and deletes nothing. */
async function removeStation({ db, actorId, row: station }: editor.Post<Station>) {
  const result = await deleteStation(db, { actorId, stationId: station.id });
  if (result.deleted)
    return editor.sendOn({ to: overviewHref(station.siteId), text: `Station ${station.name} deleted.` });
  const many = result.usedBy.length > 1;
  const deleteRefused = `${station.name} cannot be deleted while ${many ? "configurations use" : "a configuration uses"} it: ${result.usedBy.join(", ")}. Take it out of ${many ? "them" : "it"} first.`;
  return data<editor.EditorState>({ errors: {}, values: {}, deleteRefused }, { status: 409 });
}

const readStation = (form: FormData) => editor.formValues(form, namesOf(STATION_FIELDS));

export const [newStationAction, editStationAction] = editor.atSiteActions(
  readStation,
  loadStation,
  saveStation,
  removeStation,
);
