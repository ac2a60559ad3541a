/**
 * The frozen version of a proposal as the committee reads it: facts, team, hours, science case,
 * targets (with Sketchpad links) and the feasibility report the proposer saw — the proposal pages'
 * own read-only pieces.
 */
import { FeasibilityView } from "~/components/proposals/FeasibilityView";
import { type FrozenTarget, FrozenTargets } from "~/components/proposals/FrozenTargets";
import { HoursFacts, ProposalFacts, TeamFacts } from "~/components/proposals/ProposalFacts";
import type { FeasibilityReport } from "~/services/committee/reading.server";

export type FrozenProposalView = {
  abstract: string;
  scienceCategory: string;
  band: string | null;
  pi: { name: string; institute: string } | null;
  coInvestigators: { name: string; institute: string | null }[];
  hours: { configurationId: number; configuration: string; hours: number }[];
  document: { filename: string; sizeBytes: number; sha256: string } | null;
  hasDocument: boolean;
  targets: FrozenTarget[];
  feasibility: FeasibilityReport;
};

export function FrozenProposal({ p, scienceCaseHref }: { p: FrozenProposalView; scienceCaseHref: string }) {
  return (
    <div className="grid min-w-0 content-start gap-6">
      <ProposalFacts category={p.scienceCategory} band={p.band} abstract={p.abstract} />
      <div className="grid gap-6 md:grid-cols-2">
        <TeamFacts
          pi={p.pi ? { name: p.pi.name, detail: p.pi.institute } : null}
          coInvestigators={p.coInvestigators.map((c) => ({ name: c.name, detail: c.institute ?? "" }))}
        />
        <HoursFacts hours={p.hours}>
          <p className="mt-3 text-sm">
            {p.document && p.hasDocument ? (
              <a className="font-medium text-ember-800 underline" href={scienceCaseHref} download>
                Science case: {p.document.filename}
              </a>
            ) : (
              <span className="text-night-600">No science case kept with this version.</span>
            )}
          </p>
        </HoursFacts>
      </div>
      <FrozenTargets targets={p.targets} />
      <section aria-label="Feasibility report">
        <h2 className="mb-3 text-lg font-semibold">Feasibility report, as the proposer saw it at submission</h2>
        <FeasibilityView report={p.feasibility} />
      </section>
    </div>
  );
}
