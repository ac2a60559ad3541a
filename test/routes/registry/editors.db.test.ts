import { routeArgs, testDb } from "@test/routes";
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { bands, configurationStations, configurations, instruments, sites, stations } from "~/db/schema/array";
import { ensureConfiguration } from "~/db/seed/factories.server";
import { action as bandEditAction } from "~/routes/registry/bands/edit";
import { action as bandNewAction } from "~/routes/registry/bands/new";
import { action as configEditAction } from "~/routes/registry/configurations/edit";
import { action as configNewAction, loader as configNewLoader } from "~/routes/registry/configurations/new";
import { loader as exportLoader } from "~/routes/registry/export";
import { action as importAction, loader as importLoader } from "~/routes/registry/import";
import { action as instrumentEditAction } from "~/routes/registry/instruments/edit";
import { action as instrumentNewAction } from "~/routes/registry/instruments/new";
import { loader as overviewLoader } from "~/routes/registry/overview";
import { action as siteEditAction, loader as siteEditLoader } from "~/routes/registry/sites/edit";
import { action as siteNewAction, loader as siteNewLoader } from "~/routes/registry/sites/new";
import { action as stationEditAction, loader as stationEditLoader } from "~/routes/registry/stations/edit";
import { action as stationNewAction, loader as stationNewLoader } from "~/routes/registry/stations/new";
import { loader as stationLoader } from "~/routes/registry/stations/station";
import {
  bandFields,
  countOf,
  flashOf,
  get,
  multipart,
  type Outcome,
  post,
  remove,
  rowByName,
  run,
  save,
  seedAndSignIn,
  smallSite,
  stationByName,
  stationFields,
} from "./support";

let demoSiteId: number;

beforeAll(async () => {
  demoSiteId = await seedAndSignIn();
});

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
              { intent: "delete", confirm: "yes", confirmName: "Sierra Lumbre Array" },
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

    const unconfirmed = await remove(siteEditAction, path, params, { confirmName: "mesa" });
    expect(unconfirmed.status).toBe(400);
    expect(unconfirmed.data.errors.confirmName).toBe("type the site's name, Mesa Borrar, to confirm");
    expect(await stationByName(site.id, "A1")).not.toBeNull();

    const deleted = await remove(siteEditAction, path, params, { confirmName: "Mesa Borrar" });
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
    const stray = await save(stationNewAction, "/registry/stations/new", {
      siteId: "99999999999",
      ...stationFields("Q1", "1", "1", "0", "0"),
    });
    expect(stray.status).toBe(400);
    expect(stray.data.errors.form).toBe("the site was not found; it may have been deleted");
  });
});

describe("stations", () => {
  it("adds a valid station; refuses bad values and a taken name, writing nothing", async () => {
    const before = await countOf(stations);
    const bad = await save(stationNewAction, "/registry/stations/new", {
      siteId: String(demoSiteId),
      ...stationFields("", "abc", "12,5", "0", ""),
    });
    expect(bad.status).toBe(400);
    expect(bad.data.errors).toEqual({
      name: "is required",
      eastM: "must be a number",
      northM: "must be a number with a point for decimals (12.5, not 12,5)",
      pathOffsetM: "is required",
    });
    expect(bad.data.values).toMatchObject({ eastM: "abc", northM: "12,5" });
    const taken = await save(stationNewAction, "/registry/stations/new", {
      siteId: String(demoSiteId),
      ...stationFields("C01", "1", "2", "0", "0"),
    });
    expect(taken.status).toBe(400);
    expect(taken.data.errors).toEqual({ name: "C01 is already a station at Sierra Lumbre Array" });
    expect(await countOf(stations)).toBe(before);

    const ok = await save(stationNewAction, "/registry/stations/new", {
      siteId: String(demoSiteId),
      ...stationFields("W9", "-48.5", "60", "0.3", "7.25"),
    });
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
    const bad = await save(stationEditAction, path, stationFields("A3", "0", "25000", "0.5", "2"), params);
    expect(bad.status).toBe(400);
    expect(bad.data.errors).toEqual({ northM: "must be between -20000 and 20000 m" });
    const clash = await save(stationEditAction, path, stationFields("A1", "0", "10", "0.5", "2"), params);
    expect(clash.data.errors).toEqual({ name: "A1 is already a station at Llano Editar" });
    expect(await stationByName(site.id, "A3")).toMatchObject({ northM: 10 });

    const ok = await save(stationEditAction, path, stationFields("A3b", "1", "11", "0.5", "2.5"), params);
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
    const refused = await remove(stationEditAction, `/registry/stations/${c04.id}/edit`, { stationId: String(c04.id) });
    expect(refused.status).toBe(409);
    expect(refused.data.deleteRefused).toBe(
      "C04 cannot be deleted while a configuration uses it: compact-3. Take it out of it first.",
    );
    expect(await stationByName(demoSiteId, "C04")).not.toBeNull();

    const x01 = (await stationByName(demoSiteId, "X01"))!;
    const many = await remove(stationEditAction, `/registry/stations/${x01.id}/edit`, { stationId: String(x01.id) });
    expect(many.data.deleteRefused).toBe(
      "X01 cannot be deleted while configurations use it: extended-6, medium-4. Take it out of them first.",
    );

    const site = await smallSite("Llano Borrar");
    const a4 = (await stationByName(site.id, "A4"))!;
    // A delete not confirmed in the dialog is refused, and nothing goes.
    const unconfirmed = await remove(
      stationEditAction,
      `/registry/stations/${a4.id}/edit`,
      { stationId: String(a4.id) },
      { confirm: "" },
    );
    expect(unconfirmed.status).toBe(400);
    expect(unconfirmed.data.formError ?? JSON.stringify(unconfirmed.data)).toContain(
      "Confirm the deletion in the dialog.",
    );
    expect(await stationByName(site.id, "A4")).not.toBeNull();
    const gone = await remove(stationEditAction, `/registry/stations/${a4.id}/edit`, { stationId: String(a4.id) });
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
    expect(await rowByName(configurations, site.id, "tri")).toBeNull();

    const ok = await run(() =>
      configNewAction(post("/registry/configurations/new", "admin", { ...base, stations: "A3, A1 A2" })),
    );
    expect(ok.status).toBe(302);
    // Three stations, but the only instrument combines two: saved, with a note.
    expect(await flashOf(ok)).toEqual({
      kind: "info",
      text: "Configuration tri added. Note: no instrument combines more than 2 telescopes, and it has 3.",
    });
    const config = (await rowByName(configurations, site.id, "tri"))!;
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
    const pair = (await rowByName(configurations, site.id, "pair"))!;
    const params = { configurationId: String(pair.id) };
    const path = `/registry/configurations/${pair.id}/edit`;
    const clash = await save(configEditAction, path, { name: "other", stations: "A1 A2" }, params);
    expect(clash.data.errors).toEqual({ name: "other is already a configuration at Pampa Edit" });

    const ok = await save(
      configEditAction,
      path,
      { name: "pair", description: "swapped", stations: "A2 A1 A4" },
      params,
    );
    expect(ok.status).toBe(302);
    const [after] = await testDb().select().from(configurations).where(eq(configurations.id, pair.id));
    expect(after).toMatchObject({ description: "swapped", offered: false });

    const gone = await remove(configEditAction, path, params);
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
    const bad = await save(instrumentNewAction, "/registry/instruments/new", {
      siteId: String(demoSiteId),
      name: "Chispa",
      maxTelescopes: "1",
    });
    expect(bad.status).toBe(400);
    expect(bad.data.errors).toEqual({ maxTelescopes: "must be between 2 and 50" });
    expect(await countOf(instruments)).toBe(before);

    const ok = await save(instrumentNewAction, "/registry/instruments/new", {
      siteId: String(demoSiteId),
      name: "Chispa",
      description: "visible",
      maxTelescopes: "4",
    });
    expect(ok.status).toBe(302);
    const chispa = (await rowByName(instruments, demoSiteId, "Chispa"))!;
    expect(ok.location).toBe(`/registry/instruments/${chispa.id}/edit`);

    const params = { instrumentId: String(chispa.id) };
    const newBand = (fields: Record<string, string>) =>
      save(bandNewAction, `/registry/instruments/${chispa.id}/bands/new`, fields, params);
    const badBand = await newBand(bandFields("R", "0.65", "0.1", "0", "x"));
    expect(badBand.status).toBe(400);
    expect(badBand.data.errors).toEqual({
      channels: "must be between 1 and 100000",
      limitingMagnitude: "must be a number",
    });
    const wide = await newBand(bandFields("R", "0.65", "1.5", "4", "5"));
    expect(wide.data.errors).toEqual({
      bandwidthUm: "must be less than twice the central wavelength (the band's short edge would fall below zero)",
    });
    expect(await testDb().select().from(bands).where(eq(bands.instrumentId, chispa.id))).toEqual([]);

    const band = await newBand(bandFields("R", "0.65", "0.1", "4", "5.5"));
    expect(band.status).toBe(302);
    const [r] = await testDb().select().from(bands).where(eq(bands.instrumentId, chispa.id));
    expect(r).toMatchObject({
      name: "R",
      centralWavelengthM: 0.65e-6,
      bandwidthM: 0.1e-6,
      channels: 4,
      limitingMagnitude: 5.5,
    });

    const twice = await newBand(bandFields("R", "0.7", "0.1", "4", "5"));
    expect(twice.data.errors).toEqual({ name: "Chispa already has a band named R" });

    const edited = await save(
      bandEditAction,
      `/registry/bands/${r.id}/edit`,
      bandFields("R", "0.66", "0.12", "5", "6"),
      { bandId: String(r.id) },
    );
    expect(edited.status).toBe(302);
    expect((await testDb().select().from(bands).where(eq(bands.id, r.id)))[0]).toMatchObject({
      centralWavelengthM: 0.66e-6,
      bandwidthM: 0.12e-6,
      channels: 5,
    });
    const badEdit = await save(bandEditAction, `/registry/bands/${r.id}/edit`, bandFields("", "-1", "0.12", "5", "6"), {
      bandId: String(r.id),
    });
    expect(badEdit.data.errors).toEqual({
      name: "is required",
      centralWavelengthUm: "must be greater than 0 and at most 1000 µm",
    });

    const renamed = await save(
      instrumentEditAction,
      `/registry/instruments/${chispa.id}/edit`,
      { name: "Brasa", maxTelescopes: "4" },
      params,
    );
    expect(renamed.data.errors).toEqual({ name: "Brasa is already an instrument at this site" });

    const bandGone = await remove(bandEditAction, `/registry/bands/${r.id}/edit`, { bandId: String(r.id) });
    expect(bandGone.status).toBe(302);
    expect(await testDb().select().from(bands).where(eq(bands.id, r.id))).toEqual([]);

    await newBand(bandFields("I", "0.8", "0.1", "4", "5"));
    const gone = await remove(instrumentEditAction, `/registry/instruments/${chispa.id}/edit`, params);
    expect(gone.status).toBe(302);
    expect(await testDb().select().from(instruments).where(eq(instruments.id, chispa.id))).toEqual([]);
    expect(await testDb().select().from(bands).where(eq(bands.instrumentId, chispa.id))).toEqual([]);
  });
});
