/**
 * My targets' row actions in Chromium, as a proposer: open a target in the Sketchpad and come back,
 * add it to one of her drafts through the dialog, remove it after a dialog that Escape cancels; the
 * edit page links back to the list; the list fits 360 px.
 */
import type { Page } from "playwright-core";
import { describe, expect, inject, it } from "vitest";
import { screenshot, signedInPage, useBrowser } from "./browser";

const baseUrl = inject("baseUrl");
const browser = useBrowser();
const PERSON = "Amara Okafor";
const DRAFT = "A dust ring around Altiplano Halo 5";

/** Adds a point source to My targets through the page's form. */
async function addTarget(page: Page, name: string, ra: string, dec: string) {
  await page.goto(`${baseUrl}/targets`);
  await page.getByLabel("Name").fill(name);
  await page.getByLabel("Right ascension").fill(ra);
  await page.getByLabel("Declination").fill(dec);
  await page.getByLabel("Model").selectOption("point");
  await page.getByRole("button", { name: "Add target" }).click();
  await page.getByText(`${name} added to My targets.`).waitFor();
}

describe("My targets' row actions", () => {
  it("open in the Sketchpad and back, add to a draft, remove after confirming", async () => {
    const { context, page, seen } = await signedInPage(browser, PERSON, { viewport: { width: 1366, height: 900 } });
    await addTarget(page, "Harmattan Veil 3", "10:01:00", "-30:30:00");
    const row = () =>
      page.getByRole("table", { name: "My targets" }).locator("tbody tr", { hasText: "Harmattan Veil 3" });
    await screenshot(page, "targets-row-actions");

    // The Sketchpad opens on the target and links back.
    await row().getByRole("link", { name: "Open Harmattan Veil 3 in Sketchpad" }).click();
    await page.waitForURL(/\/sketchpad\?/);
    // The list's own form (with the same text typed) is gone once the Sketchpad's heading shows.
    await page.getByRole("heading", { level: 1, name: "Sketchpad" }).waitFor();
    await expect(page.getByLabel("Name").inputValue()).resolves.toBe("Harmattan Veil 3");
    await expect(page.getByLabel("Right ascension").inputValue()).resolves.toBe("10:01:00.00");
    await page.getByText(/^Up to date/).waitFor({ timeout: 30_000 });
    await page.getByRole("link", { name: "← Back to My targets" }).click();
    await page.getByRole("heading", { level: 1, name: "My targets" }).waitFor();

    // Add to a proposal: the dialog lists her drafts; the copy lands in the proposal.
    await row().getByRole("button", { name: "Add to a proposal" }).click();
    const dialog = page.getByRole("dialog", { name: "Add Harmattan Veil 3 to a proposal" });
    await dialog.waitFor();
    const draft = await dialog.locator("option", { hasText: DRAFT }).getAttribute("value");
    await dialog.getByLabel("Proposal").selectOption(draft!);
    await screenshot(page, "targets-add-to-proposal");
    await dialog.getByRole("button", { name: "Add to proposal" }).click();
    await page.getByText("Harmattan Veil 3 added to the proposal.", { exact: false }).waitFor();
    await page.goto(`${baseUrl}/proposals`);
    await page.getByRole("link", { name: DRAFT }).click();
    await page.getByText("Harmattan Veil 3").first().waitFor();

    // Remove: Escape cancels the dialog, the confirmation removes the row.
    await page.goto(`${baseUrl}/targets`);
    await row().getByRole("button", { name: "Remove" }).click();
    const ask = page.getByRole("dialog", { name: "Remove Harmattan Veil 3?" });
    await ask.waitFor();
    await page.keyboard.press("Escape");
    await ask.waitFor({ state: "hidden" });
    await expect(row().count()).resolves.toBe(1);
    await row().getByRole("button", { name: "Remove" }).click();
    await ask.getByRole("button", { name: "Remove from My targets" }).click();
    await page.getByText("Harmattan Veil 3 removed from My targets.").waitFor();
    await expect(row().count()).resolves.toBe(0);
    expect(seen.errors).toEqual([]);
    await context.close();
  });

  it("the edit page links back to the list, and the list fits a 360 px wide screen", async () => {
    const { context, page, seen } = await signedInPage(browser, PERSON, { viewport: { width: 360, height: 780 } });
    await addTarget(page, "Harmattan Veil 4", "11:00:00", "-36:00:00");
    const overflow = await page.evaluate(
      () => document.documentElement.scrollWidth - document.documentElement.clientWidth,
    );
    expect(overflow).toBeLessThanOrEqual(0);
    await screenshot(page, "targets-row-actions-360px");
    await page.getByRole("link", { name: "Harmattan Veil 4", exact: true }).click();
    await page.getByRole("heading", { level: 1, name: "Harmattan Veil 4" }).waitFor();
    await page.getByRole("link", { name: "Back to My targets" }).click();
    await page.getByRole("heading", { level: 1, name: "My targets" }).waitFor();
    expect(seen.errors).toEqual([]);
    await context.close();
  });
});
