import { dbContext } from "~/context";
import { pdfAttachment } from "~/lib/attachment.server";
import { requirePermission } from "~/lib/guards.server";
import { committeeProposalId, loadProposalForCommittee } from "~/services/committee/access.server";
import { frozenScienceCase } from "~/services/committee/reading.server";
import type { Route } from "./+types/science-case";

/**
 * The science case frozen with the version the committee reads, for an assigned reviewer without a
 * conflict or the chair (everyone else: 404).
 */
export async function loader({ request, params, context }: Route.LoaderArgs) {
  const viewer = await requirePermission(request, "review:desk");
  const db = context.get(dbContext);
  const proposalId = committeeProposalId(params.proposalId);
  const { proposal } = await loadProposalForCommittee(db, { viewer, proposalId });
  const doc = await frozenScienceCase(db, { proposalId, version: proposal.currentVersion });
  return pdfAttachment(doc, "This version has no science case.");
}
