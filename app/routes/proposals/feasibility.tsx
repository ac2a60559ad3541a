import { Suspense } from "react";
import { Await, href, Link } from "react-router";
import { ErrorPage } from "~/components/ErrorPage";
import { Card, PageHeader } from "~/components/ui";
import { dbContext } from "~/context";
import { requirePermission } from "~/lib/guards.server";
import { loadProposalForViewer, proposalIdFrom } from "~/services/proposals/access.server";
import type { FeasibilityReport } from "~/services/proposals/feasibility";
import { computeProposalFeasibility, frozenFeasibility } from "~/services/proposals/feasibility.server";
import { STATUS_WORDS } from "~/services/proposals/words";
import { BackToProposal } from "./+shared/BackToProposal";
import { StatusBadge } from "./+shared/Badges";
import { FeasibilityView } from "./+shared/FeasibilityView";
import type { Route } from "./+types/feasibility";

export async function loader({ request, params, context }: Route.LoaderArgs) {
  const viewer = await requirePermission(request, "proposals:own");
  const proposalId = proposalIdFrom(params.proposalId);
  const db = context.get(dbContext);
  const { proposal, cycle } = await loadProposalForViewer(db, { viewer, proposalId });
  const frozen = proposal.status !== "draft" && proposal.currentVersion > 0;
  // A draft's report is computed now and streamed: the page shows "Computing…" until it arrives.
  const report: Promise<FeasibilityReport | null> = frozen
    ? frozenFeasibility(db, { proposalId, version: proposal.currentVersion })
    : new Promise((resolve, reject) =>
        setImmediate(() => computeProposalFeasibility(db, { proposalId }).then(resolve, reject)),
      );
  return {
    proposal: {
      id: proposalId,
      title: proposal.title,
      status: proposal.status,
      statusLabel: STATUS_WORDS[proposal.status],
      version: proposal.currentVersion,
    },
    cycle: { name: cycle.name, observingStart: cycle.observingStart, observingEnd: cycle.observingEnd },
    frozen,
    report,
  };
}

export const meta: Route.MetaFunction = ({ data }) => [
  { title: `Feasibility — ${data?.proposal.title || "Proposal"} — Fringe Docket` },
];

export default function Feasibility({ loaderData }: Route.ComponentProps) {
  const { proposal, cycle, frozen, report } = loaderData;
  const back = href("/proposals/:proposalId", { proposalId: String(proposal.id) });
  return (
    <>
      <PageHeader
        title="Feasibility report"
        lead={
          <>
            <Link to={back} className="font-medium text-ember-800 underline">
              {proposal.title || "(untitled proposal)"}
            </Link>{" "}
            <StatusBadge status={proposal.status} label={proposal.statusLabel} /> · cycle {cycle.name}, nights of{" "}
            {cycle.observingStart} to {cycle.observingEnd}
          </>
        }
        actions={<BackToProposal proposalId={proposal.id} />}
      />
      <p className="mb-4 text-sm text-night-700">
        {frozen
          ? `This is the report frozen with version ${proposal.version}, as the committee reads it.`
          : "Computed from the draft as it stands now, for every target with every configuration you request hours for. Change the draft and open this page again to see the effect."}
      </p>
      <Suspense
        fallback={
          <Card>
            <p role="status" className="flex items-center gap-3 text-night-700">
              <span
                aria-hidden="true"
                className="inline-block h-4 w-4 animate-spin rounded-full border-2 border-night-300 border-t-ember-700"
              />
              Computing the report: observable hours, resolution, visibilities and triangles for each target and
              configuration…
            </p>
          </Card>
        }
      >
        <Await
          resolve={report}
          errorElement={
            <p role="alert" className="text-danger-700">
              The report could not be computed. Please try again in a moment.
            </p>
          }
        >
          {(r) =>
            r ? <FeasibilityView report={r} /> : <p className="text-night-700">No report was kept with this version.</p>
          }
        </Await>
      </Suspense>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
