import { href, Link } from "react-router";
import { ErrorPage } from "~/components/ErrorPage";
import { FrozenTargets } from "~/components/proposals/FrozenTargets";
import { HoursFacts, ProposalFacts, TeamFacts } from "~/components/proposals/ProposalFacts";
import { Badge, Card, PageHeader } from "~/components/ui";
import { dbContext } from "~/context";
import { formatBytes } from "~/lib/format";
import { requirePermission } from "~/lib/guards.server";
import { invariantResponse, toId } from "~/lib/not-found";
import { loadProposalForViewer, proposalIdFrom } from "~/services/proposals/access.server";
import { frozenTargetView } from "~/services/proposals/target-summary";
import { readVersion } from "~/services/proposals/versions.server";
import { acknowledgementText } from "~/services/proposals/warnings";
import { BackToProposal } from "./+shared/BackToProposal";
import { FeasibilityView } from "./+shared/FeasibilityView";
import { shownUtc } from "./+shared/utc";
import type { Route } from "./+types/version";

export async function loader({ request, params, context }: Route.LoaderArgs) {
  const viewer = await requirePermission(request, "proposals:own");
  const proposalId = proposalIdFrom(params.proposalId);
  const db = context.get(dbContext);
  await loadProposalForViewer(db, { viewer, proposalId });
  const version = toId(params.version);
  const row = version === null ? null : await readVersion(db, { proposalId, version });
  invariantResponse(row, "This proposal has no version with that number.");
  const s = row.snapshot;
  return {
    proposalId,
    version: row.version,
    submittedAt: row.submittedAt.toISOString(),
    submittedBy: row.submittedBy,
    hasDocument: row.hasDocument,
    snapshot: {
      title: s.title,
      abstract: s.abstract,
      scienceCategory: s.scienceCategory,
      cycle: s.cycle,
      pi: s.pi,
      coInvestigators: s.coInvestigators,
      instrument: s.instrument,
      hours: s.hours,
      targets: s.targets.map(frozenTargetView),
      acknowledgement: s.acknowledgement ? acknowledgementText(s.acknowledgement) : null,
      document: s.document ? { ...s.document, size: formatBytes(s.document.sizeBytes) } : null,
      feasibility: s.feasibility,
    },
  };
}

export const meta: Route.MetaFunction = ({ data: d }) => [
  { title: `Version ${d?.version ?? ""} — ${d?.snapshot.title ?? "Proposal"} — Fringe Docket` },
];

export default function ProposalVersion({ loaderData }: Route.ComponentProps) {
  const d = loaderData;
  const s = d.snapshot;
  const proposalId = String(d.proposalId);
  return (
    <>
      <PageHeader
        title={s.title}
        lead={
          <>
            <Badge tone="info">Version {d.version}</Badge> submitted {shownUtc(d.submittedAt)}
            {d.submittedBy ? ` by ${d.submittedBy}` : ""} to cycle {s.cycle.name}. Frozen: later changes never alter it.
            {s.acknowledgement ? (
              <span className="mt-1 block text-sm text-caution-700">{s.acknowledgement}</span>
            ) : null}
          </>
        }
        actions={<BackToProposal proposalId={d.proposalId} />}
      />
      <div className="grid gap-6 lg:grid-cols-2">
        <ProposalFacts
          category={s.scienceCategory}
          band={s.instrument ? `${s.instrument.name} ${s.instrument.band}` : null}
          abstract={s.abstract}
        />
        <div className="grid content-start gap-6">
          <TeamFacts
            pi={s.pi ? { name: s.pi.name, detail: s.pi.email } : null}
            coInvestigators={s.coInvestigators.map((c) => ({ name: c.name ?? "(no account)", detail: c.email }))}
          />
          <HoursFacts hours={s.hours} />
          <Card title="Science case">
            {s.document && d.hasDocument ? (
              <p className="text-sm">
                <a
                  className="font-medium text-ember-800 underline"
                  href={`${href("/proposals/:proposalId/science-case", { proposalId })}?version=${d.version}`}
                  download
                >
                  {s.document.filename}
                </a>{" "}
                · {s.document.size}
                <span className="num mt-1 block break-all text-xs text-night-500">SHA-256 {s.document.sha256}</span>
              </p>
            ) : (
              <p className="text-sm text-night-600">None kept with this version.</p>
            )}
          </Card>
        </div>
      </div>
      <FrozenTargets targets={s.targets} className="mt-6" />
      <section className="mt-6">
        <h2 className="mb-3 text-lg font-semibold">Feasibility report of this version</h2>
        <FeasibilityView report={s.feasibility} />
      </section>
      <p className="mt-6 text-sm">
        <Link to={href("/proposals/:proposalId/feasibility", { proposalId })} className="text-ember-800 underline">
          Open the latest report
        </Link>
      </p>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
