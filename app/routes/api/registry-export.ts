// GET /registry/export/:file — the array registry as files: stations.csv, stations.json,
// configurations.csv, bands.csv and registry.json (the whole registry, read back by the import).
// `?site=<id>` picks the site; the first site by name otherwise.

import { database } from "~/db/client.server";
import { loadSnapshot, resolveSite } from "~/services/registry/admin.server";
import {
  bandsToCsv,
  configurationsToCsv,
  type RegistrySnapshot,
  registryToJson,
  stationsToCsv,
} from "~/services/registry/io";
import type { Route } from "./+types/registry-export";

const FILES: Record<string, { type: string; body: (s: RegistrySnapshot, now: Date) => string }> = {
  "stations.csv": { type: "text/csv", body: (s) => stationsToCsv(s.stations) },
  "stations.json": {
    type: "application/json",
    body: (s) => JSON.stringify({ site: s.site.name, stations: s.stations }, null, 2),
  },
  "configurations.csv": { type: "text/csv", body: (s) => configurationsToCsv(s.configurations) },
  "bands.csv": { type: "text/csv", body: (s) => bandsToCsv(s.instruments) },
  "registry.json": { type: "application/json", body: (s, now) => JSON.stringify(registryToJson(s, now), null, 2) },
};

function plain(status: number, text: string) {
  return new Response(text, { status, headers: { "Content-Type": "text/plain; charset=utf-8" } });
}

export async function loader({ params, url }: Route.LoaderArgs) {
  // Public, like the registry pages ("registry:read" is granted to everyone).
  const file = FILES[params.file];
  if (!file)
    return plain(404, `There is no export called ${params.file}. Try one of: ${Object.keys(FILES).join(", ")}.`);
  const db = database();
  const site = await resolveSite(db, url.searchParams.get("site"));
  if (!site) return plain(404, "There is no site to export.");
  const snapshot = await loadSnapshot(db, site.id);
  if (!snapshot) return plain(404, "The site was removed while exporting.");
  const slug =
    site.name
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, "-")
      .replace(/^-|-$/g, "") || "site";
  return new Response(file.body(snapshot, new Date()), {
    headers: {
      "Content-Type": `${file.type}; charset=utf-8`,
      "Content-Disposition": `attachment; filename="${slug}-${params.file}"`,
      "Cache-Control": "no-store",
    },
  });
}
