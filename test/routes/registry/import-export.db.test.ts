import { routeArgs, testDb } from "@test/routes";
import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { configurations, sites, stations } from "~/db/schema/array";
import { loader as exportLoader } from "~/routes/registry/export";
import { action as importAction } from "~/routes/registry/import";
import { MAX_IMPORT_BYTES } from "~/services/registry/upload";
import { flashOf, multipart, run, seedAndSignIn, smallSite, stationByName } from "./support";

let demoSiteId: number;

beforeAll(async () => {
  demoSiteId = await seedAndSignIn();
});

describe("import", () => {
  const HEADER = "name,eastM,northM,upM,pathOffsetM\n";
  /** The administrator posts the import form. */
  const importing = (fields: Record<string, string | File>) =>
    run(() => importAction(multipart("/registry/import", "admin", fields)));
  /** Previews a station import into a site. */
  const previewStations = (siteId: number, fields: Record<string, string | File> = {}) =>
    importing({ intent: "preview", kind: "stations", siteId: String(siteId), ...fields });

  /** Previews an uploaded file, or applies text as the preview's apply form carries it. */
  async function importStations(
    siteId: number,
    text: string,
    intent: "preview" | "apply",
    extra: Record<string, string> = {},
  ) {
    const payload: Record<string, string | File> =
      intent === "preview" ? { file: new File([text], "stations.csv", { type: "text/csv" }) } : { content: text };
    return importing({ intent, kind: "stations", siteId: String(siteId), ...payload, ...extra });
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
    const applied = await importing({
      intent: "apply",
      kind: "stations",
      siteId: String(site.id),
      content: preview.data.content,
    });
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
          : await importing({
              intent,
              kind: "stations",
              siteId: String(site.id),
              content: text,
            });
      expect(out.status).toBe(400);
      // B2 is on line 3 of the file (the header on line 1).
      expect(out.data.errors).toEqual(["row 3, eastM: must be a number"]);
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
    const applied = await importing({
      intent: "apply",
      kind: "stations",
      siteId: String(site.id),
      content: text,
      removeMissing: "on",
    });
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
    const odd = await importing({
      intent: "erase",
      kind: "stations",
      siteId: String(site.id),
      content: HEADER,
    });
    expect(odd.status).toBe(400);
    expect(odd.data.errors).toEqual(["Unknown action."]);
    const noSite = await importing({
      intent: "preview",
      kind: "stations",
      content: `${HEADER}A1,0,0,0,0\n`,
    });
    expect(noSite.data.errors).toEqual(["Choose the site the stations belong to."]);
  });

  it("reads JSON as well, and refuses empty, oversized and non-UTF-8 files with a message", async () => {
    const site = await smallSite("Valle Json");
    const json = JSON.stringify([{ name: "J1", eastM: 1, northM: 2, upM: 0, pathOffsetM: 0 }]);
    const file = new File([json], "stations.json", { type: "application/json" });
    const ok = await previewStations(site.id, { file });
    expect(ok.data.stations.counts.new).toBe(1);

    const empty = await previewStations(site.id, { file: new File([], "empty.csv") });
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
    const notUtf8 = await previewStations(site.id, { file: latin1 });
    expect(notUtf8.data.errors).toEqual(["The file is not UTF-8 text; save it as UTF-8 and try again."]);

    const huge = new File([new Uint8Array(MAX_IMPORT_BYTES + 100_000).fill(0x41)], "huge.csv");
    const tooBig = await previewStations(site.id, { file: huge });
    expect(tooBig.status).toBe(413);
    expect(tooBig.data.errors).toEqual(["The file is larger than the limit of 1 MB; split it into smaller files."]);

    const nothing = await previewStations(site.id);
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
    const same = await importing({ intent: "preview", kind: "registry", content: text });
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
    const applied = await importing({ intent: "apply", kind: "registry", content: JSON.stringify(file) });
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
    const refused = await importing({ intent: "apply", kind: "registry", content: JSON.stringify(file) });
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
