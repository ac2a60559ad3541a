import { data } from "react-router";
import * as v from "valibot";
import { CycleForm } from "~/components/cycles/CycleForm";
import { ErrorPage } from "~/components/ErrorPage";
import { PageHeader } from "~/components/ui";
import { database } from "~/db/client.server";
import { redirectWithFlash } from "~/lib/flash.server";
import { requirePermission } from "~/lib/guards.server";
import { configurationChoices } from "~/services/cycles/configurations.server";
import { findCycleByName, getCycle, updateCycle } from "~/services/cycles/cycles.server";
import { cycleFormValues, parseCycleForm, toUtcInput } from "~/services/cycles/form";
import type { Route } from "./+types/edit";

const CycleId = v.pipe(v.string(), v.regex(/^\d{1,9}$/), v.transform(Number));

async function loadCycle(params: { cycleId?: string }) {
  const id = v.safeParse(CycleId, params.cycleId ?? "");
  const cycle = id.success ? await getCycle(database(), id.output) : null;
  if (!cycle) throw data("No cycle with this number.", { status: 404 });
  return cycle;
}

export async function loader({ request, params }: Route.LoaderArgs) {
  await requirePermission(request, "cycles:manage");
  const cycle = await loadCycle(params);
  const configurations = await configurationChoices(database());
  const nights: Record<string, string> = {};
  for (const o of cycle.offers) nights[o.configurationId] = o.nightsAvailable == null ? "" : String(o.nightsAvailable);
  return {
    name: cycle.name,
    configurations,
    values: {
      name: cycle.name,
      description: cycle.description,
      observingStart: cycle.observingStart,
      observingEnd: cycle.observingEnd,
      submissionDeadline: toUtcInput(cycle.submissionDeadline),
      offered: cycle.offers.map((o) => String(o.configurationId)),
      nights,
    },
  };
}

export async function action({ request, params }: Route.ActionArgs) {
  await requirePermission(request, "cycles:manage");
  const cycle = await loadCycle(params);
  const db = database();
  const ids = (await configurationChoices(db)).map((c) => c.id);
  const values = cycleFormValues(await request.formData(), ids);
  const parsed = parseCycleForm(values, ids);
  if (!parsed.ok) return data({ values, errors: parsed.errors }, { status: 400 });
  const clash = await findCycleByName(db, parsed.value.name);
  if (clash && clash.id !== cycle.id) {
    return data(
      { values, errors: { name: `Name: a cycle called ${parsed.value.name} exists already` } },
      { status: 400 },
    );
  }
  const result = await updateCycle(db, cycle.id, parsed.value);
  if (!result.ok) {
    return data(
      {
        values,
        errors: {
          offered: `Configurations: proposals already request ${result.blocked.join(", ")}; keep them on offer`,
        },
      },
      { status: 400 },
    );
  }
  return redirectWithFlash("/cycles", { kind: "success", text: `Cycle ${parsed.value.name} saved.` });
}

export const meta: Route.MetaFunction = ({ data: d }) => [{ title: `Edit ${d?.name ?? "cycle"} — Fringe Docket` }];

export default function EditCycle({ loaderData, actionData }: Route.ComponentProps) {
  return (
    <>
      <PageHeader
        title={`Edit cycle ${loaderData.name}`}
        lead="Dates are nights at the site; the deadline is in UTC."
      />
      <CycleForm
        values={actionData?.values ?? loaderData.values}
        errors={actionData?.errors ?? {}}
        configurations={loaderData.configurations}
        submitLabel="Save cycle"
      />
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
