/**
 * Frozen versions: at submission the proposal as it stands (text, team, hours, targets with their
 * constraints, the feasibility report) is written as a JSON snapshot beside a copy of the PDF and its
 * SHA-256. Versions are never changed afterwards.
 */
import { and, eq, sql } from "drizzle-orm";
import type { Database, DbOrTx, Transaction } from "~/db/client.server";
import { bands, instruments } from "~/db/schema/array";
import {
  type ClosureTriangleJson,
  type cycles,
  proposalDocuments,
  proposals,
  proposalVersions,
} from "~/db/schema/proposals";
import { users } from "~/db/schema/users";
import { teamMembers } from "./access.server";
import type { FeasibilityReport } from "./feasibility";
import { computeProposalFeasibility } from "./feasibility.server";
import { proposalTargetRows, requestedHours } from "./queries.server";
import { type TargetFields, targetFieldsOf } from "./targets.server";
import type { FeasibilityAcknowledgement } from "./warnings";

export type ProposalSnapshot = {
  id: number;
  title: string;
  abstract: string;
  scienceCategory: string;
  cycle: { id: number; name: string; observingStart: string; observingEnd: string; submissionDeadline: string };
  pi: { id: number; name: string; email: string; institute: string } | null;
  coInvestigators: { email: string; name: string | null; institute: string | null }[];
  instrument: {
    name: string;
    band: string;
    bandId: number;
    centralWavelengthM: number;
    limitingMagnitude: number;
  } | null;
  hours: { configurationId: number; configuration: string; hours: number }[];
  /** Each target as frozen; `closureTriangle` is absent in versions frozen before triangles were kept. */
  targets: (TargetFields & { closureTriangle?: ClosureTriangleJson | null })[];
  document: { filename: string; sizeBytes: number; sha256: string } | null;
  feasibility: FeasibilityReport;
  /** Present when the version was submitted with failing feasibility lines ("submit anyway"). */
  acknowledgement?: FeasibilityAcknowledgement;
};

type ProposalRow = typeof proposals.$inferSelect;
type CycleRow = typeof cycles.$inferSelect;

/** The proposal's band with its instrument, as the snapshot names it. */
async function snapshotInstrument(db: DbOrTx, bandId: number | null): Promise<ProposalSnapshot["instrument"]> {
  if (bandId === null) return null;
  const [band] = await db
    .select({ band: bands, instrument: instruments.name })
    .from(bands)
    .innerJoin(instruments, eq(instruments.id, bands.instrumentId))
    .where(eq(bands.id, bandId));
  if (!band) return null;
  const { id, name, centralWavelengthM, limitingMagnitude } = band.band;
  return { name: band.instrument, band: name, bandId: id, centralWavelengthM, limitingMagnitude };
}

/** The proposal as it stands, for a frozen version (everything but the PDF bytes). */
async function buildSnapshot(tx: Transaction, proposal: ProposalRow, cycle: CycleRow, report: FeasibilityReport) {
  const [pi] = await tx
    .select({ id: users.id, name: users.name, email: users.email, institute: users.institute })
    .from(users)
    .where(eq(users.id, proposal.piId));
  const members = await teamMembers(tx, { proposalId: proposal.id });
  const hours = await requestedHours(tx, { proposalId: proposal.id });
  const targetRows = await proposalTargetRows(tx, { proposalId: proposal.id });
  const instrument = await snapshotInstrument(tx, proposal.bandId);
  const [doc] = await tx.select().from(proposalDocuments).where(eq(proposalDocuments.proposalId, proposal.id));
  const snapshot: ProposalSnapshot = {
    id: proposal.id,
    title: proposal.title,
    abstract: proposal.abstract,
    scienceCategory: proposal.scienceCategory,
    cycle: {
      id: cycle.id,
      name: cycle.name,
      observingStart: cycle.observingStart,
      observingEnd: cycle.observingEnd,
      submissionDeadline: cycle.submissionDeadline.toISOString(),
    },
    pi: pi ?? null,
    coInvestigators: members.map((m) => ({
      email: m.email,
      name: m.user?.name ?? null,
      institute: m.user?.institute ?? null,
    })),
    instrument,
    hours: hours.map((h) => ({
      configurationId: h.configuration.id,
      configuration: h.configuration.name,
      hours: h.hours,
    })),
    targets: targetRows.map((t) => ({ ...targetFieldsOf(t), closureTriangle: t.closureTriangle })),
    document: doc ? { filename: doc.filename, sizeBytes: doc.sizeBytes, sha256: doc.sha256 } : null,
    feasibility: report,
  };
  return { snapshot, documentData: doc?.data ?? null, documentSha256: doc?.sha256 ?? null };
}

/**
 * Freezes the proposal as it stands into a new version (snapshot with the feasibility report, the
 * PDF bytes and their SHA-256) and marks it submitted. Runs inside the caller's transaction, which
 * must hold the proposal's row lock. The report is computed here unless the caller has it already;
 * an acknowledgement of failing lines is frozen with the snapshot.
 */
export async function freezeVersion(
  tx: Transaction,
  {
    proposal,
    cycle,
    submittedById,
    now,
    report: given,
    acknowledgement,
  }: {
    proposal: ProposalRow;
    cycle: CycleRow;
    submittedById: number;
    now: Date;
    report?: FeasibilityReport;
    acknowledgement?: FeasibilityAcknowledgement;
  },
) {
  const report = given ?? (await computeProposalFeasibility(tx, { proposalId: proposal.id, now }));
  const built = await buildSnapshot(tx, proposal, cycle, report);
  const { documentData, documentSha256 } = built;
  const snapshot: ProposalSnapshot = acknowledgement ? { ...built.snapshot, acknowledgement } : built.snapshot;
  const version = proposal.currentVersion + 1;
  await tx.insert(proposalVersions).values({
    proposalId: proposal.id,
    version,
    submittedAt: now,
    submittedById,
    snapshot,
    documentData,
    documentSha256,
  });
  await tx
    .update(proposals)
    .set({ status: "submitted", submittedAt: now, currentVersion: version, updatedAt: now })
    .where(eq(proposals.id, proposal.id));
  return { version, report, snapshot, documentSha256 };
}

/** One frozen version for someone allowed to see the proposal, or null. */
export async function readVersion(db: Database, { proposalId, version }: { proposalId: number; version: number }) {
  const [row] = await db
    .select({
      version: proposalVersions.version,
      submittedAt: proposalVersions.submittedAt,
      submittedBy: users.name,
      snapshot: proposalVersions.snapshot,
      documentSha256: proposalVersions.documentSha256,
      hasDocument: sql<boolean>`${proposalVersions.documentData} is not null`,
    })
    .from(proposalVersions)
    .leftJoin(users, eq(users.id, proposalVersions.submittedById))
    .where(and(eq(proposalVersions.proposalId, proposalId), eq(proposalVersions.version, version)));
  return row ? { ...row, snapshot: row.snapshot as unknown as ProposalSnapshot } : null;
}
