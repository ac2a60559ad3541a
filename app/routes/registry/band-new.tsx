import { data } from "react-router";
import * as v from "valibot";
import { ErrorPage } from "~/components/ErrorPage";
import { BAND_FIELDS, BAND_LABELS, BandFields, EditForm } from "~/components/registry/forms";
import { registryPaths } from "~/components/registry/paths";
import { Card, PageHeader } from "~/components/ui";
import { database } from "~/db/client.server";
import { redirectWithFlash } from "~/lib/flash.server";
import { requirePermission } from "~/lib/guards.server";
import {
  bandNameTaken,
  createBand,
  formValues,
  instrumentOr404,
  pgCode,
  readForm,
} from "~/services/registry/admin.server";
import { BandFormSchema, fieldErrors, micronsToMetres } from "~/services/registry/io";
import type { Route } from "./+types/band-new";

export async function loader({ request, params }: Route.LoaderArgs) {
  await requirePermission(request, "registry:edit");
  const instrument = await instrumentOr404(database(), params.instrumentId);
  return { instrument: { id: instrument.id, name: instrument.name } };
}

export async function action({ request, params }: Route.ActionArgs) {
  await requirePermission(request, "registry:edit");
  const db = database();
  const instrument = await instrumentOr404(database(), params.instrumentId);
  const read = await readForm(request);
  if ("error" in read)
    return data({ errors: { form: read.error }, values: {} as Record<string, string> }, { status: read.status });
  const values = formValues(read.form, BAND_FIELDS);
  const parsed = v.safeParse(BandFormSchema, values);
  if (!parsed.success) return data({ errors: fieldErrors(parsed.issues), values }, { status: 400 });
  const { centralWavelengthUm, bandwidthUm, ...rest } = parsed.output;
  const band = {
    ...rest,
    centralWavelengthM: micronsToMetres(centralWavelengthUm),
    bandwidthM: micronsToMetres(bandwidthUm),
  };
  const taken = { errors: { name: `${instrument.name} already has a band named ${band.name}` }, values };
  if (await bandNameTaken(db, instrument.id, band.name)) return data(taken, { status: 400 });
  try {
    await createBand(db, instrument.id, band);
  } catch (e) {
    if (pgCode(e) === "23505") return data(taken, { status: 400 });
    throw e;
  }
  return redirectWithFlash(registryPaths.editInstrument(instrument.id), {
    kind: "success",
    text: `Band ${band.name} added to ${instrument.name}.`,
  });
}

export const meta: Route.MetaFunction = () => [{ title: "New band — Array registry — Fringe Docket" }];

export default function NewBand({ loaderData, actionData }: Route.ComponentProps) {
  const { instrument } = loaderData;
  return (
    <>
      <PageHeader
        title={`New band of ${instrument.name}`}
        lead="Wavelengths in micrometres; they are kept in metres, like every wavelength in the app."
      />
      <Card>
        <EditForm
          state={actionData}
          labels={BAND_LABELS}
          submitLabel="Add band"
          cancelTo={registryPaths.editInstrument(instrument.id)}
          ariaLabel="New band"
        >
          <BandFields state={actionData} defaults={{}} />
        </EditForm>
      </Card>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
