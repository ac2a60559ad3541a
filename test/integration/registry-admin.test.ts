import { cookiesFrom, formPost, routeArgs, testDb } from "@test/routes";
import { and, count, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { bands, configurationStations, configurations, instruments, sites, stations } from "~/db/schema/array";
import {
  ensureConfiguration,
  ensureInstrument,
  ensureSite,
  ensureStations,
  seedDemoScenario,
} from "~/db/seed/factories.server";
import { readFlash } from "~/lib/flash.server";
import { loader as exportLoader } from "~/routes/api/registry-export";
import { action as bandEditAction } from "~/routes/registry/band-edit";
import { action as bandNewAction } from "~/routes/registry/band-new";
import { action as configEditAction } from "~/routes/registry/configuration-edit";
import { action as configNewAction, loader as configNewLoader } from "~/routes/registry/configuration-new";
import { action as importAction, loader as importLoader } from "~/routes/registry/import";
import { action as instrumentEditAction } from "~/routes/registry/instrument-edit";
import { action as instrumentNewAction } from "~/routes/registry/instrument-new";
import { loader as overviewLoader } from "~/routes/registry/overview";
import { action as siteEditAction, loader as siteEditLoader } from "~/routes/registry/site-edit";
import { action as siteNewAction, loader as siteNewLoader } from "~/routes/registry/site-new";
import { loader as stationLoader } from "~/routes/registry/station";
import { action as stationEditAction, loader as stationEditLoader } from "~/routes/registry/station-edit";
import { action as stationNewAction, loader as stationNewLoader } from "~/routes/registry/station-new";
import { findUserByEmail } from "~/services/auth/accounts.server";
import { createSession } from "~/services/auth/sessions.server";
import { MAX_IMPORT_BYTES } from "~/services/registry/io";

type Who = "admin" | "proposer" | "anonymous";
type Outcome = { status: number; location: string | null; data: any; response: Response | null };

const cookie: Record<Who, Record<string, string>> = { admin: {}, proposer: {}, anonymous: {} };
let demoSiteId: number;

beforeAll(async () => {
  await seedDemoScenario(testDb());
  for (const [who, email] of [
    ["admin", "rafael.quispe@sierra-lumbre.example"],
    ["proposer", "ines.arroyo@valle-alto.example"],
  ] as const) {
    const user = (await findUserByEmail(testDb(), email))!;
    const { token } = await createSession(testDb(), user.id, { method: "sso" });
    cookie[who] = { Cookie: `fd_session=${token}` };
  }
  demoSiteId = (await testDb().select().from(sites).where(eq(sites.name, "Sierra Lumbre Array")))[0].id;
});

/** Runs a loader or action and reports what came back, returned or thrown. */
async function run(fn: () => unknown): Promise<Outcome> {
  const judge = (out: unknown): Outcome => {
    if (out instanceof Response)
      return { status: out.status, location: out.headers.get("Location"), data: null, response: out };
    if (out && typeof out === "object" && "init" in out && "data" in out) {
      const d = out as { data: unknown; init: { status?: number } | null };
      return { status: d.init?.status ?? 200, location: null, data: d.data, response: null };
    }
    return { status: 200, location: null, data: out, response: null };
  };
  try {
    return judge(await fn());
  } catch (e) {
    return judge(e);
  }
}

const post = (path: string, who: Who, fields: Record<string, string | string[]>, params: Record<string, string> = {}) =>
  routeArgs(path, { ...formPost(fields, cookie[who]), params });
const get = (path: string, who: Who, params: Record<string, string> = {}) =>
  routeArgs(path, { headers: cookie[who], params });

function multipart(path: string, who: Who, fields: Record<string, string | File>) {
  const body = new FormData();
  for (const [k, val] of Object.entries(fields)) body.append(k, val);
  return routeArgs(path, { method: "POST", body, headers: cookie[who] });
}

async function flashOf(outcome: Outcome) {
  const request = new Request("http://localhost:3000/", { headers: { Cookie: cookiesFrom(outcome.response!) } });
  return (await readFlash(request)).flash;
}

async function stationByName(siteId: number, name: string) {
  const [row] = await testDb()
    .select()
    .from(stations)
    .where(and(eq(stations.siteId, siteId), eq(stations.name, name)));
  return row ?? null;
}

async function countOf(
  table: typeof stations | typeof sites | typeof configurations | typeof instruments | typeof bands,
) {
  const [row] = await testDb().select({ n: count() }).from(table);
  return row.n;
}

/** A small site of its own, so tests that change things do not disturb each other. */
async function smallSite(name: string) {
  const site = await ensureSite(testDb(), {
    name,
    latitudeDeg: 10,
    longitudeDeg: 20,
    altitudeM: 100,
    minElevationDeg: 20,
    delayLineStrokeM: 50,
    timeZone: "UTC",
  });
  await ensureStations(testDb(), site.id, [
    { name: "A1", eastM: 0, northM: 0, upM: 0, pathOffsetM: 0 },
    { name: "A2", eastM: 10, northM: 0, upM: 0, pathOffsetM: 1 },
    { name: "A3", eastM: 0, northM: 10, upM: 0.5, pathOffsetM: 2 },
    { name: "A4", eastM: 30, northM: 30, upM: 0, pathOffsetM: 3 },
  ]);
  await ensureConfiguration(testDb(), site.id, { name: "pair", stations: ["A1", "A2"] });
  await ensureInstrument(testDb(), site.id, {
    name: "Duo",
    maxTelescopes: 2,
    bands: [{ name: "J", centralWavelengthM: 1.25e-6, channels: 3, bandwidthM: 0.2e-6, limitingMagnitude: 6 }],
  });
  return site;
}

const goodSite = {
  intent: "save",
  name: "Cerro Prueba",
  latitudeDeg: "-24.6",
  longitudeDeg: "-70.4",
  altitudeM: "2635",
  minElevationDeg: "25",
  delayLineStrokeM: "120",
  timeZone: "America/Santiago",
};

describe("who may edit the registry", () => {
  const editing: [string, () => Promise<Outcome>, () => Promise<Outcome>][] = [
    [
      "new site",
      () => run(() => siteNewLoader(get("/registry/sites/new", "proposer"))),
      () => run(() => siteNewAction(post("/registry/sites/new", "anonymous", goodSite))),
    ],
    [
      "edit site",
      () =>
        run(() =>
          siteEditLoader(get(`/registry/sites/${demoSiteId}/edit`, "proposer", { siteId: String(demoSiteId) })),
        ),
      () =>
        run(() =>
          siteEditAction(
            post(
              `/registry/sites/${demoSiteId}/edit`,
              "anonymous",
              { intent: "delete", confirmName: "Sierra Lumbre Array" },
              { siteId: String(demoSiteId) },
            ),
          ),
        ),
    ],
    [
      "new station",
      () =>
        run(() =>
          stationNewAction(
            post("/registry/stations/new", "proposer", {
              siteId: String(demoSiteId),
              name: "Z1",
              eastM: "1",
              northM: "1",
              upM: "0",
              pathOffsetM: "0",
            }),
          ),
        ),
      () => run(() => stationNewLoader(get("/registry/stations/new", "anonymous"))),
    ],
    [
      "new configuration",
      () =>
        run(() =>
          configNewAction(
            post("/registry/configurations/new", "proposer", {
              siteId: String(demoSiteId),
              name: "x",
              stations: "C01 C02",
            }),
          ),
        ),
      () => run(() => configNewLoader(get("/registry/configurations/new", "anonymous"))),
    ],
    [
      "import",
      () =>
        run(() =>
          importAction(
            multipart("/registry/import", "proposer", {
              intent: "preview",
              kind: "stations",
              siteId: String(demoSiteId),
              content: "name,eastM,northM,upM,pathOffsetM\nZ2,0,0,0,0\n",
            }),
          ),
        ),
      () => run(() => importLoader(get("/registry/import", "anonymous"))),
    ],
  ];
  for (const [what, asProposer, asAnonymous] of editing) {
    it(`${what}: a proposer gets 403 and an anonymous visitor is sent to sign in`, async () => {
      const before = await countOf(stations);
      expect((await asProposer()).status).toBe(403);
      const anon = await asAnonymous();
      expect(anon.status).toBe(302);
      expect(anon.location).toMatch(/^\/sign-in\?next=/);
      expect(await countOf(stations)).toBe(before);
      expect(await stationByName(demoSiteId, "Z1")).toBeNull();
      expect(await stationByName(demoSiteId, "Z2")).toBeNull();
    });
  }

  it("shows edit controls to administrators only, while everyone reads the registry", async () => {
    expect((await overviewLoader(get("/registry", "admin"))).canEdit).toBe(true);
    expect((await overviewLoader(get("/registry", "proposer"))).canEdit).toBe(false);
    const anonymous = await overviewLoader(get("/registry", "anonymous"));
    expect(anonymous.canEdit).toBe(false);
    expect(anonymous.registry?.stations).toHaveLength(24);
  });
});

describe("site", () => {
  it("adds a valid site and refuses a bad one field by field, keeping what was typed", async () => {
    const before = await countOf(sites);
    const bad = await run(() =>
      siteNewAction(
        post("/registry/sites/new", "admin", {
          ...goodSite,
          latitudeDeg: "95",
          longitudeDeg: "east",
          minElevationDeg: "-5",
          delayLineStrokeM: "0",
          timeZone: "Mars/Olympus",
        }),
      ),
    );
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.data.errors).sort()).toEqual([
      "delayLineStrokeM",
      "latitudeDeg",
      "longitudeDeg",
      "minElevationDeg",
      "timeZone",
    ]);
    expect(bad.data.errors.latitudeDeg).toBe("must be between -90 and 90 °");
    expect(bad.data.values.longitudeDeg).toBe("east");
    expect(await countOf(sites)).toBe(before);

    const ok = await run(() => siteNewAction(post("/registry/sites/new", "admin", goodSite)));
    expect(ok.status).toBe(302);
    const [row] = await testDb().select().from(sites).where(eq(sites.name, "Cerro Prueba"));
    expect(row).toMatchObject({
      latitudeDeg: -24.6,
      longitudeDeg: -70.4,
      altitudeM: 2635,
      minElevationDeg: 25,
      delayLineStrokeM: 120,
      timeZone: "America/Santiago",
    });
    expect(ok.location).toBe(`/registry?site=${row.id}`);

    const twice = await run(() => siteNewAction(post("/registry/sites/new", "admin", goodSite)));
    expect(twice.status).toBe(400);
    expect(twice.data.errors.name).toBe("a site named Cerro Prueba already exists");
  });

  it("edits a site, and deletes it with everything at it only when its name is typed", async () => {
    const site = await smallSite("Mesa Borrar");
    const params = { siteId: String(site.id) };
    const path = `/registry/sites/${site.id}/edit`;
    const bad = await run(() =>
      siteEditAction(post(path, "admin", { ...goodSite, name: "Mesa Borrar", minElevationDeg: "91" }, params)),
    );
    expect(bad.status).toBe(400);
    expect(bad.data.errors).toEqual({ minElevationDeg: "must be between 0 and 90 °" });
    expect((await testDb().select().from(sites).where(eq(sites.id, site.id)))[0].minElevationDeg).toBe(20);

    const saved = await run(() =>
      siteEditAction(post(path, "admin", { ...goodSite, name: "Mesa Borrar", minElevationDeg: "35" }, params)),
    );
    expect(saved.status).toBe(302);
    expect((await testDb().select().from(sites).where(eq(sites.id, site.id)))[0].minElevationDeg).toBe(35);

    const unconfirmed = await run(() =>
      siteEditAction(post(path, "admin", { intent: "delete", confirmName: "mesa" }, params)),
    );
    expect(unconfirmed.status).toBe(400);
    expect(unconfirmed.data.errors.confirmName).toBe("type the site's name, Mesa Borrar, to confirm");
    expect(await stationByName(site.id, "A1")).not.toBeNull();

    const deleted = await run(() =>
      siteEditAction(post(path, "admin", { intent: "delete", confirmName: "Mesa Borrar" }, params)),
    );
    expect(deleted.status).toBe(302);
    expect(await testDb().select().from(sites).where(eq(sites.id, site.id))).toEqual([]);
    expect(await testDb().select().from(stations).where(eq(stations.siteId, site.id))).toEqual([]);
    expect(await testDb().select().from(instruments).where(eq(instruments.siteId, site.id))).toEqual([]);
  });

  it("answers 404, never 500, for ids that do not exist or do not fit", async () => {
    for (const siteId of ["999999", "abc", "99999999999", "-1", "1.5"]) {
      expect((await run(() => siteEditLoader(get(`/registry/sites/${siteId}/edit`, "admin", { siteId })))).status).toBe(
        404,
      );
    }
    expect(
      (await run(() => stationLoader(get("/registry/stations/99999999999", "anonymous", { stationId: "99999999999" }))))
        .status,
    ).toBe(404);
    expect((await run(() => overviewLoader(get("/registry?site=99999999999", "anonymous")))).status).toBe(404);
    const exported = await exportLoader(
      routeArgs("/registry/export/stations.csv?site=99999999999", { params: { file: "stations.csv" } }),
    );
    expect(exported.status).toBe(404);
    const stray = await run(() =>
      stationNewAction(
        post("/registry/stations/new", "admin", {
          intent: "save",
          siteId: "99999999999",
          name: "Q1",
          eastM: "1",
          northM: "1",
          upM: "0",
          pathOffsetM: "0",
        }),
      ),
    );
    expect(stray.status).toBe(400);
    expect(stray.data.errors.form).toBe("the site was not found; it may have been deleted");
  });
});

describe("stations", () => {
  it("adds a valid station; refuses bad values and a taken name, writing nothing", async () => {
    const before = await countOf(stations);
    const bad = await run(() =>
      stationNewAction(
        post("/registry/stations/new", "admin", {
          intent: "save",
          siteId: String(demoSiteId),
          name: "",
          eastM: "abc",
          northM: "12,5",
          upM: "0",
          pathOffsetM: "",
        }),
      ),
    );
    expect(bad.status).toBe(400);
    expect(bad.data.errors).toEqual({
      name: "is required",
      eastM: "must be a number",
      northM: "must be a number with a point for decimals (12.5, not 12,5)",
      pathOffsetM: "is required",
    });
    expect(bad.data.values).toMatchObject({ eastM: "abc", northM: "12,5" });
    const taken = await run(() =>
      stationNewAction(
        post("/registry/stations/new", "admin", {
          intent: "save",
          siteId: String(demoSiteId),
          name: "C01",
          eastM: "1",
          northM: "2",
          upM: "0",
          pathOffsetM: "0",
        }),
      ),
    );
    expect(taken.status).toBe(400);
    expect(taken.data.errors).toEqual({ name: "C01 is already a station at Sierra Lumbre Array" });
    expect(await countOf(stations)).toBe(before);

    const ok = await run(() =>
      stationNewAction(
        post("/registry/stations/new", "admin", {
          intent: "save",
          siteId: String(demoSiteId),
          name: "W9",
          eastM: "-48.5",
          northM: "60",
          upM: "0.3",
          pathOffsetM: "7.25",
        }),
      ),
    );
    expect(ok.status).toBe(302);
    expect(ok.location).toBe(`/registry?site=${demoSiteId}`);
    expect((await flashOf(ok))?.text).toBe("Station W9 added.");
    expect(await stationByName(demoSiteId, "W9")).toMatchObject({
      eastM: -48.5,
      northM: 60,
      upM: 0.3,
      pathOffsetM: 7.25,
    });
    const page = await stationLoader(
      get("/registry/stations/x", "anonymous", { stationId: String((await stationByName(demoSiteId, "W9"))!.id) }),
    );
    expect(page.station.name).toBe("W9");
    expect(page.canEdit).toBe(false);
  });

  it("edits a station, refusing a bad value or a name another station has", async () => {
    const site = await smallSite("Llano Editar");
    const a3 = (await stationByName(site.id, "A3"))!;
    const params = { stationId: String(a3.id) };
    const path = `/registry/stations/${a3.id}/edit`;
    const bad = await run(() =>
      stationEditAction(
        post(
          path,
          "admin",
          { intent: "save", name: "A3", eastM: "0", northM: "25000", upM: "0.5", pathOffsetM: "2" },
          params,
        ),
      ),
    );
    expect(bad.status).toBe(400);
    expect(bad.data.errors).toEqual({ northM: "must be between -20000 and 20000 m" });
    const clash = await run(() =>
      stationEditAction(
        post(
          path,
          "admin",
          { intent: "save", name: "A1", eastM: "0", northM: "10", upM: "0.5", pathOffsetM: "2" },
          params,
        ),
      ),
    );
    expect(clash.data.errors).toEqual({ name: "A1 is already a station at Llano Editar" });
    expect(await stationByName(site.id, "A3")).toMatchObject({ northM: 10 });

    const ok = await run(() =>
      stationEditAction(
        post(
          path,
          "admin",
          { intent: "save", name: "A3b", eastM: "1", northM: "11", upM: "0.5", pathOffsetM: "2.5" },
          params,
        ),
      ),
    );
    expect(ok.status).toBe(302);
    expect(ok.location).toBe(`/registry/stations/${a3.id}`);
    expect(await stationByName(site.id, "A3b")).toMatchObject({ id: a3.id, eastM: 1, northM: 11, pathOffsetM: 2.5 });
  });

  it("refuses to delete a station a configuration uses, naming the configurations; deletes an unused one", async () => {
    const c04 = (await stationByName(demoSiteId, "C04"))!;
    const edit = await stationEditLoader(
      get(`/registry/stations/${c04.id}/edit`, "admin", { stationId: String(c04.id) }),
    );
    expect(edit.usedBy).toEqual(["compact-3"]);
    const refused = await run(() =>
      stationEditAction(
        post(`/registry/stations/${c04.id}/edit`, "admin", { intent: "delete" }, { stationId: String(c04.id) }),
      ),
    );
    expect(refused.status).toBe(409);
    expect(refused.data.deleteRefused).toBe(
      "C04 cannot be deleted while a configuration uses it: compact-3. Take it out of it first.",
    );
    expect(await stationByName(demoSiteId, "C04")).not.toBeNull();

    const x01 = (await stationByName(demoSiteId, "X01"))!;
    const many = await run(() =>
      stationEditAction(
        post(`/registry/stations/${x01.id}/edit`, "admin", { intent: "delete" }, { stationId: String(x01.id) }),
      ),
    );
    expect(many.data.deleteRefused).toBe(
      "X01 cannot be deleted while configurations use it: extended-6, medium-4. Take it out of them first.",
    );

    const site = await smallSite("Llano Borrar");
    const a4 = (await stationByName(site.id, "A4"))!;
    const gone = await run(() =>
      stationEditAction(
        post(`/registry/stations/${a4.id}/edit`, "admin", { intent: "delete" }, { stationId: String(a4.id) }),
      ),
    );
    expect(gone.status).toBe(302);
    expect(await stationByName(site.id, "A4")).toBeNull();
  });
});

describe("configurations", () => {
  it("adds a configuration with its stations in order, and refuses too few, repeated or unknown stations", async () => {
    const site = await smallSite("Pampa Config");
    const base = { intent: "save", siteId: String(site.id), name: "tri", description: "three", offered: "on" };
    for (const [stationsText, message] of [
      ["A1", "needs at least 2 stations"],
      ["A1 A2 A1", "lists A1 twice"],
      ["A1, A9, Q7", "A9, Q7 are not stations at Pampa Config"],
    ]) {
      const bad = await run(() =>
        configNewAction(post("/registry/configurations/new", "admin", { ...base, stations: stationsText })),
      );
      expect(bad.status).toBe(400);
      expect(bad.data.errors).toEqual({ stations: message });
      expect(bad.data.values.stations).toBe(stationsText);
    }
    expect(
      await testDb()
        .select()
        .from(configurations)
        .where(and(eq(configurations.siteId, site.id), eq(configurations.name, "tri"))),
    ).toEqual([]);

    const ok = await run(() =>
      configNewAction(post("/registry/configurations/new", "admin", { ...base, stations: "A3, A1 A2" })),
    );
    expect(ok.status).toBe(302);
    // Three stations, but the only instrument combines two: saved, with a note.
    expect(await flashOf(ok)).toEqual({
      kind: "info",
      text: "Configuration tri added. Note: no instrument combines more than 2 telescopes, and it has 3.",
    });
    const [config] = await testDb()
      .select()
      .from(configurations)
      .where(and(eq(configurations.siteId, site.id), eq(configurations.name, "tri")));
    const members = await testDb()
      .select({ name: stations.name, position: configurationStations.position })
      .from(configurationStations)
      .innerJoin(stations, eq(stations.id, configurationStations.stationId))
      .where(eq(configurationStations.configurationId, config.id))
      .orderBy(configurationStations.position);
    expect(members.map((m) => m.name)).toEqual(["A3", "A1", "A2"]);
  });

  it("edits the order and the offered flag, refuses a taken name, and deletes a configuration without its stations", async () => {
    const site = await smallSite("Pampa Edit");
    await ensureConfiguration(testDb(), site.id, { name: "other", stations: ["A3", "A4"] });
    const [pair] = await testDb()
      .select()
      .from(configurations)
      .where(and(eq(configurations.siteId, site.id), eq(configurations.name, "pair")));
    const params = { configurationId: String(pair.id) };
    const path = `/registry/configurations/${pair.id}/edit`;
    const clash = await run(() =>
      configEditAction(post(path, "admin", { intent: "save", name: "other", stations: "A1 A2" }, params)),
    );
    expect(clash.data.errors).toEqual({ name: "other is already a configuration at Pampa Edit" });

    const ok = await run(() =>
      configEditAction(
        post(path, "admin", { intent: "save", name: "pair", description: "swapped", stations: "A2 A1 A4" }, params),
      ),
    );
    expect(ok.status).toBe(302);
    const [after] = await testDb().select().from(configurations).where(eq(configurations.id, pair.id));
    expect(after).toMatchObject({ description: "swapped", offered: false });

    const gone = await run(() => configEditAction(post(path, "admin", { intent: "delete" }, params)));
    expect(gone.status).toBe(302);
    expect(await testDb().select().from(configurations).where(eq(configurations.id, pair.id))).toEqual([]);
    expect(
      await testDb().select().from(configurationStations).where(eq(configurationStations.configurationId, pair.id)),
    ).toEqual([]);
    expect(await stationByName(site.id, "A2")).not.toBeNull();
  });
});

describe("instruments and bands", () => {
  it("adds an instrument, refusing fewer than 2 telescopes; adds bands from µm, stored in metres as typed", async () => {
    const before = await countOf(instruments);
    const bad = await run(() =>
      instrumentNewAction(
        post("/registry/instruments/new", "admin", {
          intent: "save",
          siteId: String(demoSiteId),
          name: "Chispa",
          maxTelescopes: "1",
        }),
      ),
    );
    expect(bad.status).toBe(400);
    expect(bad.data.errors).toEqual({ maxTelescopes: "must be between 2 and 50" });
    expect(await countOf(instruments)).toBe(before);

    const ok = await run(() =>
      instrumentNewAction(
        post("/registry/instruments/new", "admin", {
          intent: "save",
          siteId: String(demoSiteId),
          name: "Chispa",
          description: "visible",
          maxTelescopes: "4",
        }),
      ),
    );
    expect(ok.status).toBe(302);
    const [chispa] = await testDb()
      .select()
      .from(instruments)
      .where(and(eq(instruments.siteId, demoSiteId), eq(instruments.name, "Chispa")));
    expect(ok.location).toBe(`/registry/instruments/${chispa.id}/edit`);

    const params = { instrumentId: String(chispa.id) };
    const badBand = await run(() =>
      bandNewAction(
        post(
          `/registry/instruments/${chispa.id}/bands/new`,
          "admin",
          {
            intent: "save",
            name: "R",
            centralWavelengthUm: "0.65",
            bandwidthUm: "0.1",
            channels: "0",
            limitingMagnitude: "x",
          },
          params,
        ),
      ),
    );
    expect(badBand.status).toBe(400);
    expect(badBand.data.errors).toEqual({
      channels: "must be between 1 and 100000",
      limitingMagnitude: "must be a number",
    });
    const wide = await run(() =>
      bandNewAction(
        post(
          `/registry/instruments/${chispa.id}/bands/new`,
          "admin",
          {
            intent: "save",
            name: "R",
            centralWavelengthUm: "0.65",
            bandwidthUm: "1.5",
            channels: "4",
            limitingMagnitude: "5",
          },
          params,
        ),
      ),
    );
    expect(wide.data.errors).toEqual({
      bandwidthUm: "must be less than twice the central wavelength (the band's short edge would fall below zero)",
    });
    expect(await testDb().select().from(bands).where(eq(bands.instrumentId, chispa.id))).toEqual([]);

    const band = await run(() =>
      bandNewAction(
        post(
          `/registry/instruments/${chispa.id}/bands/new`,
          "admin",
          {
            intent: "save",
            name: "R",
            centralWavelengthUm: "0.65",
            bandwidthUm: "0.1",
            channels: "4",
            limitingMagnitude: "5.5",
          },
          params,
        ),
      ),
    );
    expect(band.status).toBe(302);
    const [r] = await testDb().select().from(bands).where(eq(bands.instrumentId, chispa.id));
    expect(r).toMatchObject({
      name: "R",
      centralWavelengthM: 0.65e-6,
      bandwidthM: 0.1e-6,
      channels: 4,
      limitingMagnitude: 5.5,
    });

    const twice = await run(() =>
      bandNewAction(
        post(
          `/registry/instruments/${chispa.id}/bands/new`,
          "admin",
          {
            intent: "save",
            name: "R",
            centralWavelengthUm: "0.7",
            bandwidthUm: "0.1",
            channels: "4",
            limitingMagnitude: "5",
          },
          params,
        ),
      ),
    );
    expect(twice.data.errors).toEqual({ name: "Chispa already has a band named R" });

    const edited = await run(() =>
      bandEditAction(
        post(
          `/registry/bands/${r.id}/edit`,
          "admin",
          {
            intent: "save",
            name: "R",
            centralWavelengthUm: "0.66",
            bandwidthUm: "0.12",
            channels: "5",
            limitingMagnitude: "6",
          },
          { bandId: String(r.id) },
        ),
      ),
    );
    expect(edited.status).toBe(302);
    expect((await testDb().select().from(bands).where(eq(bands.id, r.id)))[0]).toMatchObject({
      centralWavelengthM: 0.66e-6,
      bandwidthM: 0.12e-6,
      channels: 5,
    });
    const badEdit = await run(() =>
      bandEditAction(
        post(
          `/registry/bands/${r.id}/edit`,
          "admin",
          {
            intent: "save",
            name: "",
            centralWavelengthUm: "-1",
            bandwidthUm: "0.12",
            channels: "5",
            limitingMagnitude: "6",
          },
          { bandId: String(r.id) },
        ),
      ),
    );
    expect(badEdit.data.errors).toEqual({
      name: "is required",
      centralWavelengthUm: "must be greater than 0 and at most 1000 µm",
    });

    const renamed = await run(() =>
      instrumentEditAction(
        post(
          `/registry/instruments/${chispa.id}/edit`,
          "admin",
          { intent: "save", name: "Brasa", maxTelescopes: "4" },
          params,
        ),
      ),
    );
    expect(renamed.data.errors).toEqual({ name: "Brasa is already an instrument at this site" });

    const bandGone = await run(() =>
      bandEditAction(post(`/registry/bands/${r.id}/edit`, "admin", { intent: "delete" }, { bandId: String(r.id) })),
    );
    expect(bandGone.status).toBe(302);
    expect(await testDb().select().from(bands).where(eq(bands.id, r.id))).toEqual([]);

    await run(() =>
      bandNewAction(
        post(
          `/registry/instruments/${chispa.id}/bands/new`,
          "admin",
          {
            intent: "save",
            name: "I",
            centralWavelengthUm: "0.8",
            bandwidthUm: "0.1",
            channels: "4",
            limitingMagnitude: "5",
          },
          params,
        ),
      ),
    );
    const gone = await run(() =>
      instrumentEditAction(post(`/registry/instruments/${chispa.id}/edit`, "admin", { intent: "delete" }, params)),
    );
    expect(gone.status).toBe(302);
    expect(await testDb().select().from(instruments).where(eq(instruments.id, chispa.id))).toEqual([]);
    expect(await testDb().select().from(bands).where(eq(bands.instrumentId, chispa.id))).toEqual([]);
  });
});

describe("import", () => {
  const HEADER = "name,eastM,northM,upM,pathOffsetM\n";

  /** Previews an uploaded file, or applies text as the preview's apply form carries it. */
  async function importStations(
    siteId: number,
    text: string,
    intent: "preview" | "apply",
    extra: Record<string, string> = {},
  ) {
    const payload: Record<string, string | File> =
      intent === "preview" ? { file: new File([text], "stations.csv", { type: "text/csv" }) } : { content: text };
    return run(() =>
      importAction(
        multipart("/registry/import", "admin", {
          intent,
          kind: "stations",
          siteId: String(siteId),
          ...payload,
          ...extra,
        }),
      ),
    );
  }

  it("previews a station CSV as new, updated and unchanged without writing, then applies it in one go", async () => {
    const site = await smallSite("Valle Importar");
    const text = `${HEADER}A1,0,0,0,0\nA2,10.5,0,0,1\nB1,-20,5,0.2,4\n`;
    const preview = await importStations(site.id, text, "preview");
    expect(preview.status).toBe(200);
    expect(preview.data.errors).toEqual([]);
    expect(preview.data.stations.counts).toEqual({ new: 1, updated: 1, unchanged: 1, remove: 0, keep: 2 });
    expect(preview.data.content).toBe(text);
    expect(await stationByName(site.id, "B1")).toBeNull();
    expect(await stationByName(site.id, "A2")).toMatchObject({ eastM: 10 });

    // The apply step posts the text the preview carried.
    const applied = await run(() =>
      importAction(
        multipart("/registry/import", "admin", {
          intent: "apply",
          kind: "stations",
          siteId: String(site.id),
          content: preview.data.content,
        }),
      ),
    );
    expect(applied.status).toBe(302);
    expect((await flashOf(applied))?.text).toBe(
      "Stations imported into Valle Importar: 1 new, 1 updated, 1 unchanged.",
    );
    expect(await stationByName(site.id, "B1")).toMatchObject({ eastM: -20, northM: 5, upM: 0.2, pathOffsetM: 4 });
    expect(await stationByName(site.id, "A2")).toMatchObject({ eastM: 10.5 });
    expect(await stationByName(site.id, "A4")).not.toBeNull();
  });

  it("writes nothing when one row is broken, even when asked to apply, and names the row and column", async () => {
    const site = await smallSite("Valle Roto");
    const text = `${HEADER}A1,1,1,0,0\nB2,abc,0,0,0\nB3,3,3,0,0\n`;
    for (const intent of ["preview", "apply"] as const) {
      const out =
        intent === "preview"
          ? await importStations(site.id, text, intent)
          : await run(() =>
              importAction(
                multipart("/registry/import", "admin", {
                  intent,
                  kind: "stations",
                  siteId: String(site.id),
                  content: text,
                }),
              ),
            );
      expect(out.status).toBe(400);
      expect(out.data.errors).toEqual(["row 2, eastM: must be a number"]);
      expect(out.data.content).toBeNull();
    }
    expect(await stationByName(site.id, "B3")).toBeNull();
    expect(await stationByName(site.id, "A1")).toMatchObject({ eastM: 0 });
  });

  it("removes stations missing from the file only when asked, and never one a configuration uses", async () => {
    const site = await smallSite("Valle Quitar");
    const text = `${HEADER}A3,0,10,0.5,2.5\n`;
    const kept = await importStations(site.id, text, "apply");
    expect(kept.status).toBe(302);
    expect((await flashOf(kept))?.text).toBe("Stations imported into Valle Quitar: 0 new, 1 updated, 0 unchanged.");
    expect(await testDb().select().from(stations).where(eq(stations.siteId, site.id))).toHaveLength(4);

    const preview = await importStations(site.id, text, "preview", { removeMissing: "on" });
    expect(preview.data.stations.lines.map((l: { name: string; change: string }) => [l.name, l.change])).toEqual([
      ["A3", "unchanged"],
      ["A1", "keep"],
      ["A2", "keep"],
      ["A4", "remove"],
    ]);
    expect(preview.data.notices).toEqual(["2 stations missing from the file stay because configurations use them."]);
    const applied = await run(() =>
      importAction(
        multipart("/registry/import", "admin", {
          intent: "apply",
          kind: "stations",
          siteId: String(site.id),
          content: text,
          removeMissing: "on",
        }),
      ),
    );
    expect(applied.status).toBe(302);
    const names = (await testDb().select().from(stations).where(eq(stations.siteId, site.id)))
      .map((s) => s.name)
      .sort();
    expect(names).toEqual(["A1", "A2", "A3"]);
  });

  it("changes nothing when the file matches the registry, and refuses an unknown step", async () => {
    const site = await smallSite("Valle Igual");
    const same = await importStations(site.id, `${HEADER}A1,0,0,0,0\n`, "apply");
    expect(same.status).toBe(302);
    expect(await flashOf(same)).toEqual({ kind: "info", text: "The file matches the registry; nothing was changed." });
    const odd = await run(() =>
      importAction(
        multipart("/registry/import", "admin", {
          intent: "erase",
          kind: "stations",
          siteId: String(site.id),
          content: HEADER,
        }),
      ),
    );
    expect(odd.status).toBe(400);
    expect(odd.data.errors).toEqual(["Unknown action."]);
    const noSite = await run(() =>
      importAction(
        multipart("/registry/import", "admin", {
          intent: "preview",
          kind: "stations",
          content: `${HEADER}A1,0,0,0,0\n`,
        }),
      ),
    );
    expect(noSite.data.errors).toEqual(["Choose the site the stations belong to."]);
  });

  it("reads JSON as well, and refuses empty, oversized and non-UTF-8 files with a message", async () => {
    const site = await smallSite("Valle Json");
    const json = JSON.stringify([{ name: "J1", eastM: 1, northM: 2, upM: 0, pathOffsetM: 0 }]);
    const file = new File([json], "stations.json", { type: "application/json" });
    const ok = await run(() =>
      importAction(
        multipart("/registry/import", "admin", { intent: "preview", kind: "stations", siteId: String(site.id), file }),
      ),
    );
    expect(ok.data.stations.counts.new).toBe(1);

    const empty = await run(() =>
      importAction(
        multipart("/registry/import", "admin", {
          intent: "preview",
          kind: "stations",
          siteId: String(site.id),
          file: new File([], "empty.csv"),
        }),
      ),
    );
    expect(empty.status).toBe(400);
    expect(empty.data.errors).toEqual(["The file is empty."]);

    const latin1 = new File(
      [
        new Uint8Array([
          ...new TextEncoder().encode(HEADER),
          0x4e,
          0xf1,
          0x2c,
          0x31,
          0x2c,
          0x31,
          0x2c,
          0x30,
          0x2c,
          0x30,
        ]),
      ],
      "latin1.csv",
    );
    const notUtf8 = await run(() =>
      importAction(
        multipart("/registry/import", "admin", {
          intent: "preview",
          kind: "stations",
          siteId: String(site.id),
          file: latin1,
        }),
      ),
    );
    expect(notUtf8.data.errors).toEqual(["The file is not UTF-8 text; save it as UTF-8 and try again."]);

    const huge = new File([new Uint8Array(MAX_IMPORT_BYTES + 100_000).fill(0x41)], "huge.csv");
    const tooBig = await run(() =>
      importAction(
        multipart("/registry/import", "admin", {
          intent: "preview",
          kind: "stations",
          siteId: String(site.id),
          file: huge,
        }),
      ),
    );
    expect(tooBig.status).toBe(413);
    expect(tooBig.data.errors).toEqual(["The file is larger than the limit of 1 MB; split it into smaller files."]);

    const nothing = await run(() =>
      importAction(
        multipart("/registry/import", "admin", { intent: "preview", kind: "stations", siteId: String(site.id) }),
      ),
    );
    expect(nothing.data.errors).toEqual(["Choose a file, or paste its text into the box."]);
    expect(await stationByName(site.id, "J1")).toBeNull();
  });

  it("round-trips the whole registry through its JSON export, then applies a changed copy as one transaction", async () => {
    const site = await smallSite("Meseta Todo");
    const exported = await exportLoader(
      routeArgs(`/registry/export/registry.json?site=${site.id}`, { params: { file: "registry.json" } }),
    );
    expect(exported.headers.get("Content-Disposition")).toBe('attachment; filename="meseta-todo-registry.json"');
    const text = await exported.text();
    const same = await run(() =>
      importAction(multipart("/registry/import", "admin", { intent: "preview", kind: "registry", content: text })),
    );
    expect(same.status).toBe(200);
    expect(same.data.registry.counts.stations).toEqual({ new: 0, updated: 0, unchanged: 4, remove: 0, keep: 0 });
    expect(same.data.registry.site.change).toBe("unchanged");

    const file = JSON.parse(text);
    file.site.delayLineStrokeM = 75;
    file.stations.push({ name: "A5", eastM: 40, northM: -5, upM: 0, pathOffsetM: 5 });
    file.configurations.push({ name: "wide", description: "", offered: true, stations: ["A1", "A5"] });
    file.instruments[0].bands.push({
      name: "H",
      centralWavelengthM: 1.65e-6,
      channels: 4,
      bandwidthM: 0.3e-6,
      limitingMagnitude: 6.5,
    });
    const applied = await run(() =>
      importAction(
        multipart("/registry/import", "admin", { intent: "apply", kind: "registry", content: JSON.stringify(file) }),
      ),
    );
    expect(applied.status).toBe(302);
    expect((await testDb().select().from(sites).where(eq(sites.id, site.id)))[0].delayLineStrokeM).toBe(75);
    expect(await stationByName(site.id, "A5")).not.toBeNull();
    expect(
      await testDb()
        .select()
        .from(configurations)
        .where(and(eq(configurations.siteId, site.id), eq(configurations.name, "wide"))),
    ).toHaveLength(1);

    // A broken copy: nothing at all is written, not even the valid parts.
    file.site.delayLineStrokeM = 60;
    file.stations.push({ name: "A6", eastM: 1, northM: 1, upM: 0, pathOffsetM: 0 });
    file.configurations.push({ name: "ghost", stations: ["A1", "Q9"] });
    const refused = await run(() =>
      importAction(
        multipart("/registry/import", "admin", { intent: "apply", kind: "registry", content: JSON.stringify(file) }),
      ),
    );
    expect(refused.status).toBe(400);
    expect(refused.data.errors).toEqual([
      "configurations row 3, stations: Q9 is neither in the file's stations nor at the site",
    ]);
    expect((await testDb().select().from(sites).where(eq(sites.id, site.id)))[0].delayLineStrokeM).toBe(75);
    expect(await stationByName(site.id, "A6")).toBeNull();
  });
});

describe("export", () => {
  it("gives stations as CSV with units in the header, to anybody", async () => {
    const res = await exportLoader(
      routeArgs(`/registry/export/stations.csv?site=${demoSiteId}`, { params: { file: "stations.csv" } }),
    );
    expect(res.status).toBe(200);
    expect(res.headers.get("Content-Disposition")).toBe('attachment; filename="sierra-lumbre-array-stations.csv"');
    expect(res.headers.get("Content-Type")).toBe("text/csv; charset=utf-8");
    const lines = (await res.text()).split("\n");
    expect(lines[0]).toBe("name,eastM,northM,upM,pathOffsetM");
    expect(lines.some((l) => l.startsWith("C01,-16,"))).toBe(true);
  });

  it("answers 404 with the list of exports for an unknown file", async () => {
    const res = await exportLoader(routeArgs("/registry/export/x.pdf", { params: { file: "x.pdf" } }));
    expect(res.status).toBe(404);
    expect(await res.text()).toMatch(/stations\.csv/);
  });
});
