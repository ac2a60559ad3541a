import { ErrorPage } from "~/components/ErrorPage";
import { dbContext } from "~/context";
import { requirePermission } from "~/lib/guards.server";
import { CycleEditor } from "./+shared/CycleForm";
import { cycleEditorPage, cycleOfParam, saveCycle } from "./+shared/editor.server";
import type { Route } from "./+types/edit";

export async function loader({ request, params, context }: Route.LoaderArgs) {
  await requirePermission(request, "cycles:manage");
  const db = context.get(dbContext);
  const cycle = await cycleOfParam(db, params.cycleId);
  return { name: cycle.name, ...(await cycleEditorPage(db, cycle)) };
}

export async function action({ request, params, context }: Route.ActionArgs) {
  const viewer = await requirePermission(request, "cycles:manage");
  const db = context.get(dbContext);
  const cycle = await cycleOfParam(db, params.cycleId);
  return saveCycle(request, db, { cycle, createdById: viewer.user.id });
}

export const meta: Route.MetaFunction = ({ data: d }) => [{ title: `Edit ${d?.name ?? "cycle"} — Fringe Docket` }];

export default function EditCycle({ loaderData, actionData }: Route.ComponentProps) {
  return (
    <CycleEditor
      title={`Edit cycle ${loaderData.name}`}
      submitLabel="Save cycle"
      page={loaderData}
      retry={actionData}
    />
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
