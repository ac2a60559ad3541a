import { href, Link } from "react-router";
import { ErrorPage } from "~/components/ErrorPage";
import { ButtonLink, Card, type Column, DataTable, EmptyState, PageHeader } from "~/components/ui";
import { dbContext } from "~/context";
import { requirePermission } from "~/lib/guards.server";
import { listMyProposals, listOpenCycles } from "~/services/proposals/queries.server";
import { deadlineCountdown, STATUS_WORDS } from "~/services/proposals/words";
import { StatusBadge } from "./+shared/Badges";
import { shownUtc } from "./+shared/utc";
import type { Route } from "./+types/list";

export async function loader({ request, context }: Route.LoaderArgs) {
  const viewer = await requirePermission(request, "proposals:own");
  const db = context.get(dbContext);
  const now = new Date();
  const [rows, open] = await Promise.all([listMyProposals(db, { viewer }), listOpenCycles(db, { now })]);
  return {
    proposals: rows.map((r) => ({
      id: r.id,
      title: r.title,
      status: r.status,
      statusLabel: STATUS_WORDS[r.status],
      role: r.role,
      piName: r.piName,
      cycleName: r.cycleName,
      deadline: r.deadline.toISOString(),
      countdown: r.status === "draft" ? deadlineCountdown(r.deadline, now) : null,
      hoursLeft: r.status === "draft" ? Math.max(0, (r.deadline.getTime() - now.getTime()) / 3_600_000) : null,
      submittedAt: r.submittedAt?.toISOString() ?? null,
      version: r.currentVersion,
      targets: r.targets,
      hours: r.hours,
      updatedAt: r.updatedAt.toISOString(),
    })),
    openCycles: open.map((c) => ({
      id: c.id,
      name: c.name,
      deadline: c.submissionDeadline.toISOString(),
      countdown: deadlineCountdown(c.submissionDeadline, now),
    })),
  };
}

export const meta: Route.MetaFunction = () => [{ title: "My proposals — Fringe Docket" }];

type Row = Route.ComponentProps["loaderData"]["proposals"][number];

const columns: Column<Row>[] = [
  { key: "cycle", header: "Cycle", value: (r) => r.cycleName },
  {
    key: "title",
    header: "Title",
    value: (r) => r.title || "(untitled)",
    render: (r) => (
      <Link
        to={href("/proposals/:proposalId", { proposalId: String(r.id) })}
        className="font-medium text-ember-800 underline-offset-2 hover:underline"
      >
        {r.title || "(untitled)"}
      </Link>
    ),
  },
  { key: "role", header: "Role", value: (r) => r.role },
  { key: "pi", header: "PI", value: (r) => r.piName },
  {
    key: "status",
    header: "Status",
    value: (r) => r.statusLabel,
    render: (r) => <StatusBadge status={r.status} label={r.statusLabel} />,
  },
  {
    // What the page shows is what the export carries: the deadline in UTC while the proposal can
    // still be submitted (the countdown beside it on the page), nothing otherwise.
    key: "deadline",
    header: "Deadline",
    unit: "UTC",
    value: (r) => (r.countdown ? shownUtc(r.deadline).replace(/ UTC$/, "") : null),
    render: (r) =>
      r.countdown ? (
        <span className={r.hoursLeft !== null && r.hoursLeft < 72 ? "font-semibold text-caution-700" : undefined}>
          {shownUtc(r.deadline)} <span className="whitespace-nowrap">({r.countdown})</span>
        </span>
      ) : (
        <span className="text-night-500">—</span>
      ),
  },
  { key: "targets", header: "Targets", align: "right", value: (r) => r.targets },
  { key: "hours", header: "Hours", unit: "h", align: "right", value: (r) => Math.round(r.hours * 10) / 10 },
  { key: "version", header: "Version", align: "right", value: (r) => (r.version > 0 ? r.version : null) },
  {
    key: "updated",
    header: "Last change",
    unit: "UTC",
    value: (r) => r.updatedAt.slice(0, 16).replace("T", " "),
  },
];

export default function MyProposals({ loaderData }: Route.ComponentProps) {
  const { proposals, openCycles } = loaderData;
  const canStart = openCycles.length > 0;
  return (
    <>
      <PageHeader
        title="My proposals"
        lead="The proposals you lead or work on as a co-investigator. Drafts can be changed until the cycle's deadline; a submitted proposal is frozen."
        actions={canStart ? <ButtonLink to={href("/proposals/new")}>New proposal</ButtonLink> : null}
      />
      {canStart ? (
        <p className="mb-4 text-sm text-night-700">
          Open for proposals:{" "}
          {openCycles.map((c, i) => (
            <span key={c.id}>
              {i > 0 ? ", " : ""}
              <span className="font-medium">{c.name}</span> (deadline {shownUtc(c.deadline)}, {c.countdown})
            </span>
          ))}
          .
        </p>
      ) : (
        <p className="mb-4 text-sm text-night-700">No cycle is open for proposals right now.</p>
      )}
      {proposals.length === 0 ? (
        <EmptyState
          title="No proposals yet"
          action={canStart ? <ButtonLink to={href("/proposals/new")}>Start a proposal</ButtonLink> : undefined}
        >
          A proposal you start, or one a PI adds you to, appears here.
        </EmptyState>
      ) : (
        <Card>
          <DataTable
            caption="My proposals with cycle, status and deadline"
            columns={columns}
            rows={proposals}
            exportName="my-proposals"
          />
        </Card>
      )}
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
