/** The home page's summary of the array: the first registered site, its stations, configurations and instruments. */
import type { Database } from "~/db/client.server";
import { listSites, loadSiteRegistry } from "~/services/registry/queries.server";

/** Public: only what the array registry shows everyone. Null before any site is registered. */
export async function arraySummary(db: Database) {
  const [first] = await listSites(db);
  const registry = first ? await loadSiteRegistry(db, first.id) : null;
  if (!registry) return null;
  return {
    name: registry.site.name,
    latitudeDeg: registry.site.latitudeDeg,
    longitudeDeg: registry.site.longitudeDeg,
    altitudeM: registry.site.altitudeM,
    stations: registry.stations.length,
    configurations: registry.configurations.map((c) => ({ name: c.name, size: c.stationNames.length })),
    instruments: registry.instruments.map((i) => ({ name: i.name, bands: i.bands.map((b) => b.name) })),
  };
}

export type ArraySummary = NonNullable<Awaited<ReturnType<typeof arraySummary>>>;
