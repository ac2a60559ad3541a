import { data, Link } from "react-router";
import { ErrorPage } from "~/components/ErrorPage";
import { TargetForm } from "~/components/targets/TargetForm";
import { ButtonLink, Card, type Column, DataTable, EmptyState, PageHeader } from "~/components/ui";
import { database } from "~/db/client.server";
import { formatDeclination, formatRightAscension } from "~/lib/coordinates";
import { redirectWithFlash } from "~/lib/flash.server";
import { requirePermission } from "~/lib/guards.server";
import { describeModel } from "~/components/targets/describe-model";
import { readTargetForm, targetFormValues } from "~/services/targets/form.server";
import { bandNames, createTarget, listTargets, nameTaken } from "~/services/targets/targets.server";
import type { Route } from "./+types/index";

export async function loader({ request }: Route.LoaderArgs) {
  const viewer = await requirePermission(request, "proposals:own");
  const db = database();
  const [list, bands] = await Promise.all([listTargets(db, viewer.user.id), bandNames(db)]);
  return {
    bands,
    targets: list.map((t) => ({
      id: t.id,
      name: t.name,
      raDeg: t.raDeg,
      decDeg: t.decDeg,
      ra: formatRightAscension(t.raDeg, 2),
      dec: formatDeclination(t.decDeg, 1),
      model: describeModel(t.model),
      magnitudes: t.magnitudes,
    })),
  };
}

export async function action({ request }: Route.ActionArgs) {
  const viewer = await requirePermission(request, "proposals:own");
  const db = database();
  const bands = await bandNames(db);
  const values = targetFormValues(await request.formData(), bands);
  const { target, errors } = readTargetForm(values, bands);
  if (target && (await nameTaken(db, viewer.user.id, target.name)))
    errors.name = `Name: you already have a target called ${target.name}`;
  if (!target || Object.keys(errors).length) return data({ values, errors }, { status: 400 });
  await createTarget(db, viewer.user.id, target);
  return redirectWithFlash("/targets", { kind: "success", text: `${target.name} added to My targets.` });
}

export const meta: Route.MetaFunction = () => [{ title: "My targets — Fringe Docket" }];

type Row = Route.ComponentProps["loaderData"]["targets"][number];

export default function Targets({ loaderData, actionData }: Route.ComponentProps) {
  const columns: Column<Row>[] = [
    {
      key: "name",
      header: "Name",
      value: (t) => t.name,
      render: (t) => (
        <Link className="font-medium text-ember-700 underline-offset-2 hover:underline" to={`/targets/${t.id}`}>
          {t.name}
        </Link>
      ),
    },
    {
      key: "ra",
      header: "RA (J2000)",
      unit: "h:m:s",
      value: (t) => t.raDeg,
      render: (t) => <span className="num">{t.ra}</span>,
    },
    {
      key: "dec",
      header: "Dec (J2000)",
      unit: "°:′:″",
      value: (t) => t.decDeg,
      render: (t) => <span className="num">{t.dec}</span>,
    },
    { key: "model", header: "Model", value: (t) => t.model },
    ...loaderData.bands.map<Column<Row>>((b) => ({
      key: `mag_${b}`,
      header: b,
      unit: "mag",
      align: "right",
      value: (t) => t.magnitudes[b] ?? null,
    })),
  ];
  return (
    <>
      <PageHeader
        title="My targets"
        lead="Your target list, with models and magnitudes, ready for the Sketchpad and for proposals."
        actions={
          <>
            <ButtonLink to="/targets/import" variant="secondary">
              Import CSV
            </ButtonLink>
            <a
              href="/targets/export.csv"
              className="inline-flex h-10 items-center rounded-lg px-4 font-medium text-night-800 ring-1 ring-inset ring-night-300 hover:bg-night-100"
              download
            >
              Download all as CSV
            </a>
          </>
        }
      />
      <div className="grid gap-6">
        <Card title="Targets">
          {loaderData.targets.length === 0 ? (
            <EmptyState title="No targets yet">Add one below or import a CSV list.</EmptyState>
          ) : (
            <DataTable caption="My targets" columns={columns} rows={loaderData.targets} rowKey={(t) => t.id} />
          )}
        </Card>
        <Card title="Add a target">
          <TargetForm
            key={actionData ? "retry" : "blank"}
            values={actionData?.values ?? {}}
            errors={actionData?.errors ?? {}}
            bands={loaderData.bands}
            submitLabel="Add target"
            intent="create"
          />
        </Card>
      </div>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
