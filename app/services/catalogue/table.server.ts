/**
 * The catalogue's reference rows (`catalogue_stars`, decision 009), loaded at migrate time from the same
 * package files as the in-memory catalogue, idempotently: when `catalogue_editions` already records this
 * package version with the same counts and the table holds that many rows, nothing is written; otherwise
 * every star is upserted and stars the data no longer carry are deleted, in one transaction.
 */
import { readFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { count, eq, inArray, sql } from "drizzle-orm";
import type { Database } from "~/db/client.server";
import { catalogueEditions, catalogueStars } from "~/db/schema/catalogue";
import { describeStar, type StarCatalogue } from "~/engine";
import { catalogueDataDir, loadCatalogue } from "./data.server";

/** The package the data come from. */
export const CATALOGUE_SOURCE = "d3-celestial";

/** Rows per INSERT statement (each column goes as one array parameter). */
const CHUNK = 10_000;
/** Joins a star's designations for the statement; no designation contains it. */
const SEPARATOR = "\u001f";

/** The installed package's version, read from its package.json. */
export function catalogueVersion(): string {
  const pkg = JSON.parse(readFileSync(join(dirname(catalogueDataDir()), "package.json"), "utf8")) as {
    version?: unknown;
  };
  return typeof pkg.version === "string" ? pkg.version : "unknown";
}

/** One table row per catalogue row. */
export function catalogueRows(catalogue: StarCatalogue): (typeof catalogueStars.$inferInsert)[] {
  const rows: (typeof catalogueStars.$inferInsert)[] = new Array(catalogue.size);
  for (let row = 0; row < catalogue.size; row++) {
    const { hip, hd, name, designations, raDeg, decDeg, vMag, bv } = describeStar(catalogue, row);
    rows[row] = { hip, hd, name, designations, raDeg, decDeg, vMag, bv, variability: catalogue.variability[row] };
  }
  return rows;
}

export type CatalogueLoad = { written: boolean; stars: number; removed: number; version: string };

/**
 * Makes `catalogue_stars` hold the installed package's stars (see the file comment). Returns whether
 * anything was written, the number of stars and of rows removed.
 */
export async function loadCatalogueTable(
  db: Database,
  catalogue: StarCatalogue = loadCatalogue(),
  version = catalogueVersion(),
): Promise<CatalogueLoad> {
  const { stars, nameRecords, namedStars } = catalogue.counts;
  const [edition] = await db.select().from(catalogueEditions).where(eq(catalogueEditions.source, CATALOGUE_SOURCE));
  const [{ n }] = await db.select({ n: count() }).from(catalogueStars);
  const same =
    edition &&
    edition.version === version &&
    edition.stars === stars &&
    edition.nameRecords === nameRecords &&
    edition.namedStars === namedStars;
  if (same && n === stars) return { written: false, stars, removed: 0, version };

  const rows = catalogueRows(catalogue);
  return db.transaction(async (tx) => {
    for (let i = 0; i < rows.length; i += CHUNK) {
      const part = rows.slice(i, i + CHUNK);
      const column = <K extends keyof (typeof part)[number]>(k: K) => sql.param(part.map((r) => r[k] ?? null));
      // One statement per chunk: the columns as arrays, unnested into rows (designations joined by a
      // separator no designation contains).
      await tx.execute(sql`
        insert into ${catalogueStars} (hip, hd, name, designations, ra_deg, dec_deg, v_mag, bv, variability)
        select hip, hd, name, string_to_array(designations, ${SEPARATOR}), ra_deg, dec_deg, v_mag, bv, variability
        from unnest(${column("hip")}::int[], ${column("hd")}::int[], ${column("name")}::text[],
                    ${sql.param(part.map((r) => (r.designations ?? []).join(SEPARATOR)))}::text[],
                    ${column("raDeg")}::float8[], ${column("decDeg")}::float8[], ${column("vMag")}::float8[],
                    ${column("bv")}::float8[], ${column("variability")}::int2[])
          as s(hip, hd, name, designations, ra_deg, dec_deg, v_mag, bv, variability)
        on conflict (hip) do update set
          hd = excluded.hd, name = excluded.name, designations = excluded.designations, ra_deg = excluded.ra_deg,
          dec_deg = excluded.dec_deg, v_mag = excluded.v_mag, bv = excluded.bv, variability = excluded.variability
        where (${catalogueStars}.hd, ${catalogueStars}.name, ${catalogueStars}.designations, ${catalogueStars}.ra_deg,
               ${catalogueStars}.dec_deg, ${catalogueStars}.v_mag, ${catalogueStars}.bv, ${catalogueStars}.variability)
          is distinct from (excluded.hd, excluded.name, excluded.designations, excluded.ra_deg, excluded.dec_deg,
                            excluded.v_mag, excluded.bv, excluded.variability)`);
    }
    // Stars the data no longer carry (an upgraded package): usually none.
    const keep = new Set(catalogue.hip);
    const gone = (await tx.select({ hip: catalogueStars.hip }).from(catalogueStars))
      .map((r) => r.hip)
      .filter((hip) => !keep.has(hip));
    for (let i = 0; i < gone.length; i += CHUNK) {
      await tx.delete(catalogueStars).where(inArray(catalogueStars.hip, gone.slice(i, i + CHUNK)));
    }
    const values = { version, stars, nameRecords, namedStars, loadedAt: new Date() };
    await tx
      .insert(catalogueEditions)
      .values({ source: CATALOGUE_SOURCE, ...values })
      .onConflictDoUpdate({ target: catalogueEditions.source, set: values });
    return { written: true, stars, removed: gone.length, version };
  });
}
