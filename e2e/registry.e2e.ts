import { readFileSync } from "node:fs";
import { join } from "node:path";
import { and, eq, inArray } from "drizzle-orm";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { createDatabase } from "~/db/client.server";
import { sites, stations } from "~/db/schema/array";
import { ARTIFACTS, screenshot, signInAs, useBrowser, watchPage } from "./browser";

const baseUrl = inject("baseUrl");
const NEW_STATIONS = ["W25", "W26"];
const browser = useBrowser();
let db: ReturnType<typeof createDatabase>["db"];
let endDb: () => Promise<unknown>;
let siteId: number;

beforeAll(async () => {
  const handle = createDatabase(inject("databaseUrl"), { max: 2 });
  db = handle.db;
  endDb = () => handle.client.end();
  siteId = (await db.select().from(sites).where(eq(sites.name, "Sierra Lumbre Array")))[0].id;
});

afterAll(async () => {
  // The browser tests share one database: leave the demo registry as it was found.
  await db?.delete(stations).where(and(eq(stations.siteId, siteId), inArray(stations.name, NEW_STATIONS)));
  await endDb?.();
});

async function station(name: string) {
  const [row] = await db
    .select()
    .from(stations)
    .where(and(eq(stations.siteId, siteId), eq(stations.name, name)));
  return row ?? null;
}

type Trace = { name: string; text: string[]; x: (number | null)[]; y: (number | null)[] };

/**
 * The traces Plotly drew in the first plot of the page, once `until` holds for them. The check runs
 * here rather than in the page: the page's security policy forbids evaluating strings as code.
 */
async function plotTraces(page: Page, until: (data: Trace[]) => boolean) {
  const deadline = Date.now() + 20_000;
  for (;;) {
    const data = await page.evaluate(() => {
      const el = document.querySelector(".js-plotly-plot") as
        | (HTMLElement & { data?: { name: string; text?: string[]; x: (number | null)[]; y: (number | null)[] }[] })
        | null;
      return el?.data?.map((t) => ({ name: t.name, text: t.text ?? [], x: t.x, y: t.y })) ?? null;
    });
    if (data && until(data)) return data;
    if (Date.now() > deadline) throw new Error("the plot never drew what the test waits for");
    await page.waitForTimeout(100);
  }
}

/**
 * A fresh window signed in as `name` and watched for console errors; `done` checks that none was
 * seen and closes the window.
 */
async function signedIn(name: string) {
  const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  const page = await context.newPage();
  const seen = watchPage(page);
  await signInAs(page, name);
  const done = async () => {
    expect(seen.errors).toEqual([]);
    await context.close();
  };
  return { page, done };
}

describe("array registry", () => {
  it("lets an administrator add a station, see it in the table and on the map, and draw a configuration", async () => {
    const { page, done } = await signedIn("Rafael Quispe");
    await page.goto(`${baseUrl}/registry`);
    await plotTraces(page, (data) => data[0]?.text.length === 24);
    await screenshot(page, "registry-admin");

    await page.getByRole("link", { name: "Add station" }).click();
    await page.getByRole("heading", { level: 1, name: "New station" }).waitFor();
    const form = page.getByRole("form", { name: "New station" });
    await form.getByLabel("Name").fill("W25");
    await form.getByLabel(/^East/).fill("far");
    await form.getByLabel(/^North/).fill("75");
    await form.getByLabel(/^Path offset/).fill("3.5");
    await form.getByRole("button", { name: "Add station" }).click();
    // Refused with the field named; what was typed stays.
    await form.getByText("Must be a number.").waitFor();
    await expect(form.getByLabel("Name").inputValue()).resolves.toBe("W25");
    await expect(form.getByLabel(/^East/).inputValue()).resolves.toBe("far");
    expect(await station("W25")).toBeNull();

    await form.getByLabel(/^East/).fill("-60");
    // The site plan shows the typed position among the other stations.
    const preview = await plotTraces(page, (data) => data.some((t) => t.name === "W25 (as typed)" && t.x[0] === -60));
    expect(preview.find((t) => t.name === "W25 (as typed)")).toMatchObject({ x: [-60], y: [75] });
    await screenshot(page, "registry-station-new");
    await form.getByRole("button", { name: "Add station" }).click();
    await page.getByText("Station W25 added.").waitFor();
    expect(new URL(page.url()).pathname).toBe("/registry");

    const table = page.getByRole("table", { name: /Stations of the site/ });
    await expect(table.locator("tbody tr").count()).resolves.toBe(25);
    await table.getByRole("link", { name: "W25", exact: true }).waitFor();
    const traces = await plotTraces(page, (data) => data[0]?.text.includes("W25") ?? false);
    const all = traces[0];
    const at = all.text.indexOf("W25");
    expect([all.x[at], all.y[at]]).toEqual([-60, 75]);
    expect(await station("W25")).toMatchObject({ eastM: -60, northM: 75, upM: 0, pathOffsetM: 3.5 });

    await page
      .getByRole("group", { name: "Configuration drawn on the map" })
      .getByRole("button", { name: "extended-6" })
      .click();
    const drawn = await plotTraces(page, (data) => data.length === 4);
    expect(drawn.map((t) => t.name)).toEqual([
      "Other stations",
      "Station names",
      "extended-6: 15 baselines",
      "extended-6: 6 stations",
    ]);
    expect(drawn[3].text).toEqual(["C02", "X01", "X02", "X03", "X04", "X05"]);
    // 15 baselines, each a segment with a gap after it.
    expect(drawn[2].x.filter((x) => x === null)).toHaveLength(15);
    // Names of the crowded core stay off the whole-site view; the outriggers and the new station are named.
    expect(drawn[1].text).toEqual(expect.arrayContaining(["W25", "X06"]));
    expect(drawn[1].text).not.toContain("C09");
    await screenshot(page, "registry-map-extended");
    await page
      .locator("section")
      .filter({ has: page.getByRole("heading", { name: "Station map" }) })
      .screenshot({ path: join(ARTIFACTS, "registry-map-card.png") });
    await done();
  });

  it("imports a CSV with a bad row without changing anything, then a good one after the preview", async () => {
    const { page, done } = await signedIn("Rafael Quispe");
    await page.goto(`${baseUrl}/registry`);
    await page.getByRole("link", { name: "Import" }).click();
    await page.getByRole("heading", { level: 1, name: "Import into the registry" }).waitFor();

    const header = "name,eastM,northM,upM,pathOffsetM\n";
    await page.getByLabel(/^File/).setInputFiles({
      name: "new-pads.csv",
      mimeType: "text/csv",
      buffer: Buffer.from(`${header}W25,-61,75,0,3.5\nW26,abc,10,0,0\n`),
    });
    await page.getByRole("button", { name: "Preview the import" }).click();
    const problems = page.getByRole("alert").filter({ hasText: "Nothing was imported" });
    // Line 3 of the file (the header is line 1).
    await problems.getByText("row 3, eastM: must be a number").waitFor();
    await expect(page.getByRole("button", { name: /^Apply/ }).count()).resolves.toBe(0);
    await screenshot(page, "registry-import-errors");
    expect(await station("W25")).toMatchObject({ eastM: -60 });
    expect(await station("W26")).toBeNull();

    const c01 = (await station("C01"))!;
    const c01Row = [c01.name, c01.eastM, c01.northM, c01.upM, c01.pathOffsetM].join(",");
    await page.getByLabel(/^File/).setInputFiles({
      name: "new-pads.csv",
      mimeType: "text/csv",
      buffer: Buffer.from(`${header}W25,-61,75,0,3.5\nW26,5,-90,0.1,1\n${c01Row}\n`),
    });
    await page.getByRole("button", { name: "Preview the import" }).click();
    const previewTable = page.getByRole("table", { name: "What the import would do to each station" });
    await previewTable.waitFor();
    const rowOf = (name: string) =>
      previewTable.locator("tbody tr").filter({ has: page.getByText(name, { exact: true }) });
    await expect(rowOf("W26").getByText("new").isVisible()).resolves.toBe(true);
    await expect(rowOf("W25").getByText("updated").isVisible()).resolves.toBe(true);
    await expect(rowOf("C01").getByText("unchanged").isVisible()).resolves.toBe(true);
    await screenshot(page, "registry-import-preview");
    expect(await station("W26")).toBeNull();

    await page.getByRole("button", { name: "Apply 2 changes" }).click();
    await page.getByText(/Stations imported into Sierra Lumbre Array: 1 new, 1 updated, 1 unchanged\./).waitFor();
    expect(await station("W25")).toMatchObject({ eastM: -61 });
    expect(await station("W26")).toMatchObject({ eastM: 5, northM: -90, upM: 0.1, pathOffsetM: 1 });
    await done();
  });

  it("exports the stations as CSV with units in the header", async () => {
    const context = await browser.newContext({ acceptDownloads: true });
    const page = await context.newPage();
    await page.goto(`${baseUrl}/registry`);
    const [download] = await Promise.all([
      page.waitForEvent("download"),
      page.getByRole("link", { name: "Stations (CSV)" }).click(),
    ]);
    expect(download.suggestedFilename()).toBe("sierra-lumbre-array-stations.csv");
    const lines = readFileSync((await download.path())!, "utf8")
      .trim()
      .split("\n");
    expect(lines[0]).toBe("name,eastM,northM,upM,pathOffsetM");
    expect(lines).toContain("W26,5,-90,0.1,1");
    expect(lines).toHaveLength(1 + 26);
    await context.close();
  });

  it("shows a proposer the registry, the map and the station pages without any edit control", async () => {
    const { page, done } = await signedIn("Inés Arroyo-Vidal");
    await page.goto(`${baseUrl}/registry`);
    await plotTraces(page, (data) => data[0]?.text.length === 26);
    for (const name of ["Import", "Add a site", "Edit site", "Add station", "Add configuration", "Add instrument"]) {
      await expect(page.getByRole("link", { name }).count()).resolves.toBe(0);
    }
    await expect(page.getByRole("link", { name: /^Edit/ }).count()).resolves.toBe(0);
    await expect(page.getByRole("columnheader", { name: /Edit/ }).count()).resolves.toBe(0);
    await screenshot(page, "registry-proposer");

    await page
      .getByRole("table", { name: /Stations of the site/ })
      .getByRole("link", { name: "C04", exact: true })
      .click();
    await page.getByRole("heading", { level: 1, name: "Station C04" }).waitFor();
    // Framed on the station and its configuration, drawn to begin with; close neighbours are named.
    const traces = await plotTraces(
      page,
      (data) => data.some((t) => t.name === "Station C04") && (data[1]?.text.includes("C09") ?? false),
    );
    expect(traces.map((t) => t.name)).toContain("compact-3: 3 baselines");
    await expect(page.getByRole("link", { name: "Edit station" }).count()).resolves.toBe(0);
    await screenshot(page, "registry-station-page");

    const refused = await page.goto(`${baseUrl}/registry/import`);
    expect(refused?.status()).toBe(403);
    await done();
  });

  it("refuses to delete a station in use, naming the configuration, and deletes the added ones", async () => {
    const { page, done } = await signedIn("Rafael Quispe");
    const c04 = (await station("C04"))!;
    await page.goto(`${baseUrl}/registry/stations/${c04.id}/edit`);
    await page.getByRole("button", { name: "Delete C04" }).click();
    // The button asks first: a dialog says what goes; Cancel leaves everything as it was.
    const dialog = page.getByRole("dialog", { name: "Delete this station?" });
    await dialog.waitFor();
    await screenshot(page, "registry-delete-confirm");
    await dialog.getByRole("button", { name: "Cancel" }).click();
    await expect(dialog.isVisible()).resolves.toBe(false);
    await page.getByRole("button", { name: "Delete C04" }).click();
    await dialog.getByRole("button", { name: "Yes, delete C04" }).click();
    await page
      .getByText("C04 cannot be deleted while a configuration uses it: compact-3. Take it out of it first.")
      .waitFor();
    await screenshot(page, "registry-delete-refused");
    expect(await station("C04")).not.toBeNull();

    for (const name of NEW_STATIONS) {
      const row = (await station(name))!;
      await page.goto(`${baseUrl}/registry/stations/${row.id}/edit`);
      await page.getByRole("button", { name: `Delete ${name}` }).click();
      await page
        .getByRole("dialog")
        .getByRole("button", { name: `Yes, delete ${name}` })
        .click();
      await page.getByText(`Station ${name} deleted.`).waitFor();
      expect(await station(name)).toBeNull();
    }
    await expect(
      page
        .getByRole("table", { name: /Stations of the site/ })
        .locator("tbody tr")
        .count(),
    ).resolves.toBe(24);
    await done();
  });
});
