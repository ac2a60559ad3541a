import { data } from "react-router";
import * as v from "valibot";
import { ErrorPage } from "~/components/ErrorPage";
import {
  CONFIGURATION_FIELDS,
  CONFIGURATION_LABELS,
  ConfigurationFields,
  DeleteCard,
  EditForm,
} from "~/components/registry/forms";
import { registryPaths } from "~/components/registry/paths";
import { Card, PageHeader } from "~/components/ui";
import { database } from "~/db/client.server";
import { redirectWithFlash } from "~/lib/flash.server";
import { requirePermission } from "~/lib/guards.server";
import {
  configurationNameTaken,
  deleteConfiguration,
  formValues,
  getConfiguration,
  getSite,
  idParam,
  pgCode,
  readEditForm,
  saveConfiguration,
  widestInstrument,
} from "~/services/registry/admin.server";
import { ConfigurationSchema, fieldErrors } from "~/services/registry/io";
import { loadSiteRegistry } from "~/services/registry/queries.server";
import type { Route } from "./+types/configuration-edit";

async function configurationOr404(params: { configurationId?: string }) {
  const configuration = await getConfiguration(database(), idParam(params.configurationId, "configuration"));
  if (!configuration) throw data("There is no configuration with that number.", { status: 404 });
  return configuration;
}

export async function loader({ request, params }: Route.LoaderArgs) {
  await requirePermission(request, "registry:edit");
  const db = database();
  const configuration = await configurationOr404(params);
  const [registry, widest] = await Promise.all([
    loadSiteRegistry(db, configuration.siteId),
    widestInstrument(db, configuration.siteId),
  ]);
  return {
    configuration,
    siteName: registry?.site.name ?? "",
    stations: (registry?.stations ?? []).map((s) => ({ name: s.name, eastM: s.eastM, northM: s.northM })),
    widest,
  };
}

export async function action({ request, params }: Route.ActionArgs) {
  await requirePermission(request, "registry:edit");
  const db = database();
  const configuration = await configurationOr404(params);
  const read = await readEditForm(request);
  if ("error" in read)
    return data({ errors: { form: read.error }, values: {} as Record<string, string> }, { status: read.status });

  if (read.intent === "delete") {
    try {
      await deleteConfiguration(db, configuration.id);
    } catch (e) {
      if (pgCode(e) !== "23503") throw e;
      return data(
        {
          errors: {
            form: `${configuration.name} is still referred to elsewhere (for example by proposals or a cycle); withdraw it from those first, or untick “Offered” instead`,
          },
          values: {} as Record<string, string>,
        },
        { status: 409 },
      );
    }
    return redirectWithFlash(registryPaths.overview(configuration.siteId), {
      kind: "success",
      text: `Configuration ${configuration.name} deleted.`,
    });
  }

  // An unticked checkbox sends nothing: not offered.
  const values = {
    ...formValues(read.form, CONFIGURATION_FIELDS),
    offered: read.form.get("offered") === "on" ? "on" : "off",
  };
  const parsed = v.safeParse(ConfigurationSchema, values);
  if (!parsed.success) return data({ errors: fieldErrors(parsed.issues), values }, { status: 400 });
  const site = await getSite(db, configuration.siteId);
  const siteName = site?.name ?? "this site";
  const taken = { errors: { name: `${parsed.output.name} is already a configuration at ${siteName}` }, values };
  if (await configurationNameTaken(db, configuration.siteId, parsed.output.name, configuration.id))
    return data(taken, { status: 400 });
  let saved: Awaited<ReturnType<typeof saveConfiguration>>;
  try {
    saved = await saveConfiguration(db, configuration.siteId, configuration.id, parsed.output);
  } catch (e) {
    if (pgCode(e) === "23505") return data(taken, { status: 400 });
    throw e;
  }
  if (!saved.ok) {
    return data(
      {
        errors: {
          stations: `${saved.unknownStations.join(", ")} ${saved.unknownStations.length > 1 ? "are not stations" : "is not a station"} at ${siteName}`,
        },
        values,
      },
      { status: 400 },
    );
  }
  const widest = await widestInstrument(db, configuration.siteId);
  const size = parsed.output.stations.length;
  const note =
    widest > 0 && size > widest
      ? ` Note: no instrument combines more than ${widest} telescopes, and it has ${size}.`
      : "";
  return redirectWithFlash(registryPaths.overview(configuration.siteId), {
    kind: note ? "info" : "success",
    text: `Configuration ${parsed.output.name} saved.${note}`,
  });
}

export const meta: Route.MetaFunction = ({ data: d }) => [
  { title: `Edit ${d?.configuration.name ?? "configuration"} — Array registry — Fringe Docket` },
];

export default function EditConfiguration({ loaderData, actionData }: Route.ComponentProps) {
  const { configuration } = loaderData;
  const defaults = {
    name: configuration.name,
    description: configuration.description,
    offered: configuration.offered ? "on" : "",
    stations: configuration.stationNames.join(" "),
  };
  return (
    <>
      <PageHeader
        title={`Edit configuration ${configuration.name}`}
        lead={`A station set of ${loaderData.siteName}.`}
      />
      <div className="grid grid-cols-1 gap-6">
        <Card>
          <EditForm
            state={actionData}
            labels={CONFIGURATION_LABELS}
            submitLabel="Save configuration"
            cancelTo={registryPaths.overview(configuration.siteId)}
            ariaLabel={`Edit configuration ${configuration.name}`}
          >
            <ConfigurationFields
              state={actionData}
              defaults={defaults}
              stations={loaderData.stations}
              widest={loaderData.widest}
            />
          </EditForm>
        </Card>
        <DeleteCard title="Delete this configuration" buttonLabel={`Delete ${configuration.name}`}>
          Its stations stay registered. To keep it but stop proposers from asking for it, untick “Offered to proposers”
          instead.
        </DeleteCard>
      </div>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
