/**
 * Star-catalogue benchmark: reading and parsing the two bundled data files, building the in-memory
 * catalogue (typed arrays and name index), one name lookup of each kind, and the calibrator shortlist
 * for 20 targets (the budgets: lookup ≤ 50 ms, 20 shortlists ≤ 1 s in total).
 * Run alone with `npx tsx bench/catalogue.ts`.
 */
import { fileURLToPath } from "node:url";
import {
  buildCatalogue,
  type CalibratorsInput,
  lookupStar,
  parseCalibratorsRequest,
  type StarCatalogue,
  shortlistCalibrators,
} from "../app/engine";
import { readCatalogueJson } from "../app/services/catalogue/data.server";
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
