/**
 * The star catalogue in Chromium, signed in as a proposer: a star's name typed in My targets is
 * suggested and resolved (designations, V, B−V, coordinates filled in), an invented name is kept and
 * said to be no catalogue star; a proposal's target opens its Calibrator shortlist and a calibrator is
 * added; bad settings get their field's message. Screenshots at 1366 and 360 px.
 */
import { and, eq } from "drizzle-orm";
import type { Locator, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { createDatabase } from "~/db/client.server";
import { proposals, proposalTargets } from "~/db/schema/proposals";
import { closeWithoutErrors, DESKTOP, screenshot, signedInPage, useBrowser } from "./browser";

const baseUrl = inject("baseUrl");
const browser = useBrowser();
const NARROW = { viewport: { width: 360, height: 800 }, isMobile: true };

let db: ReturnType<typeof createDatabase>["db"];
let close: () => Promise<void>;
beforeAll(() => {
  const opened = createDatabase(inject("databaseUrl"), { max: 1 });
  db = opened.db;
  close = () => opened.client.end();
});
afterAll(async () => {
  await close?.();
});

/** The demo draft of Inés with its target Lumbre Nova 12: the target page's address and its row id. */
async function demoDraftTarget() {
  const [row] = await db
    .select({ proposalId: proposals.id, targetId: proposalTargets.id })
    .from(proposalTargets)
    .innerJoin(proposals, eq(proposals.id, proposalTargets.proposalId))
    .where(
      and(eq(proposals.title, "Limb darkening along the giant branch"), eq(proposalTargets.name, "Lumbre Nova 12")),
    );
  return { ...row, path: `/proposals/${row.proposalId}/targets/${row.targetId}` };
}

/**
 * Picks Betelgeuse from the name field's suggestions with the keyboard, checks the coordinates it fills
 * in, and gives the field's status line (the star's designations and magnitudes).
 */
async function pickBetelgeuse(page: Page, name: Locator) {
  await name.press("ArrowDown");
  await name.press("Enter");
  await expect(name.inputValue()).resolves.toBe("Betelgeuse");
  // stars.8.json, HIP 27989: RA 88.7929° = 05h55m10.30s, Dec +7.4071° = +07°24′25.6″.
  await page.getByText("Coordinates filled in.").waitFor();
  await expect(page.getByLabel("Right ascension").inputValue()).resolves.toBe("05:55:10.30");
  await expect(page.getByLabel("Declination").inputValue()).resolves.toBe("+07:24:25.6");
  return page.locator(`#${await name.getAttribute("id")}-status`);
}

describe("star catalogue", () => {
  it("a proposer types a star's name in My targets, picks the suggestion and sees the star resolved", async () => {
    const { context, page, seen } = await signedInPage(browser, "Inés Arroyo-Vidal", DESKTOP);
    await page.goto(`${baseUrl}/targets`);
    const name = page.getByRole("combobox", { name: "Name" });
    await name.pressSequentially("betelg", { delay: 30 });
    const option = page.getByRole("option", { name: /Betelgeuse/ });
    await option.waitFor();
    await screenshot(page, "catalogue-name-suggestions-1366");
    // Keyboard: down to the first suggestion, Enter picks it.
    const facts = await pickBetelgeuse(page, name);
    await expect(facts.textContent()).resolves.toMatch(/α Ori · 58 Ori · HD 39801 · HIP 27989/);
    await expect(facts.textContent()).resolves.toMatch(/V 0\.45 · B−V 1\.50/);
    await screenshot(page, "catalogue-name-resolved-1366");
    await page.getByRole("button", { name: "Add target" }).click();
    await page.getByText("Betelgeuse added to My targets.").waitFor();

    // An invented name: said to be no catalogue star, kept as typed; the coordinates Betelgeuse filled
    // in are taken back with its name.
    await name.fill("Lumbre Nova 99");
    await expect(page.getByLabel("Right ascension").inputValue()).resolves.toBe("");
    await expect(page.getByLabel("Declination").inputValue()).resolves.toBe("");
    await page.getByText(/Not in the star catalogue: no star called "Lumbre Nova 99"/).waitFor();
    await expect(name.inputValue()).resolves.toBe("Lumbre Nova 99");
    // Saved without coordinates, the form names the field and keeps the name.
    await page.getByRole("button", { name: "Add target" }).click();
    await page
      .getByText(/Name: no coordinates given, and no star called "Lumbre Nova 99"/)
      .first()
      .waitFor();
    await expect(page.getByRole("combobox", { name: "Name" }).inputValue()).resolves.toBe("Lumbre Nova 99");
    await screenshot(page, "catalogue-name-unknown-1366");
    await closeWithoutErrors({ context, seen });
  });

  it("a proposer types a star's name in the Sketchpad, sees it resolved and its best calibrators", async () => {
    const { context, page, seen } = await signedInPage(browser, "Inés Arroyo-Vidal", DESKTOP);
    await page.goto(`${baseUrl}/sketchpad`);
    const name = page.getByRole("combobox", { name: "Name" });
    await name.pressSequentially("betelg", { delay: 30 });
    // The suggestions' list (the "From My targets" select may hold a Betelgeuse too).
    await page
      .getByRole("listbox")
      .getByRole("option", { name: /Betelgeuse/ })
      .first()
      .waitFor();
    const facts = await pickBetelgeuse(page, name);
    await expect(facts.textContent()).resolves.toMatch(/HD 39801/);
    // The sketch follows the star, and its top calibrators are listed with a link to the full shortlist.
    await page.getByText(/^Up to date/).waitFor({ timeout: 30_000 });
    const peek = page.getByRole("region", { name: "Calibrators" });
    await peek.getByRole("link", { name: "The full Calibrator shortlist" }).waitFor();
    await expect
      .poll(async () => (await peek.locator("li").count()) > 0 || (await peek.getByText(/No catalogue star/).count()))
      .toBeTruthy();
    await screenshot(page, "catalogue-sketchpad-1366");
    await closeWithoutErrors({ context, seen });
  });

  it("a proposer opens the Calibrator shortlist of a proposal's target and adds a calibrator", async () => {
    const target = await demoDraftTarget();
    const { context, page, seen } = await signedInPage(browser, "Inés Arroyo-Vidal", DESKTOP);
    await page.goto(`${baseUrl}${target.path}`);
    await page.getByRole("link", { name: "Find calibrators" }).click();
    await page.getByRole("heading", { level: 1, name: "Calibrators for Lumbre Nova 12" }).waitFor();
    const table = page.getByRole("table", { name: "Calibrator shortlist" });
    await table.waitFor();
    const rows = table.locator("tbody tr");
    await expect(rows.count()).resolves.toBeGreaterThan(2);
    await expect(rows.first().textContent()).resolves.toMatch(/estimate/);
    await screenshot(page, "catalogue-shortlist-1366");

    const first = rows.first();
    const starName = (await first.locator("td").first().locator("span.font-medium").textContent())?.trim() ?? "";
    await first.getByRole("button", { name: /Add .* as calibrator/ }).click();
    await page
      .getByText(
        new RegExp(`${starName.replace(/[.*+?^${}()|[\]\\]/g, "\\$&")}.* added as a calibrator of Lumbre Nova 12`),
      )
      .waitFor();
    await first.getByText("A calibrator").waitFor();

    // The target's page lists it among the calibrators.
    await page.getByRole("link", { name: "Back to the target" }).click();
    await page.getByRole("heading", { level: 1, name: "Lumbre Nova 12", exact: true }).waitFor();
    const names = await page
      .locator('input[name="calName"]')
      .evaluateAll((els) => els.map((e) => (e as HTMLInputElement).value));
    expect(names).toContain(starName);

    // The shortlist of any star, from the menu: its name picked from the suggestions.
    await page.getByRole("navigation", { name: "Sections" }).getByRole("link", { name: "Calibrators" }).click();
    await page.getByRole("heading", { level: 1, name: "Calibrator shortlist" }).waitFor();
    const field = page.getByRole("combobox", { name: "Target" });
    await field.pressSequentially("sirius", { delay: 30 });
    await page.getByRole("option", { name: /^Sirius/ }).click();
    await page.getByText("Coordinates filled in.").waitFor();
    await page.getByLabel("Night of").fill("2027-01-10");
    await page.getByRole("button", { name: "Show the shortlist" }).click();
    await page.getByRole("table", { name: "Calibrator shortlist" }).waitFor();
    await page.waitForURL(/target=Sirius/);
    await screenshot(page, "catalogue-generic-1366");
    await closeWithoutErrors({ context, seen });
  });

  it("bad settings and an unknown target get their field's message; the page works at 360 px", async () => {
    const target = await demoDraftTarget();
    const { context, page, seen } = await signedInPage(browser, "Inés Arroyo-Vidal", NARROW);
    await page.goto(`${baseUrl}/catalogue${target.path}/calibrators`);
    await page.getByRole("table", { name: "Calibrator shortlist" }).waitFor();
    await screenshot(page, "catalogue-shortlist-360");
    const within = page.getByLabel(/^Within/);
    await within.fill("100");
    await page.getByRole("button", { name: "Show the shortlist" }).click();
    await page.getByText("Within: degrees, above 0 and up to 90").first().waitFor();
    await expect(page.getByLabel(/^Within/).inputValue()).resolves.toBe("100");

    await page.goto(`${baseUrl}/catalogue/calibrators`);
    const field = page.getByRole("combobox", { name: "Target" });
    await field.fill("Zorgon Prime");
    await page.getByRole("button", { name: "Show the shortlist" }).click();
    await page
      .getByText(/Target: no star called "Zorgon Prime"/)
      .first()
      .waitFor();
    await expect(page.getByRole("combobox", { name: "Target" }).inputValue()).resolves.toBe("Zorgon Prime");
    await screenshot(page, "catalogue-unknown-target-360");

    await page.goto(`${baseUrl}/targets`);
    await page.getByRole("combobox", { name: "Name" }).pressSequentially("sir", { delay: 30 });
    await page.getByRole("option", { name: /Sirius/ }).waitFor();
    await screenshot(page, "catalogue-name-suggestions-360");
    await closeWithoutErrors({ context, seen });
  });
});
