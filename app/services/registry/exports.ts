/**
 * The registry as files: stations, configurations and bands as CSV (units in the header names),
 * and the whole registry as the JSON the whole-registry import reads back (wavelengths in metres).
 */
import { toSpreadsheetCsv } from "~/lib/csv";
import type { RegistrySnapshot } from "./plan";
import { REGISTRY_FORMAT, REGISTRY_FORMAT_VERSION } from "./registry-json";
import {
  type ConfigurationRecord,
  type InstrumentRecord,
  metresToMicrons,
  STATION_COLUMNS,
  type StationRecord,
} from "./schemas";

/** Stations as CSV; the header names carry the unit (M = metres). */
export function stationsToCsv(stations: StationRecord[]): string {
  return toSpreadsheetCsv(
    STATION_COLUMNS,
    stations.map((s) => STATION_COLUMNS.map((c) => s[c])),
  );
}

/** Configurations as CSV: stations in order, separated by spaces. */
export function configurationsToCsv(configurations: ConfigurationRecord[]): string {
  return toSpreadsheetCsv(
    ["name", "description", "offered", "stationCount", "stations"],
    configurations.map((c) => [c.name, c.description, c.offered, c.stations.length, c.stations.join(" ")]),
  );
}

/** One row per band with its instrument; wavelengths in micrometres (Um in the header). */
export function bandsToCsv(instruments: InstrumentRecord[]): string {
  return toSpreadsheetCsv(
    ["instrument", "maxTelescopes", "band", "centralWavelengthUm", "bandwidthUm", "channels", "limitingMagnitude"],
    instruments.flatMap((i) =>
      i.bands.map((b) => [
        i.name,
        i.maxTelescopes,
        b.name,
        metresToMicrons(b.centralWavelengthM),
        metresToMicrons(b.bandwidthM),
        b.channels,
        b.limitingMagnitude,
      ]),
    ),
  );
}

/** The whole registry of a site as the JSON the whole-registry import reads (wavelengths in metres). */
export function registryToJson(snapshot: RegistrySnapshot, exportedAt: Date) {
  return {
    format: REGISTRY_FORMAT,
    version: REGISTRY_FORMAT_VERSION,
    exportedAt: exportedAt.toISOString(),
    site: snapshot.site,
    stations: snapshot.stations.map((s) => ({
      name: s.name,
      eastM: s.eastM,
      northM: s.northM,
      upM: s.upM,
      pathOffsetM: s.pathOffsetM,
    })),
    configurations: snapshot.configurations,
    instruments: snapshot.instruments,
  };
}

/** The files of the registry's download list: content type and body of each, by file name. */
export const REGISTRY_EXPORTS: Record<string, { type: string; body: (s: RegistrySnapshot, now: Date) => string }> = {
  "stations.csv": { type: "text/csv", body: (s) => stationsToCsv(s.stations) },
  "stations.json": {
    type: "application/json",
    body: (s) => JSON.stringify({ site: s.site.name, stations: s.stations }, null, 2),
  },
  "configurations.csv": { type: "text/csv", body: (s) => configurationsToCsv(s.configurations) },
  "bands.csv": { type: "text/csv", body: (s) => bandsToCsv(s.instruments) },
  "registry.json": { type: "application/json", body: (s, now) => JSON.stringify(registryToJson(s, now), null, 2) },
};

/** A site's name as a file-name prefix: "Sierra Lumbre Array" → "sierra-lumbre-array". */
export function fileSlug(name: string): string {
  return (
    name
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, "-")
      .replace(/^-|-$/g, "") || "site"
  );
}
