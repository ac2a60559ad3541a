/**
 * My targets and the viewer's proposals: the drafts a target may be added to, and the adding itself,
 * through the proposal editor's own "From my targets" command (which checks, under the proposal's
 * lock, that the target is the viewer's and the draft theirs to change).
 */
import type { Database } from "~/db/client.server";
import type { ProposalViewer } from "~/services/proposals/access.server";
import { ProposalRefusal } from "~/services/proposals/lock.server";
import { editableProposals } from "~/services/proposals/picks.server";
import { addTargetFromMine } from "~/services/proposals/targets.server";

/** The drafts the viewer may add targets to now: id, title and cycle. */
export function draftsToAddTo(db: Database, { viewer, now }: { viewer: ProposalViewer; now: Date }) {
  return editableProposals(db, { viewer, now });
}

/**
 * Copies one of the viewer's targets into one of their drafts. The proposal's new target, or the
 * refusal (400 for a target that is not theirs or a name the proposal has, 403/409 for a proposal
 * they may not change now); a proposal they cannot see is the 404.
 */
export async function addToProposal(
  db: Database,
  { viewer, proposalId, myTargetId }: { viewer: ProposalViewer; proposalId: number; myTargetId: number },
): Promise<{ ok: true; name: string } | { ok: false; status: 400 | 403 | 409; message: string }> {
  try {
    const row = await addTargetFromMine(db, { viewer, proposalId, myTargetId });
    return { ok: true, name: row.name };
  } catch (e) {
    if (e instanceof ProposalRefusal) return { ok: false, status: e.status, message: e.message };
    throw e;
  }
}
