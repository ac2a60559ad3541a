/** What the proposal editor shows besides the proposal row and its cycle: one read of everything else. */
import { asc, desc, eq, getTableColumns, sql } from "drizzle-orm";
import type { Database } from "~/db/client.server";
import { bands, instruments } from "~/db/schema/array";
import { proposalDocuments, type proposals, proposalVersions, targets } from "~/db/schema/proposals";
import { users } from "~/db/schema/users";
import { teamMembers } from "./access.server";
import { offeredConfigurations, proposalTargetRows, requestedHours } from "./queries.server";
import type { FeasibilityAcknowledgement } from "./warnings";

const { data: _bytes, ...documentColumns } = getTableColumns(proposalDocuments);
const { version, submittedAt, documentSha256, snapshot } = getTableColumns(proposalVersions);
/** The "submit anyway" of a version, frozen in its snapshot (null when none was needed). */
const acknowledgement = sql<FeasibilityAcknowledgement | null>`${snapshot}->'acknowledgement'`;

export async function loadEditorDetails(
  db: Database,
  { proposal, viewerId }: { proposal: typeof proposals.$inferSelect; viewerId: number },
) {
  const [hours, targetRows, document, versions, offered, bandRows, myTargets, team, pi] = await Promise.all([
    requestedHours(db, { proposalId: proposal.id }),
    proposalTargetRows(db, { proposalId: proposal.id }),
    db
      .select({ ...documentColumns, uploadedBy: users.name })
      .from(proposalDocuments)
      .leftJoin(users, eq(users.id, proposalDocuments.uploadedById))
      .where(eq(proposalDocuments.proposalId, proposal.id))
      .then((r) => r[0] ?? null),
    db
      .select({ version, submittedAt, submittedBy: users.name, documentSha256, acknowledgement })
      .from(proposalVersions)
      .leftJoin(users, eq(users.id, proposalVersions.submittedById))
      .where(eq(proposalVersions.proposalId, proposal.id))
      .orderBy(desc(proposalVersions.version)),
    offeredConfigurations(db, { cycleId: proposal.cycleId }),
    db
      .select({ band: bands, instrumentName: instruments.name })
      .from(bands)
      .innerJoin(instruments, eq(instruments.id, bands.instrumentId))
      .orderBy(asc(instruments.name), asc(bands.centralWavelengthM)),
    db.select().from(targets).where(eq(targets.ownerId, viewerId)).orderBy(asc(targets.name)),
    // Read again after the viewer's own invitation may have been linked to their account.
    teamMembers(db, { proposalId: proposal.id }),
    db.query.users.findFirst({ where: eq(users.id, proposal.piId), columns: { name: true, email: true } }),
  ]);
  return { hours, targets: targetRows, document, versions, offered, bands: bandRows, myTargets, team, pi: pi ?? null };
}
