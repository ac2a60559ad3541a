import { readFileSync } from "node:fs";
import Papa from "papaparse";
import { describe, expect, inject, it } from "vitest";
import { screenshot, signedInPage, useBrowser } from "./browser";

const baseUrl = inject("baseUrl");
const browser = useBrowser();

describe("walkthrough details", () => {
  it("shows a visible focus ring on text fields reached with the keyboard (WCAG 2.4.7)", async () => {
    const page = await browser.newPage({ viewport: { width: 1366, height: 900 } });
    await page.goto(`${baseUrl}/sign-in`, { waitUntil: "networkidle" });
    const email = page.getByLabel(/e-mail/i).first();
    // Tab from the top of the page until the e-mail field has the focus.
    for (let i = 0; i < 40; i++) {
      await page.keyboard.press("Tab");
      if (await email.evaluate((el) => el === document.activeElement)) break;
    }
    const outline = await email.evaluate((el) => {
      const s = getComputedStyle(el);
      return { style: s.outlineStyle, width: Number.parseFloat(s.outlineWidth) };
    });
    expect(outline.style).not.toBe("none");
    expect(outline.width).toBeGreaterThanOrEqual(2);
    await screenshot(page, "focus-ring-sign-in");
    await page.close();
  });

  it("says a refusal once, with the advice after it", async () => {
    const { context, page } = await signedInPage(browser, "Inés Arroyo-Vidal", {
      viewport: { width: 1366, height: 900 },
    });
    const res = await page.goto(`${baseUrl}/admin/users`);
    expect(res?.status()).toBe(403);
    const text = (await page.locator("main").textContent()) ?? "";
    expect(text.match(/does not have the role/g)?.length ?? 0).toBeLessThanOrEqual(1);
    expect(text).toContain("ask the array's administrator");
    await context.close();
  });

  it("places the flash message where it hides neither the navigation nor the heading", async () => {
    const { context, page } = await signedInPage(browser, "Inés Arroyo-Vidal", {
      viewport: { width: 1366, height: 900 },
    });
    await page.goto(`${baseUrl}/targets`);
    await page.getByLabel("Name").first().fill("Walkthrough Star 1");
    await page
      .getByLabel(/Right ascension/i)
      .first()
      .fill("05 55 10.3");
    await page
      .getByLabel(/Declination/i)
      .first()
      .fill("+07 24 25");
    await page.getByRole("button", { name: "Add target" }).click();
    const toast = page.getByRole("status").filter({ hasText: /Walkthrough Star 1/ });
    await toast.waitFor();
    const box = await toast.boundingBox();
    const nav = await page.getByRole("navigation", { name: "Sections" }).boundingBox();
    const heading = await page.getByRole("heading", { level: 1 }).first().boundingBox();
    const overlaps = (a: typeof box, b: typeof box) =>
      !!a && !!b && a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;
    expect(box).not.toBeNull();
    expect(overlaps(box, nav)).toBe(false);
    expect(overlaps(box, heading)).toBe(false);
    await screenshot(page, "toast-position");
    await context.close();
  });

  it("exports My proposals with the values the page shows, units and zone in the column names", async () => {
    const { context, page, seen } = await signedInPage(browser, "Inés Arroyo-Vidal", {
      viewport: { width: 1366, height: 900 },
    });
    await page.goto(`${baseUrl}/proposals`);
    const [file] = await Promise.all([
      page.waitForEvent("download"),
      page.getByRole("button", { name: "Export CSV" }).click(),
    ]);
    const csv = Papa.parse<Record<string, string>>(readFileSync((await file.path())!, "utf8"), {
      header: true,
      skipEmptyLines: true,
    });
    expect(csv.errors).toEqual([]);
    expect(csv.meta.fields).toEqual(
      expect.arrayContaining(["Deadline (UTC)", "Hours (h)", "Last change (UTC)", "Status", "Title"]),
    );
    const rows = page.locator("table tbody tr");
    expect(csv.data.length).toBe(await rows.count());
    for (const [i, row] of csv.data.entries()) {
      const shown = ((await rows.nth(i).textContent()) ?? "").replace(/\s+/g, " ");
      // A draft's deadline as the page shows it ("2027-… 12:00 UTC (in 44 days)"), a dash for the rest.
      if (row["Deadline (UTC)"]) {
        expect(row["Deadline (UTC)"]).toMatch(/^\d{4}-\d{2}-\d{2} \d{2}:\d{2}$/);
        expect(shown).toContain(`${row["Deadline (UTC)"]} UTC`);
      } else expect(shown).toContain("—");
      expect(shown).toContain(row.Status);
      expect(shown).toContain(row["Last change (UTC)"]);
    }
    expect(csv.data.some((r) => r["Deadline (UTC)"])).toBe(true);
    await screenshot(page, "proposals-list");
    expect(seen.errors).toEqual([]);
    await context.close();
  });
});
