/** The site editor's loaders and actions (new and edit), on the registry's editor skeleton. */
import type { LoaderFunctionArgs, Params } from "react-router";
import type { Database } from "~/db/client.server";
import { deleteSite, insertRecord, updateRecord } from "~/services/registry/commands.server";
import { getSite, siteContents } from "~/services/registry/queries.server";
import { SiteSchema } from "~/services/registry/schemas";
import * as editor from "./editor.server";
import { namesOf, SITE_FIELDS } from "./fields";
import { overviewHref } from "./links";

const timeZones = () => Intl.supportedValuesOf("timeZone");
const loadSite = (db: Database, params: Params) => editor.loadOr404(db, "site", params.siteId, getSite);
type Site = Awaited<ReturnType<typeof loadSite>>;

export async function newSiteLoader(args: LoaderFunctionArgs) {
  await editor.adminDb(args);
  return { timeZones: timeZones() };
}

export async function editSiteLoader(args: LoaderFunctionArgs) {
  const { db, row: site } = await editor.editing(args, loadSite);
  return { site, contents: await siteContents(db, { siteId: site.id }), timeZones: timeZones() };
}

function saveSite({ db, actorId }: editor.Admin, form: FormData, site: Site | null) {
  return editor.saveRecord(db, editor.formValues(form, namesOf(SITE_FIELDS)), {
    schema: SiteSchema,
    unique: { entity: "site", exceptId: site?.id },
    taken: (name) => `a site named ${name} already exists`,
    write: async (values) => {
      if (site) await updateRecord(db, { actorId, entity: "site", id: site.id, values });
      const id = site?.id ?? (await insertRecord(db, { actorId, entity: "site", values }));
      return {
        to: overviewHref(id),
        text: site ? `Site ${values.name} saved.` : `Site ${values.name} added. Now add its stations.`,
      };
    },
  });
}

/** Deletes the site with everything at it, once its name is typed to confirm. */
async function removeSite({ db, actorId, form, row: site }: editor.Post<Site>) {
  const confirmName = editor.formText(form, "confirmName").trim();
  if (confirmName !== site.name)
    return editor.refuse({ confirmName: `type the site's name, ${site.name}, to confirm` }, { confirmName });
  return editor.deleteOrRefuse(
    () => deleteSite(db, { actorId, siteId: site.id }),
    {
      confirmName:
        "other records (such as proposals or cycles) still refer to this site's configurations or instruments; nothing was deleted",
    },
    { to: overviewHref(), text: `Site ${site.name} and everything registered at it were deleted.` },
    { confirmName },
  );
}

export const newSiteAction = editor.action(editor.nothing, { save: ({ form, ...who }) => saveSite(who, form, null) });

export const editSiteAction = editor.action(loadSite, {
  save: ({ form, row, ...who }) => saveSite(who, form, row),
  delete: removeSite,
});
