import { routeArgs, testDb } from "@test/routes";
import { describe, expect, it } from "vitest";
import { seedDemoScenario } from "~/db/seed/factories.server";
import { loader as homeLoader } from "~/routes/home/index";
import { loader as notFoundLoader } from "~/routes/not-found";
import { loader as registryLoader } from "~/routes/registry/overview";

describe("public pages", () => {
  it("home shows an empty array before the seed, then the demo array", async () => {
    const before = await homeLoader(routeArgs("/"));
    expect(before.array).toBeNull();
    await seedDemoScenario(testDb());
    const after = await homeLoader(routeArgs("/"));
    expect(after.array?.name).toBe("Sierra Lumbre Array");
    expect(after.array?.stations).toBe(24);
    expect(after.array?.configurations.map((c) => c.size).sort()).toEqual([3, 4, 6]);
  });

  it("registry lists stations, configurations with ordered stations, and bands", async () => {
    await seedDemoScenario(testDb());
    const { registry } = await registryLoader(routeArgs("/registry"));
    expect(registry?.stations).toHaveLength(24);
    const compact = registry?.configurations.find((c) => c.name === "compact-3");
    expect(compact?.stationNames).toEqual(["C04", "C10", "C17"]);
    const bands = registry?.instruments.flatMap((i) => i.bands.map((b) => b.name)).sort();
    expect(bands).toEqual(["H", "K", "N"]);
  });

  it("unknown addresses answer 404", async () => {
    let thrown: unknown;
    try {
      notFoundLoader(routeArgs("/no/such/page"));
    } catch (e) {
      thrown = e;
    }
    expect((thrown as { init?: { status?: number } }).init?.status).toBe(404);
  });
});
