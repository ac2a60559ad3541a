import { dbContext } from "~/context";
import { pdfAttachment } from "~/lib/attachment.server";
import { requirePermission } from "~/lib/guards.server";
import { loadProposalForViewer, proposalIdFrom } from "~/services/proposals/access.server";
import { readScienceCase } from "~/services/proposals/science-case.server";
import type { Route } from "./+types/science-case";

/**
 * The science case as a download, for those who may see the proposal (everyone else: 404).
 * `?version=N` gives the PDF frozen with version N; without it, the current one.
 */
export async function loader({ request, params, url, context }: Route.LoaderArgs) {
  const viewer = await requirePermission(request, "proposals:own");
  const proposalId = proposalIdFrom(params.proposalId);
  const db = context.get(dbContext);
  await loadProposalForViewer(db, { viewer, proposalId });
  const raw = url.searchParams.get("version");
  const version = raw === null ? null : proposalIdFrom(raw);
  const doc = await readScienceCase(db, { proposalId, version });
  return pdfAttachment(doc, "This proposal has no science case here.");
}
