import { dbContext } from "~/context";
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
  if (!doc)
    throw new Response("This proposal has no science case here.", {
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
