import { href } from "react-router";
import { ErrorPage } from "~/components/ErrorPage";
import { describeModel } from "~/components/targets/describe-model";
import { Alert, ButtonLink, Card, type Column, DataTable, EmptyState } from "~/components/ui";
import { dbContext } from "~/context";
import { requireFormBody } from "~/lib/body.server";
import { requirePermission } from "~/lib/guards.server";
import { targetSketchpadHref } from "~/services/sketch/state";
import { draftsToAddTo } from "~/services/targets/proposals.server";
import { bandNames, listTargets } from "~/services/targets/targets.server";
import { coordinateColumns, coordinateText, TargetLink } from "./+shared/columns";
import { saveTarget } from "./+shared/editor.server";
import { RowActions } from "./+shared/RowActions";
import { addRowToProposal, removeRow } from "./+shared/row-actions.server";
import { TargetEditor } from "./+shared/TargetEditor";
import { TargetsPage } from "./+shared/TargetsPage";
import type { Route } from "./+types/index";

export async function loader({ request, context }: Route.LoaderArgs) {
  const viewer = await requirePermission(request, "proposals:own");
  const db = context.get(dbContext);
  const [list, bands, drafts] = await Promise.all([
    listTargets(db, viewer.user.id),
    bandNames(db),
    draftsToAddTo(db, { viewer, now: new Date() }),
  ]);
  return {
    bands,
    drafts,
    targets: list.map((t) => ({
      id: t.id,
      name: t.name,
      raDeg: t.raDeg,
      decDeg: t.decDeg,
      ...coordinateText(t),
      model: describeModel(t.model),
      magnitudes: t.magnitudes,
      sketchpadHref: targetSketchpadHref(t),
    })),
  };
}

/** The "Add a target" card's post, and the rows' "Add to a proposal" and "Remove". */
export async function action({ request, context }: Route.ActionArgs) {
  const viewer = await requirePermission(request, "proposals:own");
  const form = await requireFormBody(request);
  const db = context.get(dbContext);
  switch (form.get("intent")) {
    case "add-to-proposal":
      return addRowToProposal(db, viewer, form);
    case "remove":
      return removeRow(db, viewer, form);
    default:
      return saveTarget(db, form, { ownerId: viewer.user.id, target: null });
  }
}

/** The page's title and lead, for the header and the browser tab. */
const PAGE = {
  title: "My targets",
  lead: "Your target list, with models and magnitudes, ready for the Sketchpad and for proposals.",
};

export const meta: Route.MetaFunction = () => [{ title: `${PAGE.title} — Fringe Docket` }];

type Row = Route.ComponentProps["loaderData"]["targets"][number];

/** Import and export, beside the page title. */
function ListActions() {
  return (
    <>
      <ButtonLink to={href("/targets/import")} variant="secondary">
        Import CSV
      </ButtonLink>
      <a
        href={href("/targets/export.csv")}
        className="inline-flex h-10 items-center rounded-lg px-4 font-medium text-night-800 ring-1 ring-inset ring-night-300 hover:bg-night-100"
        download
      >
        Download all as CSV
      </a>
    </>
  );
}

export default function Targets({ loaderData, actionData }: Route.ComponentProps) {
  const columns: Column<Row>[] = [
    { key: "name", header: "Name", value: (t) => t.name, render: (t) => <TargetLink id={t.id} name={t.name} /> },
    ...coordinateColumns<Row>({ epoch: "J2000", of: (t) => ({ ra: t.raDeg, dec: t.decDeg }) }),
    { key: "model", header: "Model", value: (t) => t.model },
    ...loaderData.bands.map<Column<Row>>((b) => ({
      key: `mag_${b}`,
      header: b,
      unit: "mag",
      align: "right",
      value: (t) => t.magnitudes[b] ?? null,
    })),
    {
      key: "actions",
      header: "Actions",
      controls: true,
      value: () => "",
      render: (t) => <RowActions target={t} sketchpadHref={t.sketchpadHref} drafts={loaderData.drafts} />,
    },
  ];
  const refusal = actionData && "rowError" in actionData ? actionData.rowError : null;
  return (
    <TargetsPage {...PAGE} actions={<ListActions />}>
      <Card title="Targets">
        {refusal ? <Alert className="mb-4">{refusal}</Alert> : null}
        {loaderData.targets.length === 0 ? (
          <EmptyState title="No targets yet">Add one below or import a CSV list.</EmptyState>
        ) : (
          <>
            <DataTable caption="My targets" columns={columns} rows={loaderData.targets} rowKey={(t) => t.id} />
            {loaderData.drafts.length === 0 ? (
              <p className="mt-3 text-sm text-night-600">
                “Add to a proposal” needs a draft of yours whose cycle's deadline is still ahead; start one under
                Proposals.
              </p>
            ) : null}
          </>
        )}
      </Card>
      <TargetEditor
        intent="create"
        values={{}}
        bands={loaderData.bands}
        retry={actionData && "values" in actionData ? actionData : undefined}
        generation={loaderData.targets.length}
      />
    </TargetsPage>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
