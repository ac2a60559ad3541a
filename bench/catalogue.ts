/**
 * Star-catalogue benchmark: reading and parsing the two bundled data files, building the in-memory
 * catalogue (typed arrays and name index), one name lookup of each kind, and the calibrator shortlist
 * for 20 targets (the budgets: lookup ≤ 50 ms, 20 shortlists ≤ 1 s in total).
 * Also the server's side of the name field (`GET /api/stars`: suggestions and the resolved star), and, when
 * DATABASE_URL points at a migrated database, the reference table's load at migrate time (no-op, a repair
 * pass comparing every row, a load into the emptied table — the table is left loaded) and the primary-key
 * read of "Add as calibrator".
 * Run alone with `npx tsx bench/catalogue.ts`.
 */
import { fileURLToPath } from "node:url";
import { eq, sql } from "drizzle-orm";
import { createDatabase } from "../app/db/client.server";
import { catalogueEditions, catalogueStars } from "../app/db/schema/catalogue";
import {
  buildCatalogue,
  type CalibratorsInput,
  lookupStar,
  parseCalibratorsRequest,
  type StarCatalogue,
  shortlistCalibrators,
} from "../app/engine";
import { readCatalogueJson } from "../app/services/catalogue/data.server";
import { starSuggestions } from "../app/services/catalogue/lookup.server";
import { loadCatalogueTable } from "../app/services/catalogue/table.server";

import { machine, type Timing, time } from "./timing";

/** Twenty bright targets of the January night sky at the demo site. */
const TARGETS = [
  "Betelgeuse",
  "Sirius",
  "Canopus",
  "Rigel",
  "Procyon",
  "Achernar",
  "Aldebaran",
  "Capella",
  "Pollux",
  "Regulus",
  "Castor",
  "Bellatrix",
  "Alnilam",
  "Alphard",
  "Adhara",
  "Wezen",
  "Menkalinan",
  "Miaplacidus",
  "Avior",
  "Suhail",
];

function requests(): CalibratorsInput[] {
  return TARGETS.map((name) => {
    const parsed = parseCalibratorsRequest({
      target: { name },
      wavelengthM: 1.65e-6,
      longestBaselineM: 160,
      site: { latitudeDeg: -31.4, longitudeDeg: -68.9, altitudeM: 2450 },
      date: "2027-01-10",
      minElevationDeg: 30,
    });
    if (!parsed.ok) throw new Error(parsed.message);
    return parsed.value;
  });
}

const LOOKUPS: [string, string][] = [
  ["catalogue number", "HD 39801"],
  ["Bayer, Greek name and genitive", "Alpha Orionis"],
  ["Flamsteed", "58 Ori"],
  ["proper name", "Betelgeuse"],
  ["typo", "Betelgeuze"],
  ["unknown, with suggestions", "Zorgon Prime"],
];

async function timeAsync(fn: () => Promise<unknown>, runs: number, warmup = 1): Promise<Timing> {
  for (let i = 0; i < warmup; i++) await fn();
  const t: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    await fn();
    t.push(performance.now() - t0);
  }
  t.sort((a, b) => a - b);
  const mid = t.length >> 1;
  const medianMs = t.length % 2 ? t[mid] : 0.5 * (t[mid - 1] + t[mid]);
  // Awaited work is mostly the database's: the process's own CPU time is not measured here.
  return { medianMs, minMs: t[0], cpuMedianMs: Number.NaN, runs };
}

/** The table's load and read in the database of DATABASE_URL; null when there is none to reach. */
async function benchTable(cat: StarCatalogue): Promise<[string, Timing][] | null> {
  const url = process.env.DATABASE_URL;
  if (!url) return null;
  const { db, client } = createDatabase(url, { max: 1 });
  try {
    await db.execute(sql`select 1 from catalogue_stars limit 1`);
  } catch {
    await client.end();
    return null;
  }
  try {
    await loadCatalogueTable(db, cat);
    const noop = await timeAsync(() => loadCatalogueTable(db, cat), 5);
    const repair = await timeAsync(
      async () => {
        await db.delete(catalogueEditions);
        await loadCatalogueTable(db, cat);
      },
      3,
      0,
    );
    const fresh = await timeAsync(
      async () => {
        await db.execute(sql`truncate ${catalogueStars}`);
        await db.delete(catalogueEditions);
        await loadCatalogueTable(db, cat);
      },
      3,
      0,
    );
    const read = await timeAsync(() => db.select().from(catalogueStars).where(eq(catalogueStars.hip, 27919)), 201, 20);
    return [
      ["migrate-time load, already loaded (no-op)", noop],
      ["migrate-time load, every row compared, none changed", repair],
      ["migrate-time load into the emptied table (41 411 rows)", fresh],
      ["one star by Hipparcos number (Add as calibrator)", read],
    ];
  } finally {
    await client.end();
  }
}

/** The markdown section of the benchmark report. */
export async function benchCatalogue(): Promise<string> {
  const lines: string[] = [];
  const log = (s = "") => lines.push(s);
  const read = time(() => readCatalogueJson(), 5);
  const json = readCatalogueJson();
  const build = time(() => buildCatalogue(json.stars, json.names), 5);
  const cat: StarCatalogue = buildCatalogue(json.stars, json.names);
  const reqs = requests();
  const shortlist = time(() => {
    for (const r of reqs) if (!shortlistCalibrators(cat, r).ok) throw new Error("shortlist failed");
  }, 7);
  const listed = reqs.map((r) => {
    const res = shortlistCalibrators(cat, r);
    return res.ok ? res.value.calibrators.length : 0;
  });
  const ms = (t: Timing) => `${t.medianMs.toFixed(2)} ms`;
  const min = (t: Timing) => `${t.minMs.toFixed(2)} ms`;

  log("## Star catalogue");
  log("");
  log(`- Machine: ${machine()}`);
  log(`- ${cat.size.toLocaleString("en-US")} stars, ${cat.counts.namedStars.toLocaleString("en-US")} named`);
  log("");
  log("| step | median | min | runs |");
  log("| --- | ---: | ---: | ---: |");
  log(`| read and parse the two JSON files | ${ms(read)} | ${min(read)} | ${read.runs} |`);
  log(`| build the catalogue (typed arrays + name index) | ${ms(build)} | ${min(build)} | ${build.runs} |`);
  for (const [what, text] of LOOKUPS) {
    const t = time(() => lookupStar(cat, text), 201, 20);
    log(`| lookup: ${what} ("${text}") | ${ms(t)} | ${min(t)} | ${t.runs} |`);
  }
  log(`| shortlist for 20 targets, total (budget 1 s) | ${ms(shortlist)} | ${min(shortlist)} | ${shortlist.runs} |`);
  for (const text of ["betel", "Alpha Orionis", "Lumbre Nova 12"]) {
    const t = time(() => starSuggestions(text), 201, 20);
    log(`| name field (GET /api/stars): "${text}" | ${ms(t)} | ${min(t)} | ${t.runs} |`);
  }
  const table = await benchTable(cat);
  if (table) for (const [what, t] of table) log(`| PostgreSQL: ${what} | ${ms(t)} | ${min(t)} | ${t.runs} |`);
  else log("| PostgreSQL: not measured (no DATABASE_URL with the catalogue table) | | | |");
  log("");
  log(
    `Shortlists: H band, 160 m, 2027-01-10 at the demo site, defaults (10°, V² ≥ 0.8, 20 entries); ` +
      `entries listed per target: ${listed.join(", ")}.`,
  );
  return lines.join("\n");
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  benchCatalogue().then((md) => process.stdout.write(`${md}\n`));
}
