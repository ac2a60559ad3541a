import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { Page } from "playwright-core";
import { describe, expect, inject, it } from "vitest";
import { screenshot, signedInPage, useBrowser } from "./browser";

const baseUrl = inject("baseUrl");
const browser = useBrowser();
const WIDE = { viewport: { width: 1280, height: 900 } };

/** Writes `csv` (when given) to `file`, picks the file on the import page and has the page check it. */
async function checkList(page: Page, file: string, csv?: string) {
  if (csv !== undefined) writeFileSync(file, csv);
  await page.setInputFiles("#file", file);
  await page.getByRole("button", { name: "Check the list" }).click();
}

describe("My targets and cycles", () => {
  it("a proposer imports a CSV target list: a broken row blocks it, the fixed list goes in", async () => {
    const { context, page, seen } = await signedInPage(browser, "Tomasz Wierzbicki", WIDE);
    await page.getByRole("navigation", { name: "Sections" }).getByRole("link", { name: "My targets" }).click();
    await page.getByRole("heading", { level: 1, name: "My targets" }).waitFor();
    await page.getByRole("link", { name: "Import CSV" }).click();
    await page.getByRole("heading", { level: 1, name: "Import targets" }).waitFor();

    const dir = mkdtempSync(join(tmpdir(), "fd-targets-"));
    await checkList(
      page,
      join(dir, "broken.csv"),
      "name,ra,dec,model,size_mas,mag_K\nCeniza Pair,06:12:00,-24:30:00,uniformDisk,2.4,3.1\nBrizna,27:00:00,+05:00:00,point,,6.5\n",
    );
    await page.getByText("1 problem to fix — nothing has been imported.").waitFor();
    const problems = page.getByRole("table", { name: "Problems by line of the file" });
    await expect(problems.locator("tbody tr").first().textContent()).resolves.toMatch(/3\s*ra\s*Right ascension/);
    await screenshot(page, "targets-import-error");

    const good = join(dir, "good.csv");
    await checkList(
      page,
      good,
      "name,ra,dec,model,size_mas,mag_K\nCeniza Pair,06:12:00,-24:30:00,uniformDisk,2.4,3.1\nBrizna,07:00:00,+05:00:00,point,,6.5\n",
    );
    await page.getByRole("button", { name: "Import 2 targets" }).click();
    await page.getByText("Imported 2 new targets.").waitFor();
    // The same list again: nothing to import, and the page says why.
    await page.getByRole("link", { name: "Import CSV" }).click();
    await checkList(page, good);
    await page.getByText("All 2 already in your list, unchanged: nothing to import.").waitFor();
    await expect(page.getByRole("button", { name: /^Import \d/ }).count()).resolves.toBe(0);
    await page.getByRole("link", { name: "Back to My targets" }).click();
    const table = page.getByRole("table", { name: "My targets" });
    await table.locator("tbody tr").first().waitFor();
    await expect(table.locator("tbody tr").count()).resolves.toBe(2);
    await expect(table.textContent()).resolves.toContain("uniform disk 2.4 mas");
    expect(seen.errors).toEqual([]);
    await screenshot(page, "targets-list");
    await context.close();
  });

  it("a proposer adds a target by hand and sees the field named when the declination is wrong", async () => {
    const { context, page } = await signedInPage(browser, "Inés Arroyo-Vidal", WIDE);
    await page.goto(`${baseUrl}/targets`);
    await page.getByLabel("Name").fill("Lumbre Nova 12");
    await page.getByLabel("Right ascension").fill("05:36:12.8");
    await page.getByLabel("Declination").fill("-91:00:00");
    await page.getByLabel("Model").selectOption("binary");
    await page.getByLabel(/Separation/).fill("12");
    await page.getByLabel(/Position angle/).fill("40");
    await page.getByLabel(/Flux ratio/).fill("0.4");
    await page.getByRole("button", { name: "Add target" }).click();
    await page
      .getByText(/Declination.*-90/)
      .first()
      .waitFor();
    await expect(page.getByLabel("Right ascension").inputValue()).resolves.toBe("05:36:12.8");
    await screenshot(page, "targets-form-error");
    await page.getByLabel("Declination").fill("-01:12:07");
    await page.getByRole("button", { name: "Add target" }).click();
    await page.getByText("Lumbre Nova 12 added to My targets.").waitFor();
    // The form starts blank again for the next target; the new one is in the list.
    await page.getByRole("link", { name: "Lumbre Nova 12", exact: true }).waitFor();
    await expect(page.getByLabel("Right ascension").inputValue()).resolves.toBe("");
    await expect(page.getByRole("combobox", { name: "Name" }).inputValue()).resolves.toBe("");

    // The saved target fills the Sketchpad: name, coordinates and the binary model.
    await page.goto(`${baseUrl}/sketchpad?config=compact-3`);
    await page.getByLabel("From My targets").selectOption({ label: "Lumbre Nova 12" });
    await expect(page.getByLabel("Right ascension").inputValue()).resolves.toBe("05:36:12.80");
    await expect(page.getByLabel("Model", { exact: true }).inputValue()).resolves.toBe("binary");
    await page.waitForURL(/ra=05%3A36%3A12\.80/);
    await page.waitForFunction(
      () =>
        ((
          document.querySelector('figure[aria-label^="uv plane"] .js-plotly-plot') as unknown as {
            data?: unknown[];
          } | null
        )?.data?.length ?? 0) > 0,
      undefined,
      { timeout: 20_000 },
    );
    await context.close();
  });

  it("the chair opens a new cycle with its configurations and nights", async () => {
    const { context, page, seen } = await signedInPage(browser, "Henrik Solberg", WIDE);
    await page.getByRole("navigation", { name: "Sections" }).getByRole("link", { name: "Cycles" }).click();
    await page.getByRole("link", { name: "New cycle" }).click();
    // A name no demo cycle takes (theirs follow the load date: app/db/seed/demo-cycles.ts).
    await page.getByLabel("Name").fill("Test 2027B");
    await page.getByLabel(/Submission deadline/).fill("2027-06-15T12:00");
    await page.getByLabel("First night").fill("2027-09-01");
    await page.getByLabel("Last night").fill("2028-02-28");
    // Nothing is on offer until the chair ticks it; a ticked configuration needs its nights, at most the
    // cycle's 181 (2027-09-01 … 2028-02-28, both counted).
    await expect(page.getByRole("checkbox", { name: /^compact-3/ }).isChecked()).resolves.toBe(false);
    await page.getByRole("checkbox", { name: /^compact-3/ }).check();
    await page.getByRole("checkbox", { name: /^medium-4/ }).check();
    await page.getByLabel(/Nights for compact-3/).fill("30");
    // Each "Nights for …" label on one line, the configuration's name unbroken at its hyphen.
    for (const label of await page.locator("label", { hasText: /^Nights for / }).all()) {
      const box = await label.boundingBox();
      expect(box?.height ?? 0).toBeLessThan(30);
    }
    await page.getByRole("button", { name: "Create cycle" }).click();
    await page.getByText("Nights: give the nights this configuration is on offer, or untick it").first().waitFor();
    await expect(page.getByLabel(/Nights for compact-3/).inputValue()).resolves.toBe("30");
    await page.getByLabel(/Nights for medium-4/).fill("200");
    await page.getByRole("button", { name: "Create cycle" }).click();
    await page
      .getByText(/Nights: at most 181, the nights from the first to the last night/)
      .first()
      .waitFor();
    await page.getByLabel(/Nights for medium-4/).fill("20");
    await page.getByRole("button", { name: "Create cycle" }).click();
    await page.getByText("Cycle Test 2027B created.").waitFor();
    await expect(page.getByText("compact-3 (30 nights)").first().isVisible()).resolves.toBe(true);
    expect(seen.errors).toEqual([]);
    await screenshot(page, "cycles");
    await context.close();
  });
});
