/**
 * The Night builder end to end, as the scheduler (Mei-Lin Chao): set the configuration calendar, build
 * tonight's plan, reorder a block until a violation shows and back, export CSV and iCalendar, publish
 * (the PI's e-mail appears in the mailbox), then mark a block of an earlier night executed and see the
 * hours owed drop. The cycle is made for the test around today, with programs whose targets pass near
 * the zenith tonight.
 */
import { readFileSync } from "node:fs";
import ICAL from "ical.js";
import Papa from "papaparse";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { createDatabase } from "~/db/client.server";
import { addDays, createNightsFixture, type NightsFixture } from "../test/services/nights/fixture";
import { closeWithoutErrors, DESKTOP, screenshot, signedInPage, useBrowser, watchPage } from "./browser";

const baseUrl = inject("baseUrl");
const browser = useBrowser();
const today = new Date().toISOString().slice(0, 10);
// A night long over whatever the hour of the run, so that its blocks may be marked.
const earlier = addDays(today, -2);
let fx: NightsFixture;
let close: () => Promise<void>;

beforeAll(async () => {
  const { db, client } = createDatabase(inject("databaseUrl"), { max: 2 });
  close = () => client.end();
  fx = await createNightsFixture(db, { night: today, name: "E2E nights" });
});
afterAll(async () => {
  await close?.();
});

const planRows = (page: Page) =>
  page.getByRole("table", { name: "Blocks of the plan in time order" }).locator("tbody tr");

/** Waits until the plan's timeline figure is drawn. */
const timelineDrawn = (page: Page) =>
  page
    .getByRole("figure", { name: /Timeline of the plan/ })
    .locator(".main-svg")
    .first()
    .waitFor();

async function planAutomatically(page: Page) {
  await page.getByRole("button", { name: "Plan automatically" }).click();
  await page.getByText(/blocks? planned for \d targets?/).waitFor();
  await planRows(page).first().waitFor();
}

/** The text of a candidate's cell under the column whose header starts with `header`. */
async function candidateCell(page: Page, date: string, target: string, header: string) {
  const table = page.getByRole("table", { name: `Candidate targets of the night of ${date}` });
  await table.locator("tbody tr").first().waitFor();
  const headers = await table.locator("thead th").allTextContents();
  const column = headers.findIndex((h) => h.startsWith(header));
  if (column < 0) throw new Error(`no column ${header} among ${headers.join(" | ")}`);
  return table.locator("tbody tr").filter({ hasText: target }).first().locator("td").nth(column).textContent();
}

async function download(page: Page, name: string) {
  const [file] = await Promise.all([
    page.waitForEvent("download"),
    page.getByRole("link", { name, exact: true }).click(),
  ]);
  return readFileSync((await file.path())!, "utf8");
}

describe("Night builder", () => {
  it("sets the configuration calendar, builds tonight and shows a violation on a block moved by keyboard or drag", async () => {
    const { context, page, seen } = await signedInPage(browser, "Mei-Lin Chao", DESKTOP);
    await page.getByRole("navigation", { name: "Sections" }).getByRole("link", { name: "Night builder" }).click();
    await page.goto(`${baseUrl}/nights?cycle=${fx.cycle.id}`);
    const run = page.getByRole("form", { name: "Install a configuration for a run of nights" });
    await run.getByLabel("First night").fill(earlier);
    await run.getByLabel("Last night").fill(addDays(today, 2));
    await run.getByLabel("Configuration").selectOption({ label: "medium-4" });
    await run.getByRole("button", { name: "Install for these nights" }).click();
    await page.getByText(`5 nights (${earlier} → ${addDays(today, 2)}) set to medium-4.`).waitFor();
    const tonight = page.getByRole("link", { name: new RegExp(`^Night of ${today}: medium-4`) });
    await expect(tonight.isVisible()).resolves.toBe(true);
    await screenshot(page, "nights-calendar");

    await tonight.click();
    await page.getByRole("heading", { level: 1, name: `Night of ${today}` }).waitFor();
    await page
      .getByText(/Telescope operation follows the observatory's own safety rules/)
      .first()
      .waitFor();
    const candidates = page.getByRole("table", { name: `Candidate targets of the night of ${today}` });
    await expect(candidates.locator("tbody tr").count()).resolves.toBe(4);
    await planAutomatically(page);
    await timelineDrawn(page);
    await screenshot(page, "night-plan");

    // Move the first science block ahead of its calibrator by the keyboard: the violation shows on it.
    const science = planRows(page).filter({ hasText: "science" }).first();
    const earlierButton = science.getByRole("button", { name: /earlier$/ });
    await earlierButton.focus();
    await page.keyboard.press("Enter");
    const movedLabel = () => page.evaluate(() => document.activeElement?.getAttribute("aria-label") ?? "");
    const problem = page.getByRole("list", { name: /^Problems of block \d+ \(science / });
    await problem.waitFor();
    await expect(problem.textContent()).resolves.toMatch(/calibrators:/);
    await page.getByText(/1 block breaks a rule/).waitFor();
    await expect(page.getByRole("button", { name: "Publish to the PIs" }).isDisabled()).resolves.toBe(true);
    await screenshot(page, "night-plan-violation");
    // Focus stays on the moved block (on "earlier", or on "later" once it is first); "later" puts it back.
    await expect(movedLabel()).resolves.toMatch(/^Move block \d+ \(science .*\) (earlier|later)$/);
    if ((await movedLabel()).endsWith("earlier")) await page.keyboard.press("Tab");
    await expect(movedLabel()).resolves.toMatch(/later$/);
    await page.keyboard.press("Enter");
    await problem.waitFor({ state: "detached" });

    // The same by dragging the science row onto the row above it, then back with its button.
    const rows = planRows(page);
    const index = (await rows.allTextContents()).findIndex((t) => t.includes("science"));
    await rows.nth(index).dragTo(rows.nth(index - 1));
    await problem.waitFor();
    await page
      .getByRole("button", { name: /^Move block \d+ \(science .*\) later$/ })
      .first()
      .click();
    await problem.waitFor({ state: "detached" });
    await closeWithoutErrors({ context, seen });
  });

  it("exports tonight's plan as CSV and iCalendar and publishes it; the PI's e-mail is in the mailbox", async () => {
    const { context, page, seen } = await signedInPage(browser, "Mei-Lin Chao", DESKTOP);
    await page.goto(`${baseUrl}/nights/${today}`);
    await planRows(page).first().waitFor();
    const csv = Papa.parse<Record<string, string>>(await download(page, "CSV"), { header: true, skipEmptyLines: true });
    expect(csv.errors).toEqual([]);
    expect(csv.data.length).toBe(await planRows(page).count());
    expect(csv.data[0].startUtc).toMatch(/Z$/);
    const ics = new ICAL.Component(ICAL.parse(await download(page, "iCalendar")));
    expect(ics.getAllSubcomponents("vevent")).toHaveLength(csv.data.length);

    await page.getByRole("button", { name: "Publish to the PIs" }).click();
    await page.getByText(/is published; \d+ e-mails? to the teams of \d programs?/).waitFor();
    await page.getByText("Published", { exact: false }).first().waitFor();
    await closeWithoutErrors({ context, seen });

    // The mailbox is each person's own: the PI reads the notice in theirs.
    const pi = await browser.newContext({ viewport: { width: 1366, height: 900 } });
    const eq = fx.cookies.pi.indexOf("=");
    await pi.addCookies([{ name: fx.cookies.pi.slice(0, eq), value: fx.cookies.pi.slice(eq + 1), url: baseUrl }]);
    const piPage = await pi.newPage();
    const piSeen = watchPage(piPage);
    await piPage.goto(`${baseUrl}/mailbox`);
    await piPage
      .getByRole("link", { name: new RegExp(`^Night plan ${today}: \\d+ blocks for “Winds of the Ardilla stars”`) })
      .first()
      .click();
    await piPage.getByText("the night's iCalendar file").first().waitFor();
    await screenshot(piPage, "night-plan-mail");
    expect(piSeen.errors).toEqual([]);
    await pi.close();
  });

  it("marks a block of an earlier night executed, and the hours owed drop", async () => {
    const { context, page, seen } = await signedInPage(browser, "Mei-Lin Chao", DESKTOP);
    await page.goto(`${baseUrl}/nights/${today}`);
    await expect(candidateCell(page, today, "Ardilla 1", "Owed at dusk")).resolves.toBe("1");

    await page.goto(`${baseUrl}/nights/${earlier}`);
    await planAutomatically(page);
    await page.getByRole("button", { name: "Publish to the PIs" }).click();
    await page.getByText(/is published/).waitFor();
    const first = planRows(page).filter({ hasText: "Ardilla 1" }).filter({ hasText: "science" }).first();
    const mark = first.getByRole("form", { name: /^Mark block/ });
    await mark.getByLabel(/^Outcome of/).selectOption("executed");
    await mark.getByLabel(/^Note on/).fill("fringes stable");
    await mark.getByRole("button", { name: "Mark" }).click();
    await first.locator("span").getByText("executed", { exact: true }).waitFor();
    await first.getByText("fringes stable").waitFor();
    // A 40-minute science block of the hour Ardilla 1 was owed: 0.67 h executed, 0.33 h still owed.
    await expect(candidateCell(page, earlier, "Ardilla 1", "Executed tonight")).resolves.toBe("0.67");
    await expect(candidateCell(page, earlier, "Ardilla 1", "Still owed")).resolves.toBe("0.33");
    await screenshot(page, "night-marked");

    await page.goto(`${baseUrl}/nights/${today}`);
    await expect(candidateCell(page, today, "Ardilla 1", "Owed at dusk")).resolves.toBe("0.33");
    await closeWithoutErrors({ context, seen });
  });

  it("works at 360 px wide", async () => {
    const { context, page } = await signedInPage(browser, "Mei-Lin Chao", { viewport: { width: 360, height: 780 } });
    const seen = watchPage(page);
    await page.goto(`${baseUrl}/nights?cycle=${fx.cycle.id}`);
    await page.getByRole("heading", { level: 1, name: "Night builder" }).waitFor();
    await screenshot(page, "nights-calendar-360");
    await page.goto(`${baseUrl}/nights/${today}`);
    await planRows(page).first().waitFor();
    await timelineDrawn(page);
    await screenshot(page, "night-plan-360");
    const width = await page.evaluate(() => document.documentElement.scrollWidth);
    expect(width).toBeLessThanOrEqual(360);
    await closeWithoutErrors({ context, seen });
  });
});
