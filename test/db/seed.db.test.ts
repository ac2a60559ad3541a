import { testDb } from "@test/routes";
import { eq, sql } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { configurationStations, configurations, sites, stations } from "~/db/schema/array";
import { userRoles, users } from "~/db/schema/users";
import { isEmpty, seedDemoScenario } from "~/db/seed/factories.server";
import { DEMO_PEOPLE } from "~/db/seed/scenario";

describe("demo seed", () => {
  it("starts from an empty, migrated database", async () => {
    expect(await isEmpty(testDb())).toBe(true);
  });

  it("creates the Sierra Lumbre Array with its 24 stations", async () => {
    const db = testDb();
    await seedDemoScenario(db);
    const [site] = await db.select().from(sites);
    expect(site.name).toBe("Sierra Lumbre Array");
    // PRODUCT.md demo scenario: latitude -31.40°, longitude -68.90°, 2450 m, min elevation 30°, a stroke of
    // 100–200 m (200 m: issue 10 asks that every configuration observe a zenith target ≥ 4 h around transit).
    expect([site.latitudeDeg, site.longitudeDeg, site.altitudeM, site.minElevationDeg, site.delayLineStrokeM]).toEqual([
      -31.4, -68.9, 2450, 30, 200,
    ]);
    const rows = await db.select().from(stations).where(eq(stations.siteId, site.id));
    expect(rows).toHaveLength(24);
    const core = rows.filter((s) => s.name.startsWith("C"));
    const outriggers = rows.filter((s) => s.name.startsWith("X"));
    expect(core).toHaveLength(18);
    expect(outriggers).toHaveLength(6);
    // Core on a triangular grid of 16 m: every core station has a neighbour exactly 16 m away.
    for (const s of core) {
      const nearest = Math.min(
        ...core.filter((o) => o !== s).map((o) => Math.hypot(o.eastM - s.eastM, o.northM - s.northM)),
      );
      expect(nearest).toBeCloseTo(16, 2);
    }
    // Outriggers 110–330 m from the core centre.
    for (const o of outriggers) {
      const r = Math.hypot(o.eastM, o.northM);
      expect(r).toBeGreaterThanOrEqual(110 - 1e-6);
      expect(r).toBeLessThanOrEqual(330 + 1e-6);
    }
  });

  it("gives configurations of 3, 4 and 6 stations that all exist at the site", async () => {
    const db = testDb();
    await seedDemoScenario(db);
    const configs = await db.select().from(configurations);
    const sizes: number[] = [];
    for (const c of configs) {
      const members = await db
        .select({ siteId: stations.siteId })
        .from(configurationStations)
        .innerJoin(stations, eq(stations.id, configurationStations.stationId))
        .where(eq(configurationStations.configurationId, c.id));
      expect(members.every((m) => m.siteId === c.siteId)).toBe(true);
      sizes.push(members.length);
    }
    expect(sizes.sort()).toEqual([3, 4, 6]);
  });

  it("is idempotent and gives every demo person their roles", async () => {
    const db = testDb();
    await seedDemoScenario(db);
    await seedDemoScenario(db);
    const [{ n }] = await db.select({ n: sql<number>`count(*)::int` }).from(stations);
    expect(n).toBe(24);
    const people = await db.select().from(users);
    expect(people).toHaveLength(DEMO_PEOPLE.length);
    const roles = await db.select().from(userRoles);
    const held = new Set(roles.map((r) => r.role));
    expect([...held].sort()).toEqual(["admin", "chair", "proposer", "reviewer", "scheduler"]);
    expect(await isEmpty(db)).toBe(false);
  });

  it("refuses a second station with the same name at the same site", async () => {
    const db = testDb();
    await seedDemoScenario(db);
    const [site] = await db.select().from(sites);
    await expect(db.insert(stations).values({ siteId: site.id, name: "C01", eastM: 1, northM: 1 })).rejects.toThrow();
  });
});
