/**
 * The bundled star data for the catalogue tests, read straight from the installed package's files (the
 * same two files the command line loads), and the catalogue built from them once per test file.
 */
import { readFileSync } from "node:fs";
import { createRequire } from "node:module";
import { dirname, join } from "node:path";
import { buildCatalogue, type StarCatalogue } from "~/engine";

const dir = join(dirname(createRequire(import.meta.url).resolve("d3-celestial/package.json")), "data");

/** Raw text of stars.8.json and starnames.json. */
export const rawStars = readFileSync(join(dir, "stars.8.json"), "utf8");
export const rawNames = readFileSync(join(dir, "starnames.json"), "utf8");

let built: StarCatalogue | null = null;

export function catalogue(): StarCatalogue {
  built ??= buildCatalogue(JSON.parse(rawStars), JSON.parse(rawNames));
  return built;
}
