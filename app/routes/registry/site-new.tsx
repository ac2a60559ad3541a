import { data } from "react-router";
import * as v from "valibot";
import { ErrorPage } from "~/components/ErrorPage";
import { EditForm, SITE_FIELDS, SITE_LABELS, SiteFields } from "~/components/registry/forms";
import { registryPaths } from "~/components/registry/paths";
import { Card, PageHeader } from "~/components/ui";
import { database } from "~/db/client.server";
import { redirectWithFlash } from "~/lib/flash.server";
import { requirePermission } from "~/lib/guards.server";
import { createSite, formValues, pgCode, readForm, siteNameTaken } from "~/services/registry/admin.server";
import { fieldErrors, SiteSchema } from "~/services/registry/io";
import type { Route } from "./+types/site-new";

export async function loader({ request }: Route.LoaderArgs) {
  await requirePermission(request, "registry:edit");
  return { timeZones: Intl.supportedValuesOf("timeZone") };
}

export async function action({ request }: Route.ActionArgs) {
  await requirePermission(request, "registry:edit");
  const read = await readForm(request);
  if ("error" in read)
    return data({ errors: { form: read.error }, values: {} as Record<string, string> }, { status: read.status });
  const values = formValues(read.form, SITE_FIELDS);
  const parsed = v.safeParse(SiteSchema, values);
  if (!parsed.success) return data({ errors: fieldErrors(parsed.issues), values }, { status: 400 });
  const db = database();
  const taken = { errors: { name: `a site named ${parsed.output.name} already exists` }, values };
  if (await siteNameTaken(db, parsed.output.name)) return data(taken, { status: 400 });
  try {
    const site = await createSite(db, parsed.output);
    return redirectWithFlash(registryPaths.overview(site.id), {
      kind: "success",
      text: `Site ${site.name} added. Now add its stations.`,
    });
  } catch (e) {
    if (pgCode(e) === "23505") return data(taken, { status: 400 });
    throw e;
  }
}

export const meta: Route.MetaFunction = () => [{ title: "New site — Array registry — Fringe Docket" }];

export default function NewSite({ loaderData, actionData }: Route.ComponentProps) {
  return (
    <>
      <PageHeader
        title="New site"
        lead="The place the array stands: its position, the lowest elevation it observes at and its delay-line stroke."
      />
      <Card>
        <EditForm
          state={actionData}
          labels={SITE_LABELS}
          submitLabel="Add site"
          cancelTo="/registry"
          ariaLabel="New site"
        >
          <SiteFields
            state={actionData}
            defaults={{ minElevationDeg: "30", timeZone: "UTC" }}
            timeZones={loaderData.timeZones}
          />
        </EditForm>
      </Card>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
