import { dbContext } from "~/context";
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
  if (!doc)
    throw new Response("This version has no science case.", {
      status: 404,
      headers: { "Content-Type": "text/plain; charset=utf-8" },
    });
  const ascii = doc.filename.replace(/[^\x20-\x7e]/g, "_").replace(/["\\]/g, "_");
  return new Response(new Uint8Array(doc.data), {
    status: 200,
    headers: {
      "Content-Type": "application/pdf",
      "Content-Length": String(doc.data.length),
      "Content-Disposition": `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(doc.filename)}`,
      "X-Content-Type-Options": "nosniff",
      "Cache-Control": "private, no-store",
      ETag: `"${doc.sha256}"`,
    },
  });
}
