/**
 * The Triangle finder in Chromium, signed in as a proposer: a shared link ranks as it opens, the
 * counts read in proper plurals, a ranked triangle opens in the Sketchpad, and the Sketchpad hands its
 * target and model over; "Use this triangle" stores a ranked triangle on a draft's target, whose page
 * shows it; opened from My targets, the page links back.
 */
import { describe, expect, inject, it } from "vitest";
import { addressParams, closeWithoutErrors, DESKTOP, screenshot, signedInPage, useBrowser } from "./browser";

const baseUrl = inject("baseUrl");
const browser = useBrowser();
const SKETCH = "name=Test%20field&ra=11:00:00&dec=-36:00:00&date=2027-03-15&model=binary&sep=4&pa=60&ratio=0.4";
const PERSON = "Inés Arroyo-Vidal";

describe("Triangle finder", () => {
  it("ranks a shared link as it opens and counts in proper plurals", async () => {
    const { context, page, seen } = await signedInPage(browser, PERSON, DESKTOP);
    let asked = 0;
    page.on("request", (r) => {
      if (r.url().endsWith("/api/triangles")) asked++;
    });
    await page.goto(`${baseUrl}/triangles?pool=compact-3&${SKETCH}`);
    // No click: the link carries a target, so it is ranked at once.
    await page.getByRole("heading", { name: "Ranked triangles" }).waitFor({ timeout: 30_000 });
    expect(asked).toBe(1);
    await page
      .getByText(/^1 triangle of 3 stations over \d+ samples of 10 min\. The pool has 1 independent closure phase\./)
      .waitFor();
    await page.getByText("3 stations: 1 triangle to rank.").waitFor();
    await page.getByText(/^Ranked in [\d.]+ s$/).waitFor();
    await expect(page.getByText(/\b1 triangles\b|\b1 stations\b/).count()).resolves.toBe(0);
    await screenshot(page, "triangle-finder-compact");

    // A change of the inputs waits for the button (ranking every station takes a while).
    await page.getByLabel("Pool").selectOption("medium-4");
    await page.getByText("The inputs changed since this ranking: rank again.").waitFor();
    expect(asked).toBe(1);
    await page.getByRole("button", { name: "Rank triangles" }).click();
    await page.getByText(/^4 triangles of 4 stations/).waitFor({ timeout: 30_000 });
    await closeWithoutErrors({ context, seen });
  });

  it("ranks the triangles of every station and opens one in the Sketchpad", async () => {
    const { context, page, seen } = await signedInPage(browser, PERSON, { viewport: { width: 1280, height: 900 } });
    await page.goto(`${baseUrl}/triangles?pool=all&${SKETCH}`);
    await page.getByRole("heading", { name: "Ranked triangles" }).waitFor({ timeout: 60_000 });
    // 24 stations give 24·23·22/6 = 2024 triangles (Monnier 2003); the best 50 are listed.
    await page.getByText(/^2024 triangles of 24 stations/).waitFor();
    const table = page.getByRole("table", { name: "Station triangles ranked for the target" });
    await expect(table.locator("tbody tr").count()).resolves.toBe(50);
    const first = table.locator("tbody tr").first();
    await expect(first.locator("td").first().textContent()).resolves.toBe("1");
    const triangle = (await first.locator("td").nth(1).textContent())!.split("–");
    expect(triangle).toHaveLength(3);
    await expect(first.getByText(/closure-phase signal/).isVisible()).resolves.toBe(true);
    await screenshot(page, "triangle-finder");

    await first.getByRole("link", { name: /in Sketchpad/ }).click();
    await page.waitForURL(/\/sketchpad\?/);
    expect(addressParams(page)).toMatchObject({
      st: triangle.join(","),
      ra: "11:00:00",
      model: "binary",
      date: "2027-03-15",
    });
    await page.getByText(/^Up to date/).waitFor({ timeout: 30_000 });
    await expect(page.getByLabel("Configuration", { exact: true }).inputValue()).resolves.toBe("");
    await screenshot(page, "sketchpad-from-triangle");
    await closeWithoutErrors({ context, seen });
  });

  it("takes the Sketchpad's target and model over, and fits a 360 px wide screen", async () => {
    const { context, page, seen } = await signedInPage(browser, PERSON, { viewport: { width: 360, height: 780 } });
    await page.goto(`${baseUrl}/sketchpad?config=medium-4&${SKETCH.replace("Test%20field", "Hand%20over")}`);
    await page.getByText(/^Up to date/).waitFor({ timeout: 30_000 });
    await page.getByRole("link", { name: "Rank triangles for this target" }).click();
    await page.waitForURL(/\/triangles\?/);
    expect(addressParams(page)).toMatchObject({
      pool: "medium-4",
      name: "Hand over",
      ra: "11:00:00",
      dec: "-36:00:00",
      model: "binary",
      sep: "4",
      pa: "60",
      ratio: "0.4",
      date: "2027-03-15",
    });
    await page.getByText(/^4 triangles of 4 stations/).waitFor({ timeout: 30_000 });
    await expect(page.getByLabel("Name").inputValue()).resolves.toBe("Hand over");
    await expect(page.getByLabel("Model", { exact: true }).inputValue()).resolves.toBe("binary");
    const overflow = await page.evaluate(
      () => document.documentElement.scrollWidth - document.documentElement.clientWidth,
    );
    expect(overflow).toBeLessThanOrEqual(0);
    await screenshot(page, "triangle-finder-360px");
    await closeWithoutErrors({ context, seen });
  });

  it("stores a ranked triangle on a draft's target, and the target's page shows it", async () => {
    const { context, page, seen } = await signedInPage(browser, "Amara Okafor", DESKTOP);
    await page.goto(`${baseUrl}/triangles?pool=medium-4&from=targets&${SKETCH}`);
    await page.getByRole("heading", { name: "Ranked triangles" }).waitFor({ timeout: 30_000 });
    await page.getByRole("link", { name: "← Back to My targets" }).waitFor();
    const table = page.getByRole("table", { name: "Station triangles ranked for the target" });
    const first = table.locator("tbody tr").first();
    const triangle = (await first.locator("td").nth(1).textContent())!;
    await first.getByRole("button", { name: `Use ${triangle} for a proposal target` }).click();
    const dialog = page.getByRole("dialog", { name: `Use the triangle ${triangle}` });
    await dialog.waitFor();
    await expect(dialog.textContent()).resolves.toMatch(/on configuration medium-4 at /);
    // Nothing chosen yet: the server names the field.
    await dialog.getByRole("button", { name: "Use this triangle" }).click();
    await page.getByText("Not stored: Proposal target: choose one.").waitFor();
    await first.getByRole("button", { name: `Use ${triangle} for a proposal target` }).click();
    const target = await dialog.locator("option", { hasText: "Altiplano Halo 5" }).getAttribute("value");
    await dialog.getByLabel("Proposal target").selectOption(target!);
    await screenshot(page, "triangle-finder-use");
    await dialog.getByRole("button", { name: "Use this triangle" }).click();
    await page.waitForURL(/\/proposals\/\d+\/targets\/\d+$/);
    await page.getByText(`Closure triangle ${triangle} stored for Altiplano Halo 5.`).waitFor();
    await page.getByText(`Closure triangle: ${triangle}`).waitFor();
    await screenshot(page, "proposal-target-triangle");
    await closeWithoutErrors({ context, seen });
  });
});
