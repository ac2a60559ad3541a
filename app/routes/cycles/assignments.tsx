import { data, href } from "react-router";
import * as v from "valibot";
import { StateBadge } from "~/components/committee/StateBadge";
import { ErrorPage } from "~/components/ErrorPage";
import { Alert, Card, type Column, DataTable, namedColumn, PageHeader } from "~/components/ui";
import { ConfirmDialog } from "~/components/ui/ConfirmDialog";
import { dbContext } from "~/context";
import { requireFormBody } from "~/lib/body.server";
import { redirectWithFlash } from "~/lib/flash.server";
import { plural } from "~/lib/format";
import { requirePermission } from "~/lib/guards.server";
import { rowOfParam, toId } from "~/lib/not-found";
import {
  assignmentOverview,
  DEFAULT_REVIEWERS_PER_PROPOSAL,
  type Pair,
  previewAutoAssign,
  removeAssignment,
  saveAssignments,
  sendReminders,
  WholeNumber,
} from "~/services/cycles/assignments.server";
import { AutoAssignCard } from "./+shared/AutoAssignCard";
import { ProposalAssignments } from "./+shared/ProposalAssignments";
import type { Route } from "./+types/assignments";

const PerProposal = WholeNumber("Reviewers per proposal", 1, 10);
/** "proposal:reviewer" pairs of a previewed run, as the preview posts them back. */
const PairList = v.pipe(
  v.array(v.pipe(v.string(), v.regex(/^\d{1,10}:\d{1,10}$/, "Assignments: unreadable pair"))),
  v.minLength(1, "Assignments: nothing to save"),
  v.maxLength(20_000, "Assignments: too many"),
  v.transform((list) =>
    list.map((s): Pair => ({ proposalId: Number(s.split(":")[0]), reviewerId: Number(s.split(":")[1]) })),
  ),
);

function cycleOf(db: Parameters<typeof assignmentOverview>[0], raw: string | undefined) {
  return rowOfParam(raw, (cycleId) => assignmentOverview(db, { cycleId }), "No cycle with this number.");
}

export async function loader({ request, params, context }: Route.LoaderArgs) {
  await requirePermission(request, "cycles:manage");
  const page = await cycleOf(context.get(dbContext), params.cycleId);
  return {
    cycle: { id: page.cycle.id, name: page.cycle.name, state: page.cycle.state },
    members: page.members,
    proposals: page.proposals,
    perProposal: DEFAULT_REVIEWERS_PER_PROPOSAL,
  };
}

export async function action({ request, params, context }: Route.ActionArgs) {
  const viewer = await requirePermission(request, "cycles:manage");
  const db = context.get(dbContext);
  const { cycle } = await cycleOf(db, params.cycleId);
  const form = await requireFormBody(request, { maxBytes: 512_000 });
  const intent = String(form.get("intent") ?? "");
  const here = href("/cycles/:cycleId/assignments", { cycleId: String(cycle.id) });
  const refuse = (error: string, status = 400) => data({ intent, error, preview: null }, { status });
  switch (intent) {
    case "preview": {
      const n = v.safeParse(PerProposal, String(form.get("perProposal") ?? ""));
      if (!n.success) return refuse(n.issues[0].message);
      const preview = await previewAutoAssign(db, { cycleId: cycle.id, perProposal: n.output });
      return { intent, error: null, preview };
    }
    case "save-auto":
    case "assign": {
      const raw = intent === "assign" ? [`${form.get("proposalId")}:${form.get("reviewerId")}`] : form.getAll("pair");
      const pairs = v.safeParse(PairList, raw);
      if (!pairs.success)
        return refuse(intent === "assign" ? "Reviewer: choose someone to assign" : pairs.issues[0].message);
      const result = await saveAssignments(db, {
        cycleId: cycle.id,
        pairs: pairs.output,
        actorId: viewer.user.id,
        mode: intent === "assign" ? "by hand" : "auto",
      });
      if (!result.ok) return refuse(result.message, 409);
      return redirectWithFlash(here, {
        kind: "success",
        text: `${result.added} assignment${result.added === 1 ? "" : "s"} saved; ${result.notified} reviewer${result.notified === 1 ? "" : "s"} notified.`,
      });
    }
    case "remove": {
      const id = toId(String(form.get("assignmentId") ?? ""));
      if (id === null) return refuse("Assignment: unknown");
      const result = await removeAssignment(db, { cycleId: cycle.id, assignmentId: id, actorId: viewer.user.id });
      if (!result.ok) return refuse(result.message, 409);
      return redirectWithFlash(here, { kind: "success", text: "Assignment taken back." });
    }
    case "remind": {
      if (form.get("confirm") !== "yes") return refuse("Confirm the reminders in the dialog.");
      const result = await sendReminders(db, { cycleId: cycle.id, actorId: viewer.user.id });
      if (!result.ok) return refuse(result.message, 409);
      return redirectWithFlash(here, {
        kind: "success",
        text: `Reminders sent to ${result.sent} reviewer${result.sent === 1 ? "" : "s"}.`,
      });
    }
    default:
      return refuse("Unknown action.");
  }
}

const loadColumns: Column<Route.ComponentProps["loaderData"]["members"][number]>[] = [
  namedColumn({ key: "reviewer", header: "Reviewer", name: (m) => m.name, note: (m) => m.institute }),
  { key: "assigned", header: "Assigned", align: "right", value: (m) => m.total },
  { key: "submitted", header: "Submitted", align: "right", value: (m) => m.submitted },
];

export const meta: Route.MetaFunction = ({ data: d }) => [
  { title: `Assignments — ${d?.cycle.name ?? "Cycle"} — Fringe Docket` },
];

export default function Assignments({ loaderData: d, actionData }: Route.ComponentProps) {
  const reviewing = d.cycle.state === "reviewing";
  const pending = d.members.reduce((n, m) => n + (m.total - m.submitted), 0);
  return (
    <>
      <PageHeader
        title={`Assignments — ${d.cycle.name}`}
        lead={
          <>
            <StateBadge state={d.cycle.state} /> {plural(d.proposals.length, "proposal")},{" "}
            {plural(d.members.length, "reviewer")} on the committee. Conflicted reviewers are never offered.
          </>
        }
        back={{ to: href("/cycles/:cycleId", { cycleId: String(d.cycle.id) }), label: "Back to the cycle" }}
      />
      {actionData?.error ? <Alert className="mb-4">{actionData.error}</Alert> : null}
      {!reviewing ? (
        <Alert tone="info" className="mb-4">
          Reviewers are assigned while the cycle is with the reviewers: start the review on the cycle's page first.
        </Alert>
      ) : null}
      <div className="grid grid-cols-[minmax(0,1fr)] gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <AutoAssignCard
          perProposal={d.perProposal}
          preview={actionData?.intent === "preview" ? (actionData.preview ?? null) : null}
          disabled={!reviewing}
        />
        <Card title="Load per reviewer">
          <DataTable
            columns={loadColumns}
            rows={d.members}
            caption="Assignments and submitted reviews per reviewer"
            exportName={`reviewer-load-${d.cycle.name}`}
            density="compact"
          />
          <div className="mt-4">
            <ConfirmDialog
              label="Send reminders"
              title="Send reminders?"
              intent="remind"
              confirmLabel="Yes, send them"
              variant="secondary"
              disabled={!reviewing || pending === 0}
              closeOn={actionData}
            >
              Every reviewer with a review not yet submitted ({pending} in all) gets one e-mail listing them, with the
              review deadline.
            </ConfirmDialog>
          </div>
        </Card>
      </div>
      <ProposalAssignments proposals={d.proposals} editable={reviewing} />
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
