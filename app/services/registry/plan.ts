/**
 * What an import would change, worked out before anything is written.
 *
 * - The site is matched by name and created when none has it; stations, configurations,
 *   instruments and their bands are matched by name and added or updated.
 * - Nothing is removed unless "remove stations missing from the file" is chosen, and even then a
 *   station that a configuration uses stays (the preview names the configurations). Configurations,
 *   instruments and bands missing from a file are left as they are.
 * - One error anywhere and nothing is written.
 */
import type { RegistryFile } from "./registry-json";
import type {
  BandRecord,
  ConfigurationRecord,
  InstrumentRecord,
  InstrumentValues,
  SiteRecord,
  StationColumn,
  StationRecord,
} from "./schemas";
import type { StationRow } from "./stations-csv";
import type { ImportIssue } from "./upload";

export type Change = "new" | "updated" | "unchanged" | "remove" | "keep";

type Line<T, K extends string> = {
  /** Row in the file, or null for a record that is only in the registry. */
  row: number | null;
  name: string;
  change: Change;
  before: T | null;
  after: T | null;
  /** The fields whose values differ (for "updated"). */
  changed: K[];
};
export type StationLine = Line<StationRecord, StationColumn> & { note: string | null };
export type SiteLine = Line<SiteRecord, keyof SiteRecord>;
export type ConfigurationLine = Line<ConfigurationRecord, keyof ConfigurationRecord>;
export type BandLine = Line<BandRecord, keyof BandRecord>;
export type InstrumentLine = Line<InstrumentValues, keyof InstrumentValues> & { bands: BandLine[] };

export type StationPlan = { lines: StationLine[]; counts: Record<Change, number>; notices: string[] };

export type RegistrySnapshot = {
  site: SiteRecord;
  stations: StationRecord[];
  configurations: ConfigurationRecord[];
  instruments: InstrumentRecord[];
};

export type RegistryPlan = {
  site: SiteLine;
  stations: StationLine[];
  configurations: ConfigurationLine[];
  instruments: InstrumentLine[];
  counts: Record<"site" | "stations" | "configurations" | "instruments" | "bands", Record<Change, number>>;
  errors: ImportIssue[];
  notices: string[];
};

export function countChanges(lines: { change: Change }[]): Record<Change, number> {
  const counts: Record<Change, number> = { new: 0, updated: 0, unchanged: 0, remove: 0, keep: 0 };
  for (const l of lines) counts[l.change] += 1;
  return counts;
}

/** New, updated and removed records: what applying the counted plan writes. */
export const totalChanges = (counts: Record<Change, number>) => counts.new + counts.updated + counts.remove;

function compareFields<T extends Record<string, unknown>>(before: T, after: T, keys: (keyof T)[]): (keyof T)[] {
  return keys.filter((k) => {
    const a = before[k];
    const b = after[k];
    if (Array.isArray(a) && Array.isArray(b)) return a.length !== b.length || a.some((x, i) => x !== b[i]);
    return a !== b;
  });
}

function line<T extends Record<string, unknown>>(
  row: number | null,
  name: string,
  before: T | null,
  after: T,
  keys: (keyof T)[],
): Line<T, Extract<keyof T, string>> {
  if (!before) return { row, name, change: "new", before: null, after, changed: [] };
  const changed = compareFields(before, after, keys) as Extract<keyof T, string>[];
  return { row, name, change: changed.length > 0 ? "updated" : "unchanged", before, after, changed };
}

/** A record of the registry that the file does not mention: left as it is. */
const kept = <T extends { name: string }>(x: T) => ({
  row: null,
  name: x.name,
  change: "keep" as Change,
  before: x,
  after: x as T | null,
  changed: [] as never[],
});

const STATION_VALUES: StationColumn[] = ["eastM", "northM", "upM", "pathOffsetM"];

/**
 * Compares the stations of a file with those at the site: new, updated or unchanged by name; the
 * site's stations missing from the file are kept, or removed when `removeMissing` is set and no
 * configuration uses them (`usage`: station name → names of the configurations that use it).
 */
export function planStations(
  current: StationRecord[],
  incoming: StationRow[],
  options: { removeMissing: boolean; usage: Record<string, string[]> },
): StationPlan {
  const byName = new Map(current.map((s) => [s.name, s]));
  const lines: StationLine[] = incoming.map(({ row, ...after }) => ({
    ...line(row, after.name, byName.get(after.name) ?? null, after, STATION_VALUES),
    note: null,
  }));
  const inFile = new Set(incoming.map((s) => s.name));
  let usedButMissing = 0;
  for (const s of current.filter((s) => !inFile.has(s.name))) {
    const users = options.usage[s.name] ?? [];
    if (options.removeMissing && users.length === 0) {
      lines.push({ ...kept(s), change: "remove", after: null, note: "not in the file; will be removed" });
    } else if (options.removeMissing) {
      usedButMissing += 1;
      lines.push({ ...kept(s), note: `not in the file, but used by ${users.join(", ")}, so it stays` });
    } else lines.push({ ...kept(s), note: "not in the file; left as it is" });
  }
  const n = usedButMissing;
  const notices =
    n > 0
      ? [
          `${n} station${n > 1 ? "s" : ""} missing from the file stay${n > 1 ? "" : "s"} because configurations use ${n > 1 ? "them" : "it"}.`,
        ]
      : [];
  return { lines, counts: countChanges(lines), notices };
}

/** Every station a configuration of the file lists must be in the file or at the site. */
function unknownStations(current: RegistrySnapshot | null, file: RegistryFile): ImportIssue[] {
  const known = new Set([...file.stations.map((s) => s.name), ...(current?.stations ?? []).map((s) => s.name)]);
  return file.configurations.flatMap((c) => {
    const unknown = c.stations.filter((n) => !known.has(n));
    if (unknown.length === 0) return [];
    const are = unknown.length > 1 ? "are" : "is";
    const message = `${unknown.join(", ")} ${are} neither in the file's stations nor at the site`;
    return [{ section: "configurations" as const, row: c.row, column: "stations", message }];
  });
}

/** Which configurations use each station once the import is applied. */
function usageAfter(current: RegistrySnapshot | null, file: RegistryFile): Record<string, string[]> {
  const finalConfigs = new Map<string, string[]>();
  for (const c of current?.configurations ?? []) finalConfigs.set(c.name, c.stations);
  for (const c of file.configurations) finalConfigs.set(c.name, c.stations);
  const usage: Record<string, string[]> = {};
  for (const [name, list] of finalConfigs) for (const s of list) usage[s] = [...(usage[s] ?? []), name];
  return usage;
}

function instrumentLines(current: RegistrySnapshot | null, file: RegistryFile): InstrumentLine[] {
  const currentInstruments = new Map((current?.instruments ?? []).map((i) => [i.name, i]));
  const lines: InstrumentLine[] = file.instruments.map(({ row, bands, ...values }) => {
    const before = currentInstruments.get(values.name) ?? null;
    const head = line(
      row,
      values.name,
      before ? { name: before.name, description: before.description, maxTelescopes: before.maxTelescopes } : null,
      values,
      ["description", "maxTelescopes"],
    );
    const currentBands = new Map((before?.bands ?? []).map((b) => [b.name, b]));
    const bandKeys: (keyof BandRecord)[] = ["centralWavelengthM", "channels", "bandwidthM", "limitingMagnitude"];
    const bandLines: BandLine[] = bands.map((b) => line(null, b.name, currentBands.get(b.name) ?? null, b, bandKeys));
    const inFileBands = new Set(bands.map((b) => b.name));
    for (const b of before?.bands ?? []) if (!inFileBands.has(b.name)) bandLines.push(kept(b));
    return { ...head, bands: bandLines };
  });
  for (const i of current?.instruments ?? [])
    if (!file.instruments.some((x) => x.name === i.name)) lines.push({ ...kept(i), bands: i.bands.map(kept) });
  return lines;
}

/** A configuration larger than every instrument can take is allowed, but worth a word. */
function wideConfigurations(configurations: ConfigurationLine[], instruments: InstrumentLine[]): string[] {
  const widest = instruments.reduce((m, i) => Math.max(m, i.after?.maxTelescopes ?? 0), 0);
  if (widest === 0) return [];
  return configurations
    .filter((c) => c.after && c.change !== "keep" && c.after.stations.length > widest)
    .map(
      (c) =>
        `Configuration ${c.name} has ${c.after!.stations.length} stations; no instrument combines more than ${widest}.`,
    );
}

/**
 * Compares a whole-registry file with the site of the same name (`current`, or null when there is
 * none yet). References are checked here: every station a configuration lists must be in the file
 * or at the site.
 */
export function planRegistry(
  current: RegistrySnapshot | null,
  file: RegistryFile,
  options: { removeMissing: boolean },
): RegistryPlan {
  const siteKeys: (keyof SiteRecord)[] = [
    "latitudeDeg",
    "longitudeDeg",
    "altitudeM",
    "minElevationDeg",
    "delayLineStrokeM",
    "timeZone",
  ];
  const site = line(null, file.site.name, current?.site ?? null, file.site, siteKeys);
  const stationPlan = planStations(current?.stations ?? [], file.stations, {
    removeMissing: options.removeMissing,
    usage: usageAfter(current, file),
  });

  const currentConfigs = new Map((current?.configurations ?? []).map((c) => [c.name, c]));
  const configurations: ConfigurationLine[] = file.configurations.map(({ row, ...c }) =>
    line(row, c.name, currentConfigs.get(c.name) ?? null, c, ["description", "offered", "stations"]),
  );
  const inFileConfigs = new Set(file.configurations.map((c) => c.name));
  for (const c of current?.configurations ?? []) if (!inFileConfigs.has(c.name)) configurations.push(kept(c));
  const instruments = instrumentLines(current, file);

  return {
    site,
    stations: stationPlan.lines,
    configurations,
    instruments,
    counts: {
      site: countChanges([site]),
      stations: stationPlan.counts,
      configurations: countChanges(configurations),
      instruments: countChanges(instruments),
      bands: countChanges(instruments.flatMap((i) => i.bands)),
    },
    errors: unknownStations(current, file),
    notices: [...stationPlan.notices, ...wideConfigurations(configurations, instruments)],
  };
}
