import { data } from "react-router";
import * as v from "valibot";
import { ErrorPage } from "~/components/ErrorPage";
import { DeleteCard, EditForm, STATION_FIELDS, STATION_LABELS, StationFields } from "~/components/registry/forms";
import { registryPaths } from "~/components/registry/paths";
import { Card, PageHeader } from "~/components/ui";
import { database } from "~/db/client.server";
import { redirectWithFlash } from "~/lib/flash.server";
import { requirePermission } from "~/lib/guards.server";
import {
  configurationsUsingStation,
  deleteStation,
  formValues,
  getSite,
  getStation,
  idParam,
  pgCode,
  readEditForm,
  stationNameTaken,
  updateStation,
} from "~/services/registry/admin.server";
import { fieldErrors, StationSchema } from "~/services/registry/io";
import { loadSiteRegistry } from "~/services/registry/queries.server";
import type { Route } from "./+types/station-edit";

async function stationOr404(params: { stationId?: string }) {
  const station = await getStation(database(), idParam(params.stationId, "station"));
  if (!station) throw data("There is no station with that number.", { status: 404 });
  return station;
}

export async function loader({ request, params }: Route.LoaderArgs) {
  await requirePermission(request, "registry:edit");
  const db = database();
  const station = await stationOr404(params);
  const [registry, usedBy] = await Promise.all([
    loadSiteRegistry(db, station.siteId),
    configurationsUsingStation(db, station.id),
  ]);
  return {
    station,
    siteName: registry?.site.name ?? "",
    usedBy,
    stations: (registry?.stations ?? []).map((s) => ({ name: s.name, eastM: s.eastM, northM: s.northM })),
  };
}

export async function action({ request, params }: Route.ActionArgs) {
  await requirePermission(request, "registry:edit");
  const db = database();
  const station = await stationOr404(params);
  const read = await readEditForm(request);
  if ("error" in read)
    return data(
      { errors: { form: read.error }, values: {} as Record<string, string>, deleteRefused: null },
      { status: read.status },
    );

  if (read.intent === "delete") {
    const result = await deleteStation(db, station.id);
    if (!result.deleted) {
      const message = `${station.name} cannot be deleted while ${result.usedBy.length > 1 ? "configurations use" : "a configuration uses"} it: ${result.usedBy.join(", ")}. Take it out of ${result.usedBy.length > 1 ? "them" : "it"} first.`;
      return data(
        { errors: {} as Record<string, string>, values: {} as Record<string, string>, deleteRefused: message },
        { status: 409 },
      );
    }
    return redirectWithFlash(registryPaths.overview(station.siteId), {
      kind: "success",
      text: `Station ${station.name} deleted.`,
    });
  }

  const values = formValues(read.form, STATION_FIELDS);
  const parsed = v.safeParse(StationSchema, values);
  if (!parsed.success)
    return data({ errors: fieldErrors(parsed.issues), values, deleteRefused: null }, { status: 400 });
  const site = await getSite(db, station.siteId);
  const taken = {
    errors: { name: `${parsed.output.name} is already a station at ${site?.name ?? "this site"}` },
    values,
    deleteRefused: null,
  };
  if (await stationNameTaken(db, station.siteId, parsed.output.name, station.id)) return data(taken, { status: 400 });
  try {
    await updateStation(db, station.id, parsed.output);
  } catch (e) {
    if (pgCode(e) === "23505") return data(taken, { status: 400 });
    throw e;
  }
  return redirectWithFlash(registryPaths.station(station.id), {
    kind: "success",
    text: `Station ${parsed.output.name} saved.`,
  });
}

export const meta: Route.MetaFunction = ({ data: d }) => [
  { title: `Edit station ${d?.station.name ?? ""} — Array registry — Fringe Docket` },
];

export default function EditStation({ loaderData, actionData }: Route.ComponentProps) {
  const { station, usedBy } = loaderData;
  const defaults = {
    name: station.name,
    eastM: String(station.eastM),
    northM: String(station.northM),
    upM: String(station.upM),
    pathOffsetM: String(station.pathOffsetM),
  };
  const saveState = actionData?.deleteRefused ? null : actionData;
  return (
    <>
      <PageHeader
        title={`Edit station ${station.name}`}
        lead={`A station of ${loaderData.siteName}. Configurations that use it follow its new position.`}
      />
      <div className="grid grid-cols-1 gap-6">
        <Card>
          <EditForm
            state={saveState}
            labels={STATION_LABELS}
            submitLabel="Save station"
            cancelTo={registryPaths.station(station.id)}
            ariaLabel={`Edit station ${station.name}`}
          >
            <StationFields
              state={saveState}
              defaults={defaults}
              stations={loaderData.stations}
              editing={station.name}
            />
          </EditForm>
        </Card>
        <DeleteCard title="Delete this station" buttonLabel={`Delete ${station.name}`}>
          {actionData?.deleteRefused ? (
            <p
              role="alert"
              className="mb-2 rounded-lg border border-danger-700/30 bg-danger-50 p-3 font-medium text-danger-700"
            >
              {actionData.deleteRefused}
            </p>
          ) : null}
          {usedBy.length > 0
            ? `Used by ${usedBy.join(", ")}: a station in a configuration cannot be deleted.`
            : "No configuration uses this station. Deleting it cannot be undone."}
        </DeleteCard>
      </div>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
