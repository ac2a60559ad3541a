import { data } from "react-router";
import * as v from "valibot";
import { ErrorPage } from "~/components/ErrorPage";
import { DeleteCard, EditForm, SITE_FIELDS, SITE_LABELS, SiteFields } from "~/components/registry/forms";
import { registryPaths } from "~/components/registry/paths";
import { Card, PageHeader, TextField } from "~/components/ui";
import { database } from "~/db/client.server";
import { redirectWithFlash } from "~/lib/flash.server";
import { requirePermission } from "~/lib/guards.server";
import {
  deleteSite,
  formValues,
  getSite,
  idParam,
  pgCode,
  readEditForm,
  siteContents,
  siteNameTaken,
  updateSite,
} from "~/services/registry/admin.server";
import { fieldErrors, SiteSchema, sentence } from "~/services/registry/io";
import type { Route } from "./+types/site-edit";

export async function loader({ request, params }: Route.LoaderArgs) {
  await requirePermission(request, "registry:edit");
  const db = database();
  const site = await getSite(db, idParam(params.siteId, "site"));
  if (!site) throw data("There is no site with that number.", { status: 404 });
  const contents = await siteContents(db, site.id);
  return { site, contents, timeZones: Intl.supportedValuesOf("timeZone") };
}

export async function action({ request, params }: Route.ActionArgs) {
  await requirePermission(request, "registry:edit");
  const db = database();
  const site = await getSite(db, idParam(params.siteId, "site"));
  if (!site) throw data("There is no site with that number.", { status: 404 });
  const read = await readEditForm(request);
  if ("error" in read)
    return data({ errors: { form: read.error }, values: {} as Record<string, string> }, { status: read.status });

  if (read.intent === "delete") {
    const confirmName = String(read.form.get("confirmName") ?? "").trim();
    if (confirmName !== site.name) {
      return data(
        {
          errors: { confirmName: `type the site's name, ${site.name}, to confirm` },
          values: { confirmName } as Record<string, string>,
        },
        { status: 400 },
      );
    }
    try {
      await deleteSite(db, site.id);
    } catch (e) {
      if (pgCode(e) !== "23503") throw e;
      return data(
        {
          errors: {
            confirmName:
              "other records (such as proposals or cycles) still refer to this site's configurations or instruments; nothing was deleted",
          },
          values: { confirmName } as Record<string, string>,
        },
        { status: 409 },
      );
    }
    return redirectWithFlash("/registry", {
      kind: "success",
      text: `Site ${site.name} and everything registered at it were deleted.`,
    });
  }

  const values = formValues(read.form, SITE_FIELDS);
  const parsed = v.safeParse(SiteSchema, values);
  if (!parsed.success) return data({ errors: fieldErrors(parsed.issues), values }, { status: 400 });
  const taken = { errors: { name: `a site named ${parsed.output.name} already exists` }, values };
  if (await siteNameTaken(db, parsed.output.name, site.id)) return data(taken, { status: 400 });
  try {
    await updateSite(db, site.id, parsed.output);
  } catch (e) {
    if (pgCode(e) === "23505") return data(taken, { status: 400 });
    throw e;
  }
  return redirectWithFlash(registryPaths.overview(site.id), {
    kind: "success",
    text: `Site ${parsed.output.name} saved.`,
  });
}

export const meta: Route.MetaFunction = ({ data: d }) => [
  { title: `Edit ${d?.site.name ?? "site"} — Array registry — Fringe Docket` },
];

export default function EditSite({ loaderData, actionData }: Route.ComponentProps) {
  const { site, contents } = loaderData;
  const defaults = {
    name: site.name,
    latitudeDeg: String(site.latitudeDeg),
    longitudeDeg: String(site.longitudeDeg),
    altitudeM: String(site.altitudeM),
    minElevationDeg: String(site.minElevationDeg),
    delayLineStrokeM: String(site.delayLineStrokeM),
    timeZone: site.timeZone,
  };
  const errors: Record<string, string> = actionData?.errors ?? {};
  const isDelete = "confirmName" in errors;
  const saveState = isDelete ? null : actionData;
  const confirmError = isDelete ? errors.confirmName : undefined;
  return (
    <>
      <PageHeader
        title={`Edit ${site.name}`}
        lead="Changes apply at once to every sketch and feasibility check that uses the site."
      />
      <div className="grid grid-cols-1 gap-6">
        <Card>
          <EditForm
            state={saveState}
            labels={SITE_LABELS}
            submitLabel="Save site"
            cancelTo={registryPaths.overview(site.id)}
            ariaLabel={`Edit ${site.name}`}
          >
            <SiteFields state={saveState} defaults={defaults} timeZones={loaderData.timeZones} />
          </EditForm>
        </Card>
        <DeleteCard
          title="Delete this site"
          buttonLabel="Delete site"
          fields={
            <div className="max-w-sm">
              <TextField
                label="Type the site's name to confirm"
                name="confirmName"
                autoComplete="off"
                defaultValue={isDelete ? (actionData?.values.confirmName ?? "") : ""}
                error={confirmError ? sentence(confirmError) : undefined}
              />
            </div>
          }
        >
          Deleting {site.name} also deletes its {contents.stations} stations, {contents.configurations} configurations
          and {contents.instruments} instruments with their bands. This cannot be undone; export the registry first if
          you may want it back.
        </DeleteCard>
      </div>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
