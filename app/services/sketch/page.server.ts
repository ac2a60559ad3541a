/**
 * The registry as the Sketchpad and the Triangle finder need it: one site (by name, else the first),
 * its stations, configurations with ordered station names and instruments with bands, plus the date
 * of the next night there.
 */
import type { Database } from "~/db/client.server";
import type { Viewer } from "~/lib/guards.server";
import { notFound } from "~/lib/not-found";
import { listSites, loadSiteRegistry } from "~/services/registry/queries.server";
import { listTargets } from "~/services/targets/targets.server";
import type { SavedTarget } from "./models";
import { nextNightDate } from "./night";
import type { SketchRegistry } from "./registry";
import type { StateDefaults } from "./state";
import type { ProposalTargetChoice } from "./triangle-choice";
import { proposalTargetChoices } from "./triangle-choice.server";

export async function loadSketchRegistry(
  db: Database,
  { siteName, now = new Date() }: { siteName: string | null; now?: Date },
) {
  const sites = await listSites(db);
  const chosen = sites.find((s) => s.name === siteName) ?? sites[0];
  if (!chosen) return null;
  const full = await loadSiteRegistry(db, chosen.id);
  if (!full) return null;
  const registry: SketchRegistry = {
    site: {
      name: full.site.name,
      latitudeDeg: full.site.latitudeDeg,
      longitudeDeg: full.site.longitudeDeg,
      altitudeM: full.site.altitudeM,
      minElevationDeg: full.site.minElevationDeg,
      delayLineStrokeM: full.site.delayLineStrokeM,
    },
    stations: full.stations.map((s) => ({
      name: s.name,
      eastM: s.eastM,
      northM: s.northM,
      upM: s.upM,
      pathOffsetM: s.pathOffsetM,
    })),
    configurations: full.configurations.map((c) => ({
      name: c.name,
      description: c.description,
      offered: c.offered,
      stationNames: c.stationNames,
    })),
    instruments: full.instruments
      .filter((i) => i.bands.length > 0)
      .map((i) => ({
        name: i.name,
        maxTelescopes: i.maxTelescopes,
        bands: i.bands.map((b) => ({
          name: b.name,
          centralWavelengthM: b.centralWavelengthM,
          bandwidthM: b.bandwidthM,
          channels: b.channels,
        })),
      })),
  };
  const firstConfig = registry.configurations.find((c) => c.offered) ?? registry.configurations[0];
  // The instrument that combines the most telescopes suits every configuration best.
  const firstInstrument = [...registry.instruments].sort((a, b) => b.maxTelescopes - a.maxTelescopes)[0];
  const defaults: StateDefaults = {
    date: nextNightDate(now, registry.site.longitudeDeg),
    config: firstConfig?.name ?? "",
    instrument: firstInstrument?.name ?? "",
    band: firstInstrument?.bands[0]?.name ?? "",
  };
  return { registry, defaults, siteNames: sites.map((s) => s.name) };
}

/** The viewer's own targets for the "From My targets" picker (empty for roles without a target list). */
export async function savedTargetsOf(db: Database, { viewer }: { viewer: Viewer }): Promise<SavedTarget[]> {
  if (!viewer.permissions.has("proposals:own")) return [];
  const list = await listTargets(db, viewer.user.id);
  return list.map((t) => ({ id: t.id, name: t.name, raDeg: t.raDeg, decDeg: t.decDeg, model: t.model }));
}

/**
 * The loader data of the Sketchpad and the Triangle finder: the registry of the site in the URL,
 * and the viewer's own targets. `purpose` finishes the sentence of the 404 when the registry is too
 * thin to work with.
 */
export async function loadSketchPage(
  db: Database,
  {
    viewer,
    url,
    purpose,
    withProposals = false,
  }: { viewer: Viewer; url: URL; purpose: string; withProposals?: boolean },
) {
  const loaded = await loadSketchRegistry(db, { siteName: url.searchParams.get("site") });
  const none = { savedTargets: [] as SavedTarget[], proposalTargets: [] as ProposalTargetChoice[] };
  if (!loaded) return { loaded: null, ...none };
  if (loaded.registry.stations.length < 2 || loaded.registry.instruments.length === 0) {
    notFound(`The array registry needs at least two stations and one instrument band before ${purpose}.`);
  }
  const [savedTargets, proposalTargets] = await Promise.all([
    savedTargetsOf(db, { viewer }),
    withProposals ? proposalTargetChoices(db, { viewer, now: new Date() }) : none.proposalTargets,
  ]);
  return { loaded, savedTargets, proposalTargets };
}
