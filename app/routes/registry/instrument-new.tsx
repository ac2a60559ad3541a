import { data } from "react-router";
import * as v from "valibot";
import { ErrorPage } from "~/components/ErrorPage";
import { EditForm, INSTRUMENT_FIELDS, INSTRUMENT_LABELS, InstrumentFields } from "~/components/registry/forms";
import { registryPaths } from "~/components/registry/paths";
import { ButtonLink, Card, EmptyState, PageHeader } from "~/components/ui";
import { database } from "~/db/client.server";
import { redirectWithFlash } from "~/lib/flash.server";
import { requirePermission } from "~/lib/guards.server";
import {
  createInstrument,
  formValues,
  getSite,
  instrumentNameTaken,
  pgCode,
  readForm,
  resolveSite,
  toId,
} from "~/services/registry/admin.server";
import { fieldErrors, InstrumentSchema } from "~/services/registry/io";
import type { Route } from "./+types/instrument-new";

export async function loader({ request, url }: Route.LoaderArgs) {
  await requirePermission(request, "registry:edit");
  const site = await resolveSite(database(), url.searchParams.get("site"));
  if (!site && url.searchParams.get("site")) throw data("There is no site with that number.", { status: 404 });
  return { site: site ? { id: site.id, name: site.name } : null };
}

export async function action({ request }: Route.ActionArgs) {
  await requirePermission(request, "registry:edit");
  const read = await readForm(request);
  if ("error" in read)
    return data({ errors: { form: read.error }, values: {} as Record<string, string> }, { status: read.status });
  const db = database();
  const values = formValues(read.form, INSTRUMENT_FIELDS);
  const siteId = toId(read.form.get("siteId"));
  const site = siteId === null ? null : await getSite(db, siteId);
  if (!site)
    return data({ errors: { form: "the site was not found; it may have been deleted" }, values }, { status: 400 });
  const parsed = v.safeParse(InstrumentSchema, values);
  if (!parsed.success) return data({ errors: fieldErrors(parsed.issues), values }, { status: 400 });
  const taken = { errors: { name: `${parsed.output.name} is already an instrument at ${site.name}` }, values };
  if (await instrumentNameTaken(db, site.id, parsed.output.name)) return data(taken, { status: 400 });
  try {
    const instrument = await createInstrument(db, site.id, parsed.output);
    return redirectWithFlash(registryPaths.editInstrument(instrument.id), {
      kind: "success",
      text: `Instrument ${instrument.name} added. Now add its bands.`,
    });
  } catch (e) {
    if (pgCode(e) === "23505") return data(taken, { status: 400 });
    throw e;
  }
}

export const meta: Route.MetaFunction = () => [{ title: "New instrument — Array registry — Fringe Docket" }];

export default function NewInstrument({ loaderData, actionData }: Route.ComponentProps) {
  const { site } = loaderData;
  if (!site) {
    return (
      <>
        <PageHeader title="New instrument" />
        <EmptyState
          title="Add the site first"
          action={<ButtonLink to={registryPaths.newSite()}>Add a site</ButtonLink>}
        >
          Instruments belong to a site.
        </EmptyState>
      </>
    );
  }
  return (
    <>
      <PageHeader title="New instrument" lead={`A beam combiner at ${site.name}. Its bands come next.`} />
      <Card>
        <EditForm
          state={actionData}
          labels={INSTRUMENT_LABELS}
          submitLabel="Add instrument"
          cancelTo={registryPaths.overview(site.id)}
          ariaLabel="New instrument"
        >
          <input type="hidden" name="siteId" value={site.id} />
          <InstrumentFields state={actionData} defaults={{}} />
        </EditForm>
      </Card>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
