import { data, Form } from "react-router";
import * as v from "valibot";
import { ErrorPage } from "~/components/ErrorPage";
import { TargetForm } from "~/components/targets/TargetForm";
import { Button, Card, PageHeader } from "~/components/ui";
import { database } from "~/db/client.server";
import { redirectWithFlash } from "~/lib/flash.server";
import { requirePermission } from "~/lib/guards.server";
import { readTargetForm, targetFormValues, valuesOfTarget } from "~/services/targets/form.server";
import { bandNames, deleteTarget, getTarget, nameTaken, updateTarget } from "~/services/targets/targets.server";
import type { Route } from "./+types/edit";

const TargetId = v.pipe(v.string(), v.regex(/^\d{1,9}$/), v.transform(Number));

/** The viewer's own target, or 404 (someone else's target is not revealed). */
async function ownTarget(ownerId: number, raw: string | undefined) {
  const id = v.safeParse(TargetId, raw ?? "");
  const target = id.success ? await getTarget(database(), ownerId, id.output) : null;
  if (!target) throw data("No such target in your list.", { status: 404 });
  return target;
}

export async function loader({ request, params }: Route.LoaderArgs) {
  const viewer = await requirePermission(request, "proposals:own");
  const target = await ownTarget(viewer.user.id, params.targetId);
  return { name: target.name, values: valuesOfTarget(target), bands: await bandNames(database()) };
}

export async function action({ request, params }: Route.ActionArgs) {
  const viewer = await requirePermission(request, "proposals:own");
  const target = await ownTarget(viewer.user.id, params.targetId);
  const db = database();
  const form = await request.formData();
  if (form.get("intent") === "delete") {
    await deleteTarget(db, viewer.user.id, target.id);
    return redirectWithFlash("/targets", { kind: "success", text: `${target.name} removed from My targets.` });
  }
  const bands = await bandNames(db);
  const values = targetFormValues(form, bands);
  const read = readTargetForm(values, bands);
  if (read.target && (await nameTaken(db, viewer.user.id, read.target.name, target.id))) {
    read.errors.name = `Name: you already have a target called ${read.target.name}`;
  }
  if (!read.target || Object.keys(read.errors).length) return data({ values, errors: read.errors }, { status: 400 });
  await updateTarget(db, viewer.user.id, target.id, read.target);
  return redirectWithFlash("/targets", { kind: "success", text: `${read.target.name} saved.` });
}

export const meta: Route.MetaFunction = ({ data: d }) => [
  { title: `${d?.name ?? "Target"} — My targets — Fringe Docket` },
];

export default function EditTarget({ loaderData, actionData }: Route.ComponentProps) {
  return (
    <>
      <PageHeader title={loaderData.name} lead="Edit the target; proposals keep their own copy of it." />
      <div className="grid gap-6">
        <Card title="Target">
          <TargetForm
            values={actionData?.values ?? loaderData.values}
            errors={actionData?.errors ?? {}}
            bands={loaderData.bands}
            submitLabel="Save target"
            intent="update"
          />
        </Card>
        <Card title="Remove">
          <Form
            method="post"
            onSubmit={(e) => {
              if (!confirm(`Remove ${loaderData.name} from My targets?`)) e.preventDefault();
            }}
          >
            <input type="hidden" name="intent" value="delete" />
            <Button type="submit" variant="danger">
              Remove from My targets
            </Button>
          </Form>
        </Card>
      </div>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
