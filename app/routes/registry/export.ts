// GET /registry/export/:file — the array registry as files: stations.csv, stations.json,
// configurations.csv, bands.csv and registry.json (the whole registry, read back by the import).
// `?site=<id>` picks the site; the first site by name otherwise.

import { dbContext } from "~/context";
import { fileSlug, REGISTRY_EXPORTS } from "~/services/registry/exports";
import { loadSnapshot } from "~/services/registry/import.server";
import { resolveSite } from "~/services/registry/queries.server";
import type { Route } from "./+types/export";

function plain(status: number, text: string) {
  return new Response(text, { status, headers: { "Content-Type": "text/plain; charset=utf-8" } });
}

export async function loader({ params, url, context }: Route.LoaderArgs) {
  // Public, like the registry pages ("registry:read" is granted to everyone).
  const file = REGISTRY_EXPORTS[params.file];
  if (!file)
    return plain(
      404,
      `There is no export called ${params.file}. Try one of: ${Object.keys(REGISTRY_EXPORTS).join(", ")}.`,
    );
  const db = context.get(dbContext);
  const site = await resolveSite(db, { param: url.searchParams.get("site") });
  if (!site) return plain(404, "There is no site to export.");
  const snapshot = await loadSnapshot(db, { siteId: site.id });
  if (!snapshot) return plain(404, "The site was removed while exporting.");
  return new Response(file.body(snapshot, new Date()), {
    headers: {
      "Content-Type": `${file.type}; charset=utf-8`,
      "Content-Disposition": `attachment; filename="${fileSlug(site.name)}-${params.file}"`,
      "Cache-Control": "no-store",
    },
  });
}
