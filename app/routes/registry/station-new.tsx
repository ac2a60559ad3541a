import { data } from "react-router";
import * as v from "valibot";
import { ErrorPage } from "~/components/ErrorPage";
import { EditForm, STATION_FIELDS, STATION_LABELS, StationFields } from "~/components/registry/forms";
import { registryPaths } from "~/components/registry/paths";
import { ButtonLink, Card, EmptyState, PageHeader } from "~/components/ui";
import { database } from "~/db/client.server";
import { redirectWithFlash } from "~/lib/flash.server";
import { requirePermission } from "~/lib/guards.server";
import {
  createStation,
  formValues,
  getSite,
  pgCode,
  readForm,
  resolveSite,
  stationNameTaken,
  toId,
} from "~/services/registry/admin.server";
import { fieldErrors, StationSchema } from "~/services/registry/io";
import { loadSiteRegistry } from "~/services/registry/queries.server";
import type { Route } from "./+types/station-new";

export async function loader({ request, url }: Route.LoaderArgs) {
  await requirePermission(request, "registry:edit");
  const db = database();
  const site = await resolveSite(db, url.searchParams.get("site"));
  if (!site) {
    if (url.searchParams.get("site")) throw data("There is no site with that number.", { status: 404 });
    return { site: null, stations: [] };
  }
  const registry = await loadSiteRegistry(db, site.id);
  return {
    site: { id: site.id, name: site.name },
    stations: (registry?.stations ?? []).map((s) => ({ name: s.name, eastM: s.eastM, northM: s.northM })),
  };
}

export async function action({ request }: Route.ActionArgs) {
  await requirePermission(request, "registry:edit");
  const read = await readForm(request);
  if ("error" in read)
    return data({ errors: { form: read.error }, values: {} as Record<string, string> }, { status: read.status });
  const db = database();
  const siteId = toId(read.form.get("siteId"));
  const site = siteId === null ? null : await getSite(db, siteId);
  const values = formValues(read.form, STATION_FIELDS);
  if (!site)
    return data({ errors: { form: "the site was not found; it may have been deleted" }, values }, { status: 400 });
  const parsed = v.safeParse(StationSchema, values);
  if (!parsed.success) return data({ errors: fieldErrors(parsed.issues), values }, { status: 400 });
  const taken = { errors: { name: `${parsed.output.name} is already a station at ${site.name}` }, values };
  if (await stationNameTaken(db, site.id, parsed.output.name)) return data(taken, { status: 400 });
  try {
    await createStation(db, site.id, parsed.output);
  } catch (e) {
    if (pgCode(e) === "23505") return data(taken, { status: 400 });
    throw e;
  }
  return redirectWithFlash(registryPaths.overview(site.id), {
    kind: "success",
    text: `Station ${parsed.output.name} added.`,
  });
}

export const meta: Route.MetaFunction = () => [{ title: "New station — Array registry — Fringe Docket" }];

export default function NewStation({ loaderData, actionData }: Route.ComponentProps) {
  const { site } = loaderData;
  if (!site) {
    return (
      <>
        <PageHeader title="New station" />
        <EmptyState
          title="Add the site first"
          action={<ButtonLink to={registryPaths.newSite()}>Add a site</ButtonLink>}
        >
          Stations are placed relative to a site.
        </EmptyState>
      </>
    );
  }
  return (
    <>
      <PageHeader
        title="New station"
        lead={`A station of ${site.name}. The map shows where it falls among the others as you type.`}
      />
      <Card>
        <EditForm
          state={actionData}
          labels={STATION_LABELS}
          submitLabel="Add station"
          cancelTo={registryPaths.overview(site.id)}
          ariaLabel="New station"
        >
          <input type="hidden" name="siteId" value={site.id} />
          <StationFields
            state={actionData}
            defaults={{ upM: "0", pathOffsetM: "0" }}
            stations={loaderData.stations}
            editing={null}
          />
        </EditForm>
      </Card>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
