/**
 * The array registry as the Sketchpad and the Triangle finder hold it (a subset of the registry
 * loader's data), and the lookups the request builders make in it: a band by name, the stations
 * of a pick or a pool, and the site and stations as the API expects them. Pure.
 */
import type { BandLike, SiteInput, StationInput } from "~/engine";
import { ALL_STATIONS, type SketchState } from "./state";

/** The parts of the array registry the builders need (a subset of the registry loader's data). */
export interface RegistryLike {
  site: SiteInput & { minElevationDeg: number; delayLineStrokeM: number };
  stations: StationInput[];
  configurations: { name: string; stationNames: string[] }[];
  instruments: { name: string; maxTelescopes: number; bands: BandLike[] }[];
}

/** The registry as the pages receive it from their loader (with the site's name and configuration details). */
export interface SketchRegistry extends RegistryLike {
  site: RegistryLike["site"] & { name: string };
  configurations: (RegistryLike["configurations"][number] & { description: string; offered: boolean })[];
}

export function siteBody(r: RegistryLike): SiteInput {
  return { latitudeDeg: r.site.latitudeDeg, longitudeDeg: r.site.longitudeDeg, altitudeM: r.site.altitudeM };
}

export function findBand(r: RegistryLike, instrument: string, band: string) {
  const inst = r.instruments.find((i) => i.name === instrument);
  const b = inst?.bands.find((x) => x.name === band);
  return inst && b ? { instrument: inst, band: b } : null;
}

/** Stations of a Sketchpad state: the configuration's, or the free pick (in registry order). */
export function pickedStations(s: Pick<SketchState, "config" | "stations">, r: RegistryLike): string[] {
  if (s.config !== "") return r.configurations.find((c) => c.name === s.config)?.stationNames ?? [];
  const set = new Set(s.stations);
  return r.stations.filter((st) => set.has(st.name)).map((st) => st.name);
}

/** Stations of a Triangle finder pool: every station, a configuration's, or null for an unknown pool. */
export function poolStations(pool: string, r: RegistryLike): string[] | null {
  if (pool === ALL_STATIONS) return r.stations.map((st) => st.name);
  return r.configurations.find((x) => x.name === pool)?.stationNames ?? null;
}

export function stationBodies(names: string[], r: RegistryLike): StationInput[] {
  return names.map((n) => {
    const st = r.stations.find((x) => x.name === n)!;
    return { name: st.name, eastM: st.eastM, northM: st.northM, upM: st.upM, pathOffsetM: st.pathOffsetM };
  });
}
