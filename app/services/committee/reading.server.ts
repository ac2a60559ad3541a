/**
 * A proposal as the committee reads it: the frozen version the team submitted (text, team, hours,
 * targets, the feasibility report and the science case kept with it), with a Sketchpad link for each
 * target on each requested configuration so the same plots the proposer saw can be opened. Reuses the
 * proposal feature's frozen versions and science case (services/proposals).
 */
import { href } from "react-router";
import type { Database } from "~/db/client.server";
import { formatDeclination, formatRightAscension } from "~/lib/coordinates";
import { readScienceCase } from "~/services/proposals/science-case.server";
import { frozenTargetView } from "~/services/proposals/target-summary";
import { type ProposalSnapshot, readVersion } from "~/services/proposals/versions.server";
import { modelInputsOf } from "~/services/sketch/models";
import { writeSketchState } from "~/services/sketch/state";

export type { FeasibilityReport } from "~/services/proposals/feasibility";
export type { ProposalSnapshot };

type SnapshotTarget = ProposalSnapshot["targets"][number];

/** The middle night of a period (YYYY-MM-DD, UTC calendar arithmetic). */
export function middleNight(first: string, last: string): string {
  const a = Date.parse(`${first}T00:00:00Z`);
  const b = Date.parse(`${last}T00:00:00Z`);
  const days = Math.max(0, Math.round((b - a) / 86_400_000));
  return new Date(a + Math.floor(days / 2) * 86_400_000).toISOString().slice(0, 10);
}

/** The Sketchpad address of one target on one configuration, on the middle night of the cycle. */
export function sketchpadLink(
  t: SnapshotTarget,
  s: Pick<ProposalSnapshot, "cycle" | "instrument">,
  configuration: string,
): string {
  const { model, second } = modelInputsOf(t.model);
  const params = writeSketchState({
    name: t.name,
    ra: formatRightAscension(t.raDeg, 1),
    dec: formatDeclination(t.decDeg, 0),
    date: middleNight(s.cycle.observingStart, s.cycle.observingEnd),
    instrument: s.instrument?.name ?? "",
    band: s.instrument?.band ?? "",
    model,
    second,
    sampling: "night",
    stepMin: "10",
    haFrom: "-4",
    haTo: "4",
    haStep: "0.25",
    minElevation: t.minElevationDeg === null ? "" : String(t.minElevationDeg),
    delayLines: true,
    config: configuration,
    stations: [],
    weighting: "natural",
    uvUnit: "mlambda",
  });
  return `${href("/sketchpad")}?${params.toString()}`;
}

/** The frozen version the committee reads (the latest submitted), shaped for the page; null when missing. */
export async function frozenProposal(db: Database, { proposalId, version }: { proposalId: number; version: number }) {
  const row = await readVersion(db, { proposalId, version });
  if (!row) return null;
  const s = row.snapshot;
  return {
    version: row.version,
    submittedAt: row.submittedAt.toISOString(),
    hasDocument: row.hasDocument,
    title: s.title,
    abstract: s.abstract,
    scienceCategory: s.scienceCategory,
    cycle: s.cycle,
    pi: s.pi ? { name: s.pi.name, institute: s.pi.institute } : null,
    coInvestigators: s.coInvestigators.map((c) => ({ name: c.name ?? c.email, institute: c.institute })),
    band: s.instrument ? `${s.instrument.name} ${s.instrument.band}` : null,
    hours: s.hours,
    document: s.document,
    targets: s.targets.map((t) => ({
      ...frozenTargetView(t),
      links: s.hours.map((h) => ({
        label: `Sketchpad: ${t.name} with ${h.configuration}`,
        href: sketchpadLink(t, s, h.configuration),
      })),
    })),
    feasibility: s.feasibility,
  };
}

/** The science case frozen with the version the committee reads. */
export function frozenScienceCase(db: Database, { proposalId, version }: { proposalId: number; version: number }) {
  return readScienceCase(db, { proposalId, version });
}
