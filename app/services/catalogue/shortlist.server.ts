/**
 * The Calibrator shortlist as the pages and the API ask for it: the registry's choices (site, bands,
 * configurations with their longest baseline), the page's settings turned into the engine's request,
 * and the engine's shortlist on the in-memory catalogue.
 */
import { asc } from "drizzle-orm";
import type { Database } from "~/db/client.server";
import { sites } from "~/db/schema/array";
import {
  type CalibratorsInput,
  type CalibratorsResponse,
  DEG_TO_RAD,
  julianDay,
  lmstHours,
  longestBaselineM,
  parseIsoDate,
  shortlistCalibrators,
} from "~/engine";
import { parseDeclination, parseRightAscension } from "~/lib/coordinates";
import { loadSiteRegistry } from "~/services/registry/queries.server";
import { loadCatalogue } from "./data.server";
import { resolveName } from "./lookup.server";
import { readShortlistSettings, type ShortlistSettings, type ShortlistValues } from "./schemas";

export type Refusal = { ok: false; field: string; message: string };

/** `cli calibrators` on the server's catalogue (the API's computation). */
export function shortlistForRequest(input: CalibratorsInput): { ok: true; value: CalibratorsResponse } | Refusal {
  return shortlistCalibrators(loadCatalogue(), input);
}

export type BandChoice = {
  id: number;
  label: string;
  name: string;
  centralWavelengthM: number;
  limitingMagnitude: number | null;
};
export type ConfigurationChoice = { id: number; name: string; stations: number; longestBaselineM: number };
export type ShortlistChoices = {
  site: { id: number; name: string; latitudeDeg: number; longitudeDeg: number; altitudeM: number } & {
    minElevationDeg: number;
  };
  bands: BandChoice[];
  configurations: ConfigurationChoice[];
};

/** The site (the given one, else the registry's first) with its bands and configurations; null without a site. */
export async function shortlistChoices(db: Database, siteId?: number | null): Promise<ShortlistChoices | null> {
  let id = siteId ?? null;
  if (id === null) {
    const [first] = await db.select({ id: sites.id }).from(sites).orderBy(asc(sites.id)).limit(1);
    id = first?.id ?? null;
  }
  const registry = id === null ? null : await loadSiteRegistry(db, id);
  if (!registry) return null;
  const byName = new Map(registry.stations.map((s) => [s.name, s]));
  const { site } = registry;
  return {
    site: {
      id: site.id,
      name: site.name,
      latitudeDeg: site.latitudeDeg,
      longitudeDeg: site.longitudeDeg,
      altitudeM: site.altitudeM,
      minElevationDeg: site.minElevationDeg,
    },
    bands: registry.instruments
      .flatMap((i) =>
        i.bands.map((b) => ({
          id: b.id,
          label: `${i.name} — ${b.name} (${(b.centralWavelengthM * 1e6).toPrecision(3)} µm)`,
          name: b.name,
          centralWavelengthM: b.centralWavelengthM,
          limitingMagnitude: b.limitingMagnitude ?? null,
        })),
      )
      .sort((a, b) => a.centralWavelengthM - b.centralWavelengthM),
    configurations: registry.configurations.map((c) => {
      const stations = c.stationNames.flatMap((n) => byName.get(n) ?? []);
      return { id: c.id, name: c.name, stations: stations.length, longestBaselineM: longestBaselineM(stations) };
    }),
  };
}

/**
 * The night of the observing period when the target crosses the meridian nearest to local midnight
 * (local mean time from the site's longitude), as YYYY-MM-DD; the first night when the period is empty.
 */
export function bestNightIn(period: { start: string; end: string }, raDeg: number, longitudeDeg: number): string {
  const start = parseIsoDate(period.start);
  const end = parseIsoDate(period.end);
  if (!start || !end) return period.start;
  const first = julianDay(start.year, start.month, start.day);
  const last = julianDay(end.year, end.month, end.day);
  let best = { jd: first, offH: Number.POSITIVE_INFINITY };
  for (let jd = first; jd <= last + 1e-9; jd += 1) {
    // Local midnight that ends the evening of this date, in UT.
    const midnight = jd + 1 - longitudeDeg / 360;
    const ha = lmstHours(midnight, longitudeDeg * DEG_TO_RAD) - raDeg / 15;
    const offH = Math.abs((((ha % 24) + 36) % 24) - 12);
    if (offH < best.offH - 1e-9) best = { jd, offH };
  }
  const d = new Date((best.jd - 2440587.5) * 86_400_000);
  return d.toISOString().slice(0, 10);
}

/** The target of a shortlist page: fixed (a proposal's target), or read from the form. */
export type FixedTarget = {
  name: string;
  raDeg: number;
  decDeg: number;
  /** The target's magnitudes by band name: the band's is the target's band magnitude unless one is typed. */
  magnitudes?: Record<string, number>;
};

export type ShortlistRun = {
  errors: Record<string, string>;
  result: CalibratorsResponse | null;
  /** What was asked, in words, for the page's summary. */
  asked: {
    /** The target's name as the page knows it (a proposal's target, or the typed name). */
    targetName: string | null;
    band: BandChoice;
    /** The baseline the V² is computed on, metres, to 0.1 m. */
    baselineM: number;
    configuration: ConfigurationChoice | null;
  } | null;
};

/** Reads the target fields: coordinates when typed, else the star the name names. */
function readTarget(s: ShortlistSettings, errors: Record<string, string>): CalibratorsInput["target"] | null {
  const bandMag = s.targetMag;
  if (s.ra !== "" || s.dec !== "") {
    const ra = parseRightAscension(s.ra);
    const dec = parseDeclination(s.dec);
    if (!ra.ok) errors.ra = ra.message;
    if (!dec.ok) errors.dec = dec.message;
    return ra.ok && dec.ok ? { raDeg: ra.deg, decDeg: dec.deg, bandMag } : null;
  }
  if (s.target === "") {
    errors.target = "Target: type a star's name or designation, or its coordinates";
    return null;
  }
  const found = resolveName(s.target);
  if (!found.ok) {
    errors.target = `Target: ${found.message}; type its coordinates instead`;
    return null;
  }
  return { name: s.target, bandMag };
}

/** The page's shortlist: settings checked, the engine's request built from the registry's choices, run. */
export function runShortlist(values: ShortlistValues, choices: ShortlistChoices, fixed?: FixedTarget): ShortlistRun {
  const read = readShortlistSettings(values);
  if (!read.ok) return { errors: read.errors, result: null, asked: null };
  const s = read.settings;
  const errors: Record<string, string> = {};
  const band = choices.bands.find((b) => b.id === s.band) ?? null;
  if (!band) errors.band = "Band: pick one from the list";
  const own = band ? fixed?.magnitudes?.[band.name] : undefined;
  const target = fixed
    ? { raDeg: fixed.raDeg, decDeg: fixed.decDeg, bandMag: s.targetMag ?? own ?? null }
    : readTarget(s, errors);
  const configuration = s.config === null ? null : (choices.configurations.find((c) => c.id === s.config) ?? null);
  if (s.config !== null && !configuration) errors.config = "Configuration: pick one from the list";
  const baselineM = configuration ? configuration.longestBaselineM : s.baseline;
  if (!configuration && s.config === null && baselineM === null) {
    errors.baseline = "Longest baseline: pick a configuration or type the baseline in metres";
  } else if (configuration && !(baselineM && baselineM > 0)) {
    errors.config = "Configuration: it has fewer than two stations";
  }
  if (Object.keys(errors).length > 0 || !target || !band || !baselineM) return { errors, result: null, asked: null };
  const { latitudeDeg, longitudeDeg, altitudeM } = choices.site;
  const longestM = Math.round(baselineM * 10) / 10;
  const out = shortlistForRequest({
    target,
    wavelengthM: band.centralWavelengthM,
    longestBaselineM: longestM,
    site: { latitudeDeg, longitudeDeg, altitudeM },
    date: s.date,
    minElevationDeg: s.minElevation as number,
    maxDistanceDeg: s.maxDistance as number,
    minVis2: s.minVis2 as number,
    limit: s.limit,
    maxMagDifference: s.maxMagDiff,
    // An empty band limit is the band's own, from the registry.
    bandLimitMag: s.bandLimit ?? band.limitingMagnitude,
  });
  if (!out.ok) {
    const field = out.field === "target.name" ? "target" : out.field;
    return { errors: { [field]: out.message }, result: null, asked: null };
  }
  const targetName = fixed?.name ?? out.value.target.name ?? (s.target || null);
  return { errors: {}, result: out.value, asked: { targetName, band, baselineM: longestM, configuration } };
}

/**
 * Defaults of the generic page: the shortest-wavelength band (the estimates' table reaches Ks only), the
 * configuration with the longest baseline (the strictest for V²), tonight.
 */
export function defaultShortlistValues(choices: ShortlistChoices, today: Date): ShortlistValues {
  const widest = [...choices.configurations].sort((a, b) => b.longestBaselineM - a.longestBaselineM)[0];
  const band = choices.bands[0];
  return {
    target: "",
    ra: "",
    dec: "",
    band: band ? String(band.id) : "",
    config: widest ? String(widest.id) : "",
    baseline: "",
    date: today.toISOString().slice(0, 10),
    minElevation: String(choices.site.minElevationDeg),
    maxDistance: "10",
    minVis2: "0.8",
    maxMagDiff: "",
    bandLimit: "",
    targetMag: "",
    limit: "20",
  };
}
