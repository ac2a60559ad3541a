import { describe, expect, inject, it } from "vitest";
import { screenshot, useBrowser, watchPage } from "./browser";

const baseUrl = inject("baseUrl");
const browser = useBrowser();

describe("app shell", () => {
  it("renders the home page in IBM Plex Sans served by the app itself", async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    const seen = watchPage(page);
    await page.goto(baseUrl, { waitUntil: "networkidle" });
    await expect(page.locator("h1").first().textContent()).resolves.toContain("From the first uv sketch");
    await page.evaluate(() => document.fonts.ready);

    // The rendered font: a loaded FontFace of the family, and the body's computed family starts with it.
    const fonts = await page.evaluate(() => ({
      loaded: [...document.fonts].filter((f) => f.status === "loaded").map((f) => f.family.replace(/"/g, "")),
      check: document.fonts.check('16px "IBM Plex Sans"'),
      family: getComputedStyle(document.body).fontFamily,
    }));
    expect(fonts.loaded).toContain("IBM Plex Sans");
    expect(fonts.check).toBe(true);
    expect(fonts.family.replace(/"/g, "")).toMatch(/^IBM Plex Sans/);

    // Every request stayed on the app's own origin; the font files came from /fonts.
    const origin = new URL(baseUrl).origin;
    const foreign = seen.requests.filter((u) => !u.startsWith(origin) && !u.startsWith("data:"));
    expect(foreign).toEqual([]);
    expect(seen.requests.some((u) => u.startsWith(`${origin}/fonts/ibm-plex-sans-`) && u.endsWith(".woff2"))).toBe(
      true,
    );
    expect(seen.errors).toEqual([]);
    await screenshot(page, "home-desktop");
    await page.close();
  });

  it("follows the navigation to the array registry and sorts the station table", async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    const seen = watchPage(page);
    await page.goto(baseUrl, { waitUntil: "networkidle" });
    await page.getByRole("navigation", { name: "Sections" }).getByRole("link", { name: "Array registry" }).click();
    await page.waitForURL(`${baseUrl}/registry`);
    // Client-side navigation: wait for the new page to render rather than reading the old one.
    await page.getByRole("heading", { level: 1, name: "Array registry" }).waitFor();
    const stationTable = page.getByRole("table", { name: /Stations of the site/ });
    await expect(stationTable.locator("tbody tr").count()).resolves.toBe(24);

    // Sort by east, descending: the first row is the easternmost station.
    const eastHeader = stationTable.getByRole("button", { name: /East/ });
    await eastHeader.click();
    await eastHeader.click();
    await expect(stationTable.locator("th").nth(1).getAttribute("aria-sort")).resolves.toBe("descending");
    const firstEast = Number(await stationTable.locator("tbody tr").first().locator("td").nth(1).textContent());
    const allEast = (await stationTable.locator("tbody tr td:nth-child(2)").allTextContents()).map(Number);
    expect(firstEast).toBe(Math.max(...allEast));
    expect(seen.errors).toEqual([]);
    await screenshot(page, "registry-desktop");
    await page.close();
  });

  it("shows a kind 404 page inside the shell", async () => {
    const page = await browser.newPage();
    const response = await page.goto(`${baseUrl}/no/such/page`);
    expect(response?.status()).toBe(404);
    await expect(page.getByRole("heading", { level: 1 }).textContent()).resolves.toBe("Nothing here");
    await expect(page.getByRole("link", { name: "Go to the home page" }).isVisible()).resolves.toBe(true);
    await screenshot(page, "not-found");
    await page.close();
  });

  it("works at 360 px wide with the menu behind a keyboard-operable button", async () => {
    const page = await browser.newPage({ viewport: { width: 360, height: 780 } });
    await page.goto(baseUrl, { waitUntil: "networkidle" });
    const menu = page.getByRole("button", { name: "Menu" });
    await menu.focus();
    await page.keyboard.press("Enter");
    await expect(menu.getAttribute("aria-expanded")).resolves.toBe("true");
    await expect(page.locator("#mobile-nav").getByRole("link", { name: "Array registry" }).isVisible()).resolves.toBe(
      true,
    );
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await screenshot(page, "home-360");
    await page.close();
  });
});
