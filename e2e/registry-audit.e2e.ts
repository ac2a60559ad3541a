/**
 * The registry's changes in the audit log, in Chromium: an administrator saves a station (a refused
 * value first, which records nothing), and the People page's audit log names who changed which
 * station, with the time in UTC.
 */
import { describe, expect, inject, it } from "vitest";
import { screenshot, signedInPage, useBrowser } from "./browser";

const baseUrl = inject("baseUrl");
const browser = useBrowser();

describe("the registry in the audit log", () => {
  it("lists a station saved by an administrator, and nothing for a refused save", async () => {
    const { context, page, seen } = await signedInPage(browser, "Rafael Quispe", {
      viewport: { width: 1366, height: 900 },
    });
    await page.goto(`${baseUrl}/registry`);
    const c04 = await page
      .getByRole("table", { name: /Stations of the site/ })
      .getByRole("link", { name: "C04", exact: true })
      .getAttribute("href");
    await page.goto(`${baseUrl}${c04}/edit`);
    const form = page.getByRole("form", { name: /C04/ });
    const east = await form.getByLabel(/^East/).inputValue();
    await form.getByLabel(/^East/).fill("far");
    await form.getByRole("button", { name: "Save station" }).click();
    await form.getByText("Must be a number.").waitFor();
    await page.goto(`${baseUrl}/admin/users`);
    const log = page.getByRole("heading", { name: "Audit log" }).locator("xpath=ancestor::section[1]");
    await log.waitFor();
    await expect(log.getByText(/updated station C04 in the array registry/).count()).resolves.toBe(0);

    await page.goBack();
    await form.getByLabel(/^East/).fill(east);
    await form.getByRole("button", { name: "Save station" }).click();
    await page.getByText("Station C04 saved.").waitFor();
    await page.goto(`${baseUrl}/admin/users`);
    const entry = page.getByText(
      /^\d{4}-\d\d-\d\d \d\d:\d\d UTC — Rafael Quispe updated station C04 in the array registry$/,
    );
    await entry.waitFor();
    await expect(entry.count()).resolves.toBe(1);
    await screenshot(page, "admin-audit-registry");
    expect(seen.errors).toEqual([]);
    await context.close();
  });
});
