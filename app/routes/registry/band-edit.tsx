import { data } from "react-router";
import * as v from "valibot";
import { ErrorPage } from "~/components/ErrorPage";
import { BAND_FIELDS, BAND_LABELS, BandFields, DeleteCard, EditForm } from "~/components/registry/forms";
import { registryPaths } from "~/components/registry/paths";
import { Card, PageHeader } from "~/components/ui";
import { database } from "~/db/client.server";
import { redirectWithFlash } from "~/lib/flash.server";
import { requirePermission } from "~/lib/guards.server";
import {
  bandNameTaken,
  deleteBand,
  formValues,
  getBand,
  idParam,
  pgCode,
  readEditForm,
  updateBand,
} from "~/services/registry/admin.server";
import { BandFormSchema, fieldErrors, metresToMicrons, micronsToMetres } from "~/services/registry/io";
import type { Route } from "./+types/band-edit";

async function bandOr404(params: { bandId?: string }) {
  const found = await getBand(database(), idParam(params.bandId, "band"));
  if (!found) throw data("There is no band with that number.", { status: 404 });
  return found;
}

export async function loader({ request, params }: Route.LoaderArgs) {
  await requirePermission(request, "registry:edit");
  const { band, instrument } = await bandOr404(params);
  return { band, instrument: { id: instrument.id, name: instrument.name } };
}

export async function action({ request, params }: Route.ActionArgs) {
  await requirePermission(request, "registry:edit");
  const db = database();
  const { band, instrument } = await bandOr404(params);
  const read = await readEditForm(request);
  if ("error" in read)
    return data({ errors: { form: read.error }, values: {} as Record<string, string> }, { status: read.status });

  if (read.intent === "delete") {
    try {
      await deleteBand(db, band.id);
    } catch (e) {
      if (pgCode(e) !== "23503") throw e;
      return data(
        {
          errors: {
            form: `band ${band.name} is still referred to elsewhere (for example by proposals); nothing was deleted`,
          },
          values: {} as Record<string, string>,
        },
        { status: 409 },
      );
    }
    return redirectWithFlash(registryPaths.editInstrument(instrument.id), {
      kind: "success",
      text: `Band ${band.name} deleted from ${instrument.name}.`,
    });
  }

  const values = formValues(read.form, BAND_FIELDS);
  const parsed = v.safeParse(BandFormSchema, values);
  if (!parsed.success) return data({ errors: fieldErrors(parsed.issues), values }, { status: 400 });
  const { centralWavelengthUm, bandwidthUm, ...rest } = parsed.output;
  const next = {
    ...rest,
    centralWavelengthM: micronsToMetres(centralWavelengthUm),
    bandwidthM: micronsToMetres(bandwidthUm),
  };
  const taken = { errors: { name: `${instrument.name} already has a band named ${next.name}` }, values };
  if (await bandNameTaken(db, instrument.id, next.name, band.id)) return data(taken, { status: 400 });
  try {
    await updateBand(db, band.id, next);
  } catch (e) {
    if (pgCode(e) === "23505") return data(taken, { status: 400 });
    throw e;
  }
  return redirectWithFlash(registryPaths.editInstrument(instrument.id), {
    kind: "success",
    text: `Band ${next.name} of ${instrument.name} saved.`,
  });
}

export const meta: Route.MetaFunction = ({ data: d }) => [
  { title: `Edit band ${d?.band.name ?? ""} — Array registry — Fringe Docket` },
];

export default function EditBand({ loaderData, actionData }: Route.ComponentProps) {
  const { band, instrument } = loaderData;
  const defaults = {
    name: band.name,
    centralWavelengthUm: String(metresToMicrons(band.centralWavelengthM)),
    bandwidthUm: String(metresToMicrons(band.bandwidthM)),
    channels: String(band.channels),
    limitingMagnitude: String(band.limitingMagnitude),
  };
  return (
    <>
      <PageHeader title={`Edit band ${band.name} of ${instrument.name}`} />
      <div className="grid grid-cols-1 gap-6">
        <Card>
          <EditForm
            state={actionData}
            labels={BAND_LABELS}
            submitLabel="Save band"
            cancelTo={registryPaths.editInstrument(instrument.id)}
            ariaLabel={`Edit band ${band.name}`}
          >
            <BandFields state={actionData} defaults={defaults} />
          </EditForm>
        </Card>
        <DeleteCard title="Delete this band" buttonLabel={`Delete band ${band.name}`}>
          This cannot be undone.
        </DeleteCard>
      </div>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
