/**
 * The frozen version of a proposal as the committee reads it: facts, team, hours, science case,
 * targets (with Sketchpad links) and the feasibility report the proposer saw — the proposal pages'
 * own read-only pieces.
 */
import { FeasibilityView } from "~/components/proposals/FeasibilityView";
import { HoursFacts, ProposalFacts, TeamFacts } from "~/components/proposals/ProposalFacts";
import { Card } from "~/components/ui";
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
  targets: {
    name: string;
    raDeg: number;
    decDeg: number;
    /** Sexagesimal, as typed elsewhere in the app (degrees in the tooltip). */
    ra: string;
    dec: string;
    model: string;
    magnitudes: string;
    minElevationDeg: number | null;
    calibrators: string[];
    notes: string;
    sketchpad: { configuration: string; href: string }[];
  }[];
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
      <Card title={`Targets (${p.targets.length})`}>
        <ol className="grid gap-3 text-sm">
          {p.targets.map((t, i) => (
            <li key={t.name}>
              <span className="font-semibold">
                {i + 1}. {t.name}
              </span>{" "}
              <span className="num text-night-700">
                <span title={`RA ${t.raDeg.toFixed(4)}°, Dec ${t.decDeg.toFixed(4)}° (J2000)`}>
                  RA {t.ra}, Dec {t.dec}
                </span>{" "}
                · {t.model} · {t.magnitudes}
              </span>
              <span className="block text-night-600">
                {t.minElevationDeg === null ? "array elevation limit" : `elevation ≥ ${t.minElevationDeg}°`}
                {t.calibrators.length ? ` · calibrators ${t.calibrators.join(", ")}` : ""}
                {t.notes ? ` · ${t.notes}` : ""}
              </span>
              <span className="mt-1 flex flex-wrap gap-2">
                {t.sketchpad.map((s) => (
                  <a key={s.configuration} href={s.href} className="text-ember-800 underline">
                    Sketchpad: {t.name} with {s.configuration}
                  </a>
                ))}
              </span>
            </li>
          ))}
        </ol>
      </Card>
      <section aria-label="Feasibility report">
        <h2 className="mb-3 text-lg font-semibold">Feasibility report, as the proposer saw it at submission</h2>
        <FeasibilityView report={p.feasibility} />
      </section>
    </div>
  );
}
