/** The configuration editor's loaders and actions (new and edit), on the registry's editor skeleton. */
import type { LoaderFunctionArgs, Params } from "react-router";
import type { Database } from "~/db/client.server";
import { saveConfiguration } from "~/services/registry/commands.server";
import { getConfiguration, siteMap, widestInstrument } from "~/services/registry/queries.server";
import { ConfigurationSchema } from "~/services/registry/schemas";
import * as editor from "./editor.server";
import { CONFIGURATION_FIELDS, namesOf } from "./fields";
import { overviewHref } from "./links";

const loadConfiguration = (db: Database, params: Params) =>
  editor.loadOr404(db, "configuration", params.configurationId, getConfiguration);
type Configuration = Awaited<ReturnType<typeof loadConfiguration>>;

/** The site plan and the widest instrument, for the station list's map and warning. */
async function siteFigures(db: Database, siteId: number) {
  const [map, widest] = await Promise.all([siteMap(db, { siteId }), widestInstrument(db, { siteId })]);
  return { ...map, widest };
}

export async function newConfigurationLoader(args: LoaderFunctionArgs) {
  const db = await editor.adminDb(args);
  const site = await editor.siteOfPage(db, args.url);
  if (!site) return { site, stations: [], widest: 0 };
  const { stations, widest } = await siteFigures(db, site.id);
  return { site, stations, widest };
}

export async function editConfigurationLoader(args: LoaderFunctionArgs) {
  const { db, row: configuration } = await editor.editing(args, loadConfiguration);
  return { configuration, ...(await siteFigures(db, configuration.siteId)) };
}

/** The form as typed; an unticked checkbox sends nothing: not offered. */
const readConfiguration = (form: FormData): editor.FormValues => ({
  ...editor.formValues(form, namesOf(CONFIGURATION_FIELDS)),
  offered: form.get("offered") === "on" ? "on" : "off",
});

const save = editor.siteSaver({
  schema: ConfigurationSchema,
  entity: "configuration",
  write: async ({ db, actorId }, record, siteId, configuration: Configuration | null) => {
    const saved = await saveConfiguration(db, { actorId, siteId, id: configuration?.id, values: record });
    if (!saved.ok) {
      const unknown = saved.unknownStations;
      const are = unknown.length > 1 ? "are not stations" : "is not a station";
      return { refused: { stations: `${unknown.join(", ")} ${are} at ${await editor.siteName(db, siteId)}` } };
    }
    const widest = await widestInstrument(db, { siteId });
    const size = record.stations.length;
    const note =
      widest > 0 && size > widest
        ? ` Note: no instrument combines more than ${widest} telescopes, and it has ${size}.`
        : "";
    const text = `Configuration ${record.name} ${configuration ? "saved" : "added"}.${note}`;
    return { to: overviewHref(siteId), text, kind: note ? "info" : "success" };
  },
});

/** Deletes the configuration; its stations stay. Refused while proposals or cycles refer to it. */
const removeConfiguration = ({ form: _form, row, ...who }: editor.Post<Configuration>) =>
  editor.deleteUnlessReferenced(
    who,
    { entity: "configuration", id: row.id },
    `${row.name} is still referred to elsewhere (for example by proposals or a cycle); withdraw it from those first, or untick “Offered” instead`,
    { to: overviewHref(row.siteId), text: `Configuration ${row.name} deleted.` },
  );

export const [newConfigurationAction, editConfigurationAction] = editor.atSiteActions(
  readConfiguration,
  loadConfiguration,
  save,
  removeConfiguration,
);
