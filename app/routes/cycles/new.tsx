import { data } from "react-router";
import { CycleForm } from "~/components/cycles/CycleForm";
import { ErrorPage } from "~/components/ErrorPage";
import { PageHeader } from "~/components/ui";
import { database } from "~/db/client.server";
import { redirectWithFlash } from "~/lib/flash.server";
import { requirePermission } from "~/lib/guards.server";
import { configurationChoices } from "~/services/cycles/configurations.server";
import { createCycle, findCycleByName } from "~/services/cycles/cycles.server";
import { type CycleFormValues, cycleFormValues, parseCycleForm } from "~/services/cycles/form";
import type { Route } from "./+types/new";

export async function loader({ request }: Route.LoaderArgs) {
  await requirePermission(request, "cycles:manage");
  const configurations = await configurationChoices(database());
  const blank: CycleFormValues = {
    name: "",
    description: "",
    observingStart: "",
    observingEnd: "",
    submissionDeadline: "",
    offered: configurations.map((c) => String(c.id)),
    nights: {},
  };
  return { configurations, values: blank };
}

export async function action({ request }: Route.ActionArgs) {
  const viewer = await requirePermission(request, "cycles:manage");
  const db = database();
  const configurations = await configurationChoices(db);
  const ids = configurations.map((c) => c.id);
  const values = cycleFormValues(await request.formData(), ids);
  const parsed = parseCycleForm(values, ids);
  if (!parsed.ok) return data({ values, errors: parsed.errors }, { status: 400 });
  if (await findCycleByName(db, parsed.value.name)) {
    return data(
      { values, errors: { name: `Name: a cycle called ${parsed.value.name} exists already` } },
      { status: 400 },
    );
  }
  const cycle = await createCycle(db, parsed.value, viewer.user.id);
  return redirectWithFlash("/cycles", { kind: "success", text: `Cycle ${cycle.name} created.` });
}

export const meta: Route.MetaFunction = () => [{ title: "New cycle — Fringe Docket" }];

export default function NewCycle({ loaderData, actionData }: Route.ComponentProps) {
  return (
    <>
      <PageHeader title="New cycle" lead="Dates are nights at the site; the deadline is in UTC." />
      <CycleForm
        values={actionData?.values ?? loaderData.values}
        errors={actionData?.errors ?? {}}
        configurations={loaderData.configurations}
        submitLabel="Create cycle"
      />
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
