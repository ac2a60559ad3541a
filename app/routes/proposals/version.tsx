import { data, Link } from "react-router";
import { ErrorPage } from "~/components/ErrorPage";
import { Badge, ButtonLink, Card, PageHeader } from "~/components/ui";
import { database } from "~/db/client.server";
import { requirePermission } from "~/lib/guards.server";
import { loadProposalForViewer, proposalIdFrom } from "~/services/proposals/access.server";
import { formatBytes, readVersion } from "~/services/proposals/proposals.server";
import { describeModel } from "~/components/targets/describe-model";
import type { Route } from "./+types/version";
import { describeMagnitudes, FeasibilityView, fmtUtc } from "./parts";

export async function loader({ request, params }: Route.LoaderArgs) {
  const viewer = await requirePermission(request, "proposals:own");
  const id = proposalIdFrom(params.proposalId);
  const db = database();
  await loadProposalForViewer(db, viewer, id);
  const raw = params.version ?? "";
  const row = /^\d{1,6}$/.test(raw) ? await readVersion(db, id, Number(raw)) : null;
  if (!row) throw data("This proposal has no version with that number.", { status: 404 });
  const s = row.snapshot;
  return {
    proposalId: id,
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
      targets: s.targets.map((t) => ({
        name: t.name,
        raDeg: t.raDeg,
        decDeg: t.decDeg,
        model: describeModel(t.model),
        magnitudes: describeMagnitudes(t.magnitudes),
        minElevationDeg: t.minElevationDeg,
        timeWindows: t.timeWindows,
        calibrators: t.calibrators.map((c) => c.name),
        notes: t.notes,
      })),
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
  return (
    <>
      <PageHeader
        title={s.title}
        lead={
          <>
            <Badge tone="info">Version {d.version}</Badge> submitted {fmtUtc(d.submittedAt)}
            {d.submittedBy ? ` by ${d.submittedBy}` : ""} to cycle {s.cycle.name}. Frozen: later changes never alter it.
          </>
        }
        actions={
          <ButtonLink to={`/proposals/${d.proposalId}`} variant="ghost">
            Back to the proposal
          </ButtonLink>
        }
      />
      <div className="grid gap-6 lg:grid-cols-2">
        <Card title="Proposal">
          <dl className="grid gap-3 text-sm">
            <div>
              <dt className="text-night-600">Science category</dt>
              <dd className="font-medium">{s.scienceCategory}</dd>
            </div>
            <div>
              <dt className="text-night-600">Instrument and band</dt>
              <dd className="font-medium">{s.instrument ? `${s.instrument.name} ${s.instrument.band}` : "—"}</dd>
            </div>
            <div>
              <dt className="text-night-600">Abstract</dt>
              <dd className="whitespace-pre-wrap">{s.abstract}</dd>
            </div>
          </dl>
        </Card>
        <div className="grid content-start gap-6">
          <Card title="Team">
            <ul className="grid gap-1 text-sm">
              {s.pi ? (
                <li>
                  <Badge tone="accent">PI</Badge> {s.pi.name} <span className="text-night-600">{s.pi.email}</span>
                </li>
              ) : null}
              {s.coInvestigators.map((c) => (
                <li key={c.email}>
                  <Badge>Co-I</Badge> {c.name ?? "(no account)"} <span className="text-night-600">{c.email}</span>
                </li>
              ))}
            </ul>
          </Card>
          <Card title="Requested hours">
            <ul className="num grid gap-1 text-sm">
              {s.hours.map((h) => (
                <li key={h.configurationId}>
                  {h.configuration}: {h.hours} h
                </li>
              ))}
            </ul>
          </Card>
          <Card title="Science case">
            {s.document && d.hasDocument ? (
              <p className="text-sm">
                <a
                  className="font-medium text-ember-800 underline"
                  href={`/proposals/${d.proposalId}/science-case?version=${d.version}`}
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
      <Card title={`Targets (${s.targets.length})`} className="mt-6">
        <ol className="grid gap-2 text-sm">
          {s.targets.map((t, i) => (
            <li key={t.name}>
              <span className="font-semibold">
                {i + 1}. {t.name}
              </span>{" "}
              <span className="num text-night-700">
                RA {t.raDeg.toFixed(4)}°, Dec {t.decDeg.toFixed(4)}° · {t.model} · {t.magnitudes}
              </span>
              <span className="block text-night-600">
                {t.minElevationDeg === null ? "array elevation limit" : `elevation ≥ ${t.minElevationDeg}°`}
                {t.timeWindows.length
                  ? ` · windows ${t.timeWindows.map((w) => `${fmtUtc(w.startUtc)} – ${fmtUtc(w.endUtc)}`).join("; ")}`
                  : ""}
                {t.calibrators.length ? ` · calibrators ${t.calibrators.join(", ")}` : ""}
                {t.notes ? ` · ${t.notes}` : ""}
              </span>
            </li>
          ))}
        </ol>
      </Card>
      <section className="mt-6">
        <h2 className="mb-3 text-lg font-semibold">Feasibility report of this version</h2>
        <FeasibilityView report={s.feasibility} />
      </section>
      <p className="mt-6 text-sm">
        <Link to={`/proposals/${d.proposalId}/feasibility`} className="text-ember-800 underline">
          Open the latest report
        </Link>
      </p>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
