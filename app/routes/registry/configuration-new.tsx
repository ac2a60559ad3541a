import { data } from "react-router";
import * as v from "valibot";
import { ErrorPage } from "~/components/ErrorPage";
import { CONFIGURATION_FIELDS, CONFIGURATION_LABELS, ConfigurationFields, EditForm } from "~/components/registry/forms";
import { registryPaths } from "~/components/registry/paths";
import { ButtonLink, Card, EmptyState, PageHeader } from "~/components/ui";
import { database } from "~/db/client.server";
import { redirectWithFlash } from "~/lib/flash.server";
import { requirePermission } from "~/lib/guards.server";
import {
  configurationNameTaken,
  formValues,
  getSite,
  pgCode,
  readForm,
  resolveSite,
  saveConfiguration,
  toId,
  widestInstrument,
} from "~/services/registry/admin.server";
import { ConfigurationSchema, fieldErrors } from "~/services/registry/io";
import { loadSiteRegistry } from "~/services/registry/queries.server";
import type { Route } from "./+types/configuration-new";

export async function loader({ request, url }: Route.LoaderArgs) {
  await requirePermission(request, "registry:edit");
  const db = database();
  const site = await resolveSite(db, url.searchParams.get("site"));
  if (!site) {
    if (url.searchParams.get("site")) throw data("There is no site with that number.", { status: 404 });
    return { site: null, stations: [], widest: 0 };
  }
  const [registry, widest] = await Promise.all([loadSiteRegistry(db, site.id), widestInstrument(db, site.id)]);
  return {
    site: { id: site.id, name: site.name },
    stations: (registry?.stations ?? []).map((s) => ({ name: s.name, eastM: s.eastM, northM: s.northM })),
    widest,
  };
}

export async function action({ request }: Route.ActionArgs) {
  await requirePermission(request, "registry:edit");
  const read = await readForm(request);
  if ("error" in read)
    return data({ errors: { form: read.error }, values: {} as Record<string, string> }, { status: read.status });
  const db = database();
  // An unticked checkbox sends nothing: not offered.
  const values = {
    ...formValues(read.form, CONFIGURATION_FIELDS),
    offered: read.form.get("offered") === "on" ? "on" : "off",
  };
  const siteId = toId(read.form.get("siteId"));
  const site = siteId === null ? null : await getSite(db, siteId);
  if (!site)
    return data({ errors: { form: "the site was not found; it may have been deleted" }, values }, { status: 400 });
  const parsed = v.safeParse(ConfigurationSchema, values);
  if (!parsed.success) return data({ errors: fieldErrors(parsed.issues), values }, { status: 400 });
  const taken = { errors: { name: `${parsed.output.name} is already a configuration at ${site.name}` }, values };
  if (await configurationNameTaken(db, site.id, parsed.output.name)) return data(taken, { status: 400 });
  let saved: Awaited<ReturnType<typeof saveConfiguration>>;
  try {
    saved = await saveConfiguration(db, site.id, null, parsed.output);
  } catch (e) {
    if (pgCode(e) === "23505") return data(taken, { status: 400 });
    throw e;
  }
  if (!saved.ok) {
    return data(
      {
        errors: {
          stations: `${saved.unknownStations.join(", ")} ${saved.unknownStations.length > 1 ? "are not stations" : "is not a station"} at ${site.name}`,
        },
        values,
      },
      { status: 400 },
    );
  }
  const widest = await widestInstrument(db, site.id);
  const size = parsed.output.stations.length;
  const note =
    widest > 0 && size > widest
      ? ` Note: no instrument combines more than ${widest} telescopes, and it has ${size}.`
      : "";
  return redirectWithFlash(registryPaths.overview(site.id), {
    kind: note ? "info" : "success",
    text: `Configuration ${parsed.output.name} added.${note}`,
  });
}

export const meta: Route.MetaFunction = () => [{ title: "New configuration — Array registry — Fringe Docket" }];

export default function NewConfiguration({ loaderData, actionData }: Route.ComponentProps) {
  const { site } = loaderData;
  if (!site) {
    return (
      <>
        <PageHeader title="New configuration" />
        <EmptyState
          title="Add the site first"
          action={<ButtonLink to={registryPaths.newSite()}>Add a site</ButtonLink>}
        >
          A configuration is a set of the site's stations.
        </EmptyState>
      </>
    );
  }
  return (
    <>
      <PageHeader title="New configuration" lead={`A named set of ${site.name}'s stations that cycles can offer.`} />
      <Card>
        <EditForm
          state={actionData}
          labels={CONFIGURATION_LABELS}
          submitLabel="Add configuration"
          cancelTo={registryPaths.overview(site.id)}
          ariaLabel="New configuration"
        >
          <input type="hidden" name="siteId" value={site.id} />
          <ConfigurationFields
            state={actionData}
            defaults={{ offered: "on" }}
            stations={loaderData.stations}
            widest={loaderData.widest}
          />
        </EditForm>
      </Card>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
