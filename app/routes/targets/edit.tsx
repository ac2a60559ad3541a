import { ErrorPage } from "~/components/ErrorPage";
import { dbContext } from "~/context";
import { requireFormBody } from "~/lib/body.server";
import { requirePermission } from "~/lib/guards.server";
import { valuesOfTarget } from "~/services/targets/form.server";
import { bandNames } from "~/services/targets/targets.server";
import { ownTarget, removeTarget, saveTarget } from "./+shared/editor.server";
import { RemoveTargetCard, TargetEditor } from "./+shared/TargetEditor";
import { TargetsPage } from "./+shared/TargetsPage";
import type { Route } from "./+types/edit";

export async function loader({ request, params, context }: Route.LoaderArgs) {
  const viewer = await requirePermission(request, "proposals:own");
  const db = context.get(dbContext);
  const target = await ownTarget(db, viewer.user.id, params.targetId);
  return { name: target.name, values: valuesOfTarget(target), bands: await bandNames(db) };
}

export async function action({ request, params, context }: Route.ActionArgs) {
  const viewer = await requirePermission(request, "proposals:own");
  const db = context.get(dbContext);
  const target = await ownTarget(db, viewer.user.id, params.targetId);
  const form = await requireFormBody(request);
  switch (form.get("intent")) {
    case "delete":
      return removeTarget(db, viewer.user.id, target, form);
    default:
      return saveTarget(db, form, { ownerId: viewer.user.id, target });
  }
}

export const meta: Route.MetaFunction = ({ data: d }) => [
  { title: `${d?.name ?? "Target"} — My targets — Fringe Docket` },
];

export default function EditTarget({ loaderData, actionData }: Route.ComponentProps) {
  return (
    <TargetsPage title={loaderData.name} lead="Edit the target; proposals keep their own copy of it." back>
      <TargetEditor
        intent="update"
        values={loaderData.values}
        bands={loaderData.bands}
        retry={actionData && "values" in actionData ? actionData : undefined}
      />
      <RemoveTargetCard
        name={loaderData.name}
        refused={actionData && "removeError" in actionData ? actionData.removeError : null}
      />
    </TargetsPage>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
