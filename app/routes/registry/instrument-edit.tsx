import { data, Link } from "react-router";
import * as v from "valibot";
import { ErrorPage } from "~/components/ErrorPage";
import {
  DeleteCard,
  EditForm,
  INSTRUMENT_FIELDS,
  INSTRUMENT_LABELS,
  InstrumentFields,
} from "~/components/registry/forms";
import { registryPaths } from "~/components/registry/paths";
import { ButtonLink, Card, type Column, DataTable, EmptyState, PageHeader } from "~/components/ui";
import { database } from "~/db/client.server";
import { redirectWithFlash } from "~/lib/flash.server";
import { requirePermission } from "~/lib/guards.server";
import {
  deleteInstrument,
  formValues,
  getSite,
  instrumentNameTaken,
  instrumentOr404,
  largestConfiguration,
  pgCode,
  readEditForm,
  updateInstrument,
} from "~/services/registry/admin.server";
import { fieldErrors, InstrumentSchema, metresToMicrons } from "~/services/registry/io";
import type { Route } from "./+types/instrument-edit";

export async function loader({ request, params }: Route.LoaderArgs) {
  await requirePermission(request, "registry:edit");
  const db = database();
  const instrument = await instrumentOr404(database(), params.instrumentId);
  const [site, largest] = await Promise.all([
    getSite(db, instrument.siteId),
    largestConfiguration(db, instrument.siteId),
  ]);
  return { instrument, siteName: site?.name ?? "", largest };
}

export async function action({ request, params }: Route.ActionArgs) {
  await requirePermission(request, "registry:edit");
  const db = database();
  const instrument = await instrumentOr404(database(), params.instrumentId);
  const read = await readEditForm(request);
  if ("error" in read)
    return data({ errors: { form: read.error }, values: {} as Record<string, string> }, { status: read.status });

  if (read.intent === "delete") {
    try {
      await deleteInstrument(db, instrument.id);
    } catch (e) {
      if (pgCode(e) !== "23503") throw e;
      return data(
        {
          errors: {
            form: `${instrument.name} or one of its bands is still referred to elsewhere (for example by proposals); nothing was deleted`,
          },
          values: {} as Record<string, string>,
        },
        { status: 409 },
      );
    }
    return redirectWithFlash(registryPaths.overview(instrument.siteId), {
      kind: "success",
      text: `Instrument ${instrument.name} and its bands deleted.`,
    });
  }

  const values = formValues(read.form, INSTRUMENT_FIELDS);
  const parsed = v.safeParse(InstrumentSchema, values);
  if (!parsed.success) return data({ errors: fieldErrors(parsed.issues), values }, { status: 400 });
  const taken = { errors: { name: `${parsed.output.name} is already an instrument at this site` }, values };
  if (await instrumentNameTaken(db, instrument.siteId, parsed.output.name, instrument.id))
    return data(taken, { status: 400 });
  try {
    await updateInstrument(db, instrument.id, parsed.output);
  } catch (e) {
    if (pgCode(e) === "23505") return data(taken, { status: 400 });
    throw e;
  }
  return redirectWithFlash(registryPaths.overview(instrument.siteId), {
    kind: "success",
    text: `Instrument ${parsed.output.name} saved.`,
  });
}

export const meta: Route.MetaFunction = ({ data: d }) => [
  { title: `Edit ${d?.instrument.name ?? "instrument"} — Array registry — Fringe Docket` },
];

type BandRow = Awaited<ReturnType<typeof loader>>["instrument"]["bands"][number];

const bandColumns: Column<BandRow>[] = [
  {
    key: "name",
    header: "Band",
    value: (b) => b.name,
    render: (b) => (
      <Link
        to={registryPaths.editBand(b.id)}
        className="font-medium text-ember-800 underline-offset-2 hover:underline"
        aria-label={`Edit band ${b.name}`}
      >
        {b.name}
      </Link>
    ),
  },
  {
    key: "wavelength",
    header: "Central wavelength",
    unit: "µm",
    align: "right",
    value: (b) => metresToMicrons(b.centralWavelengthM),
  },
  { key: "bandwidth", header: "Bandwidth", unit: "µm", align: "right", value: (b) => metresToMicrons(b.bandwidthM) },
  { key: "channels", header: "Channels", align: "right", value: (b) => b.channels },
  { key: "limit", header: "Limiting magnitude", unit: "mag", align: "right", value: (b) => b.limitingMagnitude },
];

export default function EditInstrument({ loaderData, actionData }: Route.ComponentProps) {
  const { instrument, largest } = loaderData;
  const defaults = {
    name: instrument.name,
    description: instrument.description,
    maxTelescopes: String(instrument.maxTelescopes),
  };
  return (
    <>
      <PageHeader title={`Edit instrument ${instrument.name}`} lead={`A beam combiner at ${loaderData.siteName}.`} />
      <div className="grid grid-cols-1 gap-6">
        <Card>
          <EditForm
            state={actionData}
            labels={INSTRUMENT_LABELS}
            submitLabel="Save instrument"
            cancelTo={registryPaths.overview(instrument.siteId)}
            ariaLabel={`Edit instrument ${instrument.name}`}
          >
            <InstrumentFields state={actionData} defaults={defaults} />
            {largest && largest.size > instrument.maxTelescopes ? (
              <p className="text-sm font-medium text-caution-700">
                The largest configuration, {largest.name}, has {largest.size} stations: more than this instrument
                combines.
              </p>
            ) : null}
          </EditForm>
        </Card>
        <Card
          title="Bands"
          actions={
            <ButtonLink to={registryPaths.newBand(instrument.id)} size="sm">
              Add band
            </ButtonLink>
          }
        >
          {instrument.bands.length === 0 ? (
            <EmptyState title="No bands yet">Proposals pick an instrument band; add at least one.</EmptyState>
          ) : (
            <DataTable
              caption={`Bands of ${instrument.name}`}
              columns={bandColumns}
              rows={instrument.bands}
              rowKey={(b) => b.id}
            />
          )}
        </Card>
        <DeleteCard title="Delete this instrument" buttonLabel={`Delete ${instrument.name}`}>
          Its {instrument.bands.length} band{instrument.bands.length === 1 ? "" : "s"} go with it. This cannot be
          undone.
        </DeleteCard>
      </div>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
