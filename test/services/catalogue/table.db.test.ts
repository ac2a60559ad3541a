/**
 * The catalogue's reference rows, loaded at migrate time (the test template is migrated and loaded as
 * `npm run db:migrate` does): every star of the installed package's data, counted independently from
 * the raw JSON files here, and an idempotent reload.
 */
import { readFileSync } from "node:fs";
import { createRequire } from "node:module";
import { dirname, join } from "node:path";
import { testDb } from "@test/routes";
import { count, eq, inArray } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { catalogueEditions, catalogueStars } from "~/db/schema/catalogue";
import { loadCatalogueTable } from "~/services/catalogue/table.server";

const pkgDir = dirname(createRequire(import.meta.url).resolve("d3-celestial/package.json"));
const stars = JSON.parse(readFileSync(join(pkgDir, "data", "stars.8.json"), "utf8")) as {
  features: { id: number; properties: { mag: number; bv: string }; geometry: { coordinates: [number, number] } }[];
};
const names = JSON.parse(readFileSync(join(pkgDir, "data", "starnames.json"), "utf8")) as Record<string, unknown>;
const version = (JSON.parse(readFileSync(join(pkgDir, "package.json"), "utf8")) as { version: string }).version;

const starCount = () => testDb().select({ n: count() }).from(catalogueStars);

describe("catalogue_stars", () => {
  it("holds every star of the package's stars.8.json, and records the edition with the counts read", async () => {
    const [{ n }] = await starCount();
    expect(n).toBe(stars.features.length);
    const hips = new Set(stars.features.map((f) => f.id));
    const [edition] = await testDb().select().from(catalogueEditions);
    expect(edition).toMatchObject({
      source: "d3-celestial",
      version,
      stars: stars.features.length,
      nameRecords: Object.keys(names).length,
      namedStars: Object.keys(names).filter((k) => hips.has(Number(k))).length,
    });
  });

  it("keeps each star's position, V and B−V as the data give them (degrees 0–360)", async () => {
    const byHip = new Map(stars.features.map((f) => [f.id, f]));
    // Three bright stars, the file's first star and its first star without B−V.
    const noColour = stars.features.find((f) => f.properties.bv.trim() === "")!.id;
    const picked = [27989, 32349, 71683, stars.features[0].id, noColour];
    const rows = await testDb().select().from(catalogueStars).where(inArray(catalogueStars.hip, picked));
    expect(rows).toHaveLength(5);
    for (const r of rows) {
      const f = byHip.get(r.hip)!;
      const [ra, dec] = f.geometry.coordinates;
      expect(r.raDeg).toBeCloseTo(ra < 0 ? ra + 360 : ra, 6);
      expect(r.decDeg).toBeCloseTo(dec, 6);
      expect(r.vMag).toBe(f.properties.mag);
      expect(r.bv).toBe(f.properties.bv.trim() === "" ? null : Number(f.properties.bv));
    }
    // starnames.json, HIP 27989: Betelgeuse, Bayer α, Flamsteed 58, Orion, HD 39801.
    const betelgeuse = rows.find((r) => r.hip === 27989)!;
    expect(betelgeuse).toMatchObject({ name: "Betelgeuse", hd: 39801 });
    expect(betelgeuse.designations).toEqual(["Betelgeuse", "α Ori", "58 Ori", "HD 39801", "HIP 27989"]);
  });

  it("loads again without writing, and repairs rows that drifted from the data", async () => {
    expect((await loadCatalogueTable(testDb())).written).toBe(false);

    // A changed value, a star the data do not carry, and a forgotten edition: the next load fixes all three.
    await testDb().update(catalogueStars).set({ vMag: 99 }).where(eq(catalogueStars.hip, 27989));
    await testDb().insert(catalogueStars).values({ hip: 9_999_999, name: "Nobody", raDeg: 1, decDeg: 1, vMag: 9 });
    await testDb().delete(catalogueEditions);
    const load = await loadCatalogueTable(testDb());
    expect(load).toMatchObject({ written: true, stars: stars.features.length, removed: 1, version });
    const [{ n }] = await starCount();
    expect(n).toBe(stars.features.length);
    const [row] = await testDb().select().from(catalogueStars).where(eq(catalogueStars.hip, 27989));
    expect(row.vMag).toBe(0.45);
    expect((await loadCatalogueTable(testDb())).written).toBe(false);
  });
});
