import { routeArgs, settle, testDb } from "@test/routes";
import { beforeAll, describe, expect, it } from "vitest";
import { ensureSite, ensureStations, seedDemoScenario } from "~/db/seed/factories.server";
import { loader as sketchLoader } from "~/routes/sketch/sketchpad";
import { loader as trianglesLoader } from "~/routes/sketch/triangles";
import { findUserByEmail } from "~/services/auth/accounts.server";
import { createSession } from "~/services/auth/sessions.server";
import { createTarget } from "~/services/targets/targets.server";

let proposer = "";
let scheduler = "";

beforeAll(async () => {
  await seedDemoScenario(testDb());
  const ines = await findUserByEmail(testDb(), "ines.arroyo@valle-alto.example");
  proposer = `fd_session=${(await createSession(testDb(), ines!.id, { method: "sso" })).token}`;
  const mei = await findUserByEmail(testDb(), "mei.chao@sierra-lumbre.example");
  scheduler = `fd_session=${(await createSession(testDb(), mei!.id, { method: "sso" })).token}`;
  await createTarget(testDb(), ines!.id, {
    name: "Lumbre Nova 12",
    raDeg: 84.05,
    decDeg: -1.2,
    model: { type: "uniformDisk", diameterMas: 3 },
    magnitudes: {},
    notes: "",
  });
});

describe("Sketchpad and Triangle finder pages", () => {
  it("give the registry and, to a proposer, their own targets", async () => {
    const page = await sketchLoader(routeArgs("/sketchpad", { headers: { Cookie: proposer } }));
    expect(page.loaded?.registry.stations).toHaveLength(24);
    expect(page.loaded?.registry.configurations.map((c) => c.name).sort()).toEqual([
      "compact-3",
      "extended-6",
      "medium-4",
    ]);
    expect(page.savedTargets.map((t) => t.name)).toEqual(["Lumbre Nova 12"]);
  });

  it("give no target list to a role without one", async () => {
    const page = await trianglesLoader(routeArgs("/triangles", { headers: { Cookie: scheduler } }));
    expect(page.loaded?.registry.site.name).toBe("Sierra Lumbre Array");
    expect(page.savedTargets).toEqual([]);
  });

  it("send anonymous visitors to sign in", async () => {
    const res = await settle(() => sketchLoader(routeArgs("/sketchpad?ra=1")));
    expect(res.status).toBe(302);
    expect(res.headers.get("Location")).toBe("/sign-in?next=%2Fsketchpad%3Fra%3D1");
  });

  it("answer 404 with a reason for a site without instruments", async () => {
    const bare = await ensureSite(testDb(), {
      name: "Bare Mesa",
      latitudeDeg: 10,
      longitudeDeg: 20,
      altitudeM: 100,
      minElevationDeg: 20,
      delayLineStrokeM: 50,
    });
    await ensureStations(testDb(), bare.id, [
      { name: "B1", eastM: 0, northM: 0, upM: 0, pathOffsetM: 0 },
      { name: "B2", eastM: 20, northM: 0, upM: 0, pathOffsetM: 0 },
    ]);
    const res = await settle(() =>
      sketchLoader(routeArgs("/sketchpad?site=Bare%20Mesa", { headers: { Cookie: proposer } })),
    );
    expect(res.status).toBe(404);
    expect(await res.text()).toContain("at least two stations and one instrument band");
  });
});
