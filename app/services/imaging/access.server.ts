/**
 * Who may see an imaging preview: its owner (who may also cancel it); for a preview of a proposal's
 * target, also the proposal's team and the committee that may read the proposal (an assigned reviewer
 * without a conflict, the chair), read-only. Anyone else gets the same 404 as for a preview that does
 * not exist.
 */
import { eq } from "drizzle-orm";
import type { DbOrTx } from "~/db/client.server";
import { proposals } from "~/db/schema/proposals";
import type { Viewer } from "~/lib/guards.server";
import { loadProposalForCommittee } from "~/services/committee/access.server";
import { relationTo, teamMembers } from "~/services/proposals/access.server";

export type ProposalReading = "team" | "committee" | null;

/** How the viewer reads a proposal's previews: on its team, on its committee, or not at all. */
export async function proposalReading(db: DbOrTx, viewer: Viewer, proposalId: number): Promise<ProposalReading> {
  const [proposal] = await db.select().from(proposals).where(eq(proposals.id, proposalId));
  if (!proposal) return null;
  const members = await teamMembers(db, { proposalId });
  if (relationTo(viewer, { piId: proposal.piId, status: proposal.status, members })) return "team";
  try {
    await loadProposalForCommittee(db, { viewer, proposalId });
    return "committee";
  } catch (e) {
    if (e instanceof Response || (e && typeof e === "object" && "init" in e)) return null;
    throw e;
  }
}

/** May the viewer change (cancel) a proposal's previews of their own: on its team and it is a draft or under way. */
export async function mayPreviewProposal(db: DbOrTx, viewer: Viewer, proposalId: number): Promise<boolean> {
  return (await proposalReading(db, viewer, proposalId)) === "team";
}
