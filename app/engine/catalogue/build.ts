/**
 * The star catalogue in memory: positions, V magnitudes and B−V colours in typed arrays, one row per star,
 * plus the designations of the named stars and the name index (names-index.ts).
 *
 * Input: the two JSON documents of the bundled star data, already parsed —
 *  - stars: a GeoJSON FeatureCollection, one Point feature per star, `id` = Hipparcos number,
 *    `properties.mag` = V, `properties.bv` = B−V as a string ("" when unknown),
 *    `geometry.coordinates` = [RA in degrees −180…180, Dec in degrees], equinox and epoch J2000;
 *  - names: an object keyed by Hipparcos number with `name`, `bayer` (Greek or Latin letter, with a
 *    component digit), `flam`, `var`, `gl`, `hd`, `c` (constellation abbreviation).
 * The data carry no proper motions, parallaxes or photometric errors, and no magnitudes but V and B−V.
 */
import { float64Arrays } from "../arrays";
import { DEG_TO_RAD } from "../math";
import { constellationByAbbr } from "./constellations";
import { greekAbbr, greekSymbol } from "./designations";
import { buildNameIndex, type NameIndex } from "./names-index";

/** Variability flag of a star: none, a variable-star designation, or a suspected variable (NSV). */
export const VARIABILITY = { none: 0, variable: 1, suspected: 2 } as const;

/** Designations of one star, in display form. */
export interface StarNames {
  /** Proper name(s) as given, e.g. ["Betelgeuse"]. */
  proper: string[];
  /** Bayer designation, e.g. "α Ori", "κ1 Cen", "c Psc". */
  bayer: string | null;
  /** Flamsteed designation, e.g. "58 Ori". */
  flamsteed: string | null;
  /** Variable-star designation, e.g. "CG And", "V822 Cas". */
  variable: string | null;
  /** Henry Draper number, e.g. "HD 39801". */
  hd: string | null;
  /** Nearby-star catalogue designation, e.g. "GJ 4.2A". */
  gliese: string | null;
  /** Parts of the Bayer designation for the index: letter key ("alf", "kap1", "c") and typed case. */
  bayerKey: { prefix: string; cased: string; abbr: string } | null;
  /** IAU abbreviation of the constellation, when the data give a known one. */
  constellation: string | null;
}

export interface StarCatalogue {
  /** Number of stars (rows). */
  size: number;
  /** Hipparcos number per row. */
  hip: Int32Array;
  /** J2000 right ascension, radians in [0, 2π). */
  raRad: Float64Array;
  /** J2000 declination, radians. */
  decRad: Float64Array;
  /** Unit vector toward the star (J2000 equatorial), for angular distances. */
  unitX: Float64Array;
  unitY: Float64Array;
  unitZ: Float64Array;
  /** V magnitude. */
  vMag: Float64Array;
  /** B−V colour, magnitudes; NaN when the data give none. */
  bv: Float64Array;
  /** VARIABILITY flag per row. */
  variability: Uint8Array;
  /** Designations of the named rows, by row. */
  names: ReadonlyMap<number, StarNames>;
  /** Row of a Hipparcos number, −1 when it is not in the catalogue. */
  rowOfHip: (hip: number) => number;
  /** Exact and fuzzy name index. */
  index: NameIndex;
  /** What was read: stars, name records, name records matched to a star. */
  counts: { stars: number; nameRecords: number; namedStars: number };
}

function fail(message: string): never {
  throw new Error(`star data: ${message}`);
}

const text = (v: unknown): string => (typeof v === "string" ? v.replace(/\s+/g, " ").trim() : "");

/** Variable designation in display form: "V0822" → "V822"; other forms as given. */
function variableDisplay(v: string): string {
  const m = /^V0*(\d+)$/.exec(v);
  return m ? `V${m[1]}` : v;
}

function parseNames(record: Record<string, unknown>): StarNames {
  const abbr = constellationByAbbr(text(record.c))?.abbr ?? null;
  const bayerRaw = text(record.bayer);
  const flam = text(record.flam);
  const variable = text(record.var);
  const hd = text(record.hd);
  const gl = text(record.gl);
  let bayer: string | null = null;
  let bayerKey: StarNames["bayerKey"] = null;
  const greek = /^(\p{Script=Greek})(\d?)$/u.exec(bayerRaw);
  const latin = /^([A-Za-z])(\d?)$/.exec(bayerRaw);
  if (abbr && greek) {
    const g = greekAbbr(greek[1]);
    if (g) {
      bayer = `${greekSymbol(g)}${greek[2]} ${abbr}`;
      bayerKey = { prefix: g + greek[2], cased: g + greek[2], abbr };
    }
  } else if (abbr && latin) {
    bayer = `${bayerRaw} ${abbr}`;
    bayerKey = { prefix: bayerRaw.toLowerCase(), cased: bayerRaw, abbr };
  }
  // Suspected variables (NSV numbers) are flagged through `variability` only: the data split their numbers.
  let variableName: string | null = null;
  if (variable.startsWith("NSV")) variableName = null;
  else if (abbr && variable && variable !== bayerRaw) variableName = `${variableDisplay(variable)} ${abbr}`;
  else if (abbr && variable) variableName = bayer;
  return {
    proper: text(record.name) ? [text(record.name)] : [],
    bayer,
    flamsteed: abbr && /^\d+$/.test(flam) ? `${Number(flam)} ${abbr}` : null,
    variable: variableName,
    hd: /^HD \d+$/.test(hd) ? hd : null,
    gliese: gl || null,
    bayerKey,
    constellation: abbr,
  };
}

/**
 * Builds the catalogue from the parsed star and name documents.
 * @throws Error naming the first malformed record (the data ship with the app, so this is a packaging fault)
 */
export function buildCatalogue(starsJson: unknown, namesJson: unknown): StarCatalogue {
  const features = (starsJson as { features?: unknown })?.features;
  if (!Array.isArray(features)) fail("the star document has no features array");
  if (typeof namesJson !== "object" || namesJson === null) fail("the name document is not an object");
  const n = features.length;
  const hip = new Int32Array(n);
  const [raRad, decRad, unitX, unitY, unitZ, vMag, bv] = float64Arrays(7, n);
  const variability = new Uint8Array(n);
  const rows = new Map<number, number>();
  for (let i = 0; i < n; i++) {
    const f = features[i] as { id?: unknown; properties?: { mag?: unknown; bv?: unknown }; geometry?: unknown };
    const coords = (f?.geometry as { coordinates?: unknown })?.coordinates;
    if (!Number.isInteger(f?.id) || !Array.isArray(coords) || typeof f.properties?.mag !== "number") {
      fail(`feature ${i} lacks an integer id, coordinates or a magnitude`);
    }
    const [raDeg, decDeg] = coords as number[];
    if (!Number.isFinite(raDeg) || !Number.isFinite(decDeg)) fail(`feature ${i} has non-numeric coordinates`);
    hip[i] = f.id as number;
    raRad[i] = (raDeg < 0 ? raDeg + 360 : raDeg) * DEG_TO_RAD;
    decRad[i] = decDeg * DEG_TO_RAD;
    const cd = Math.cos(decRad[i]);
    unitX[i] = cd * Math.cos(raRad[i]);
    unitY[i] = cd * Math.sin(raRad[i]);
    unitZ[i] = Math.sin(decRad[i]);
    vMag[i] = f.properties.mag as number;
    const colour = typeof f.properties.bv === "string" ? f.properties.bv.trim() : "";
    bv[i] = colour === "" ? Number.NaN : Number(colour);
    rows.set(hip[i], i);
  }
  const names = new Map<number, StarNames>();
  const records = Object.entries(namesJson as Record<string, unknown>);
  for (const [key, record] of records) {
    const row = rows.get(Number(key));
    if (row === undefined || typeof record !== "object" || record === null) continue;
    const parsed = parseNames(record as Record<string, unknown>);
    names.set(row, parsed);
    const v = text((record as Record<string, unknown>).var);
    if (v) variability[row] = v.startsWith("NSV") ? VARIABILITY.suspected : VARIABILITY.variable;
  }
  const base = { size: n, hip, raRad, decRad, unitX, unitY, unitZ, vMag, bv, variability, names };
  return {
    ...base,
    rowOfHip: (h: number) => rows.get(h) ?? -1,
    index: buildNameIndex(base),
    counts: { stars: n, nameRecords: records.length, namedStars: names.size },
  };
}

/** The preferred display name of a row: proper name, Bayer, Flamsteed, variable, HD, else "HIP n". */
export function displayName(catalogue: Pick<StarCatalogue, "names" | "hip">, row: number): string {
  const s = catalogue.names.get(row);
  return s?.proper[0] ?? s?.bayer ?? s?.flamsteed ?? s?.variable ?? s?.hd ?? `HIP ${catalogue.hip[row]}`;
}

/** Every designation of a row, display form: proper names, Bayer, Flamsteed, variable, HD, GJ, HIP. */
export function designationsOf(catalogue: Pick<StarCatalogue, "names" | "hip">, row: number): string[] {
  const s = catalogue.names.get(row);
  const list = s ? [...s.proper, s.bayer, s.flamsteed, s.variable, s.hd, s.gliese] : [];
  list.push(`HIP ${catalogue.hip[row]}`);
  return Array.from(new Set(list.filter((x): x is string => x !== null && x !== "")));
}
