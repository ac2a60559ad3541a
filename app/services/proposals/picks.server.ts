/**
 * The proposals a person may still change, for the pickers of other pages (My targets' "Add to a
 * proposal", the Triangle finder's "Use this triangle"): drafts of their team whose cycle's deadline
 * is ahead. The writes themselves check again under the proposal's lock (lock.server.ts).
 */
import { asc, inArray } from "drizzle-orm";
import type { Database } from "~/db/client.server";
import { proposalTargets } from "~/db/schema/proposals";
import { isEditableDraft, type ProposalViewer } from "./access.server";
import { listMyProposals } from "./queries.server";

/** The viewer's drafts that may still be changed at `now`, newest change first. */
export async function editableProposals(db: Database, { viewer, now }: { viewer: ProposalViewer; now: Date }) {
  const list = await listMyProposals(db, { viewer });
  return list
    .filter((p) => isEditableDraft(p.status, p.deadline, now))
    .map((p) => ({ id: p.id, title: p.title, cycleName: p.cycleName }));
}

/** The same drafts, each with its targets in order (id, name, chosen closure triangle). */
export async function editableProposalTargets(db: Database, { viewer, now }: { viewer: ProposalViewer; now: Date }) {
  const drafts = await editableProposals(db, { viewer, now });
  if (drafts.length === 0) return [];
  const rows = await db
    .select({
      id: proposalTargets.id,
      proposalId: proposalTargets.proposalId,
      name: proposalTargets.name,
      closureTriangle: proposalTargets.closureTriangle,
    })
    .from(proposalTargets)
    .where(
      inArray(
        proposalTargets.proposalId,
        drafts.map((d) => d.id),
      ),
    )
    .orderBy(asc(proposalTargets.position), asc(proposalTargets.id));
  return drafts.map((d) => ({
    ...d,
    targets: rows.filter((r) => r.proposalId === d.id).map(({ proposalId: _, ...t }) => t),
  }));
}
