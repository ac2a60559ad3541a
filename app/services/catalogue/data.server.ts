/**
 * Loads the bundled star catalogue for the server and the command line: reads the two data files of the installed
 * d3-celestial package (stars to V = 8, and star names) and builds the engine's in-memory catalogue once
 * per process. Data only — nothing of the package's code is loaded.
 */
import { readFileSync } from "node:fs";
import { createRequire } from "node:module";
import { dirname, join } from "node:path";
import { buildCatalogue, type StarCatalogue } from "~/engine";

/** Folder of the package's data files. */
export function catalogueDataDir(): string {
  const require = createRequire(import.meta.url);
  return join(dirname(require.resolve("d3-celestial/package.json")), "data");
}

/** The two parsed JSON documents, for the engine's buildCatalogue. */
export function readCatalogueJson(): { stars: unknown; names: unknown } {
  const dir = catalogueDataDir();
  return {
    stars: JSON.parse(readFileSync(join(dir, "stars.8.json"), "utf8")),
    names: JSON.parse(readFileSync(join(dir, "starnames.json"), "utf8")),
  };
}

let cached: StarCatalogue | null = null;

/** The catalogue, built on first use and kept for the life of the process. */
export function loadCatalogue(): StarCatalogue {
  if (!cached) {
    const { stars, names } = readCatalogueJson();
    cached = buildCatalogue(stars, names);
  }
  return cached;
}
