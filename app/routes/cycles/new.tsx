import { ErrorPage } from "~/components/ErrorPage";
import { dbContext } from "~/context";
import { requirePermission } from "~/lib/guards.server";
import { CycleEditor } from "./+shared/CycleForm";
import { cycleEditorPage, saveCycle } from "./+shared/editor.server";
import type { Route } from "./+types/new";

export async function loader({ request, context }: Route.LoaderArgs) {
  await requirePermission(request, "cycles:manage");
  return cycleEditorPage(context.get(dbContext), null);
}

export async function action({ request, context }: Route.ActionArgs) {
  const viewer = await requirePermission(request, "cycles:manage");
  return saveCycle(request, context.get(dbContext), { cycle: null, createdById: viewer.user.id });
}

export const meta: Route.MetaFunction = () => [{ title: "New cycle — Fringe Docket" }];

export default function NewCycle({ loaderData, actionData }: Route.ComponentProps) {
  return <CycleEditor title="New cycle" submitLabel="Create cycle" page={loaderData} retry={actionData} />;
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
