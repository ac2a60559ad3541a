/**
 * The Sketchpad and the Triangle finder in Chromium, signed in as a proposer through the local
 * sign-on page: plots are drawn by Plotly, follow the inputs, the address carries the inputs, input
 * errors appear beside their field, and a ranked triangle opens in the Sketchpad.
 */

import type { Locator, Page } from "playwright-core";
import { describe, expect, inject, it } from "vitest";
import { screenshot, signInAs, useBrowser, watchPage } from "./browser";

const baseUrl = inject("baseUrl");
const browser = useBrowser();

// A target near the meridian at local midnight in mid-March at the demo site, a binary so closure
// phases are not trivially zero.
const SKETCH = "name=Test%20field&ra=11:00:00&dec=-36:00:00&date=2027-03-15&model=binary&sep=4&pa=60&ratio=0.4";

/** Number of Plotly traces per drawn figure, keyed by the start of the figure's accessible name. */
async function tracesByFigure(page: Page): Promise<Record<string, number>> {
  return page.evaluate(() => {
    const out: Record<string, number> = {};
    for (const el of document.querySelectorAll(".js-plotly-plot")) {
      const label = el.closest("figure")?.getAttribute("aria-label") ?? "?";
      out[label.split(":")[0].split(" in ")[0]] = ((el as unknown as { data?: unknown[] }).data ?? []).length;
    }
    return out;
  });
}

/** Waits until Plotly has drawn `count` figures (each with its data and layout). */
async function waitForPlots(page: Page, count: number) {
  await page.waitForFunction(
    (n) => {
      const plots = [...document.querySelectorAll(".js-plotly-plot")] as unknown as {
        data?: unknown[];
        _fullLayout?: unknown;
      }[];
      return plots.length >= n && plots.every((p) => Array.isArray(p.data) && p._fullLayout);
    },
    count,
    { timeout: 30_000 },
  );
}

async function uvTraceCount(page: Page): Promise<number> {
  return page.evaluate(() => {
    const el = document.querySelector('figure[aria-label^="uv plane"] .js-plotly-plot') as unknown as {
      data?: unknown[];
    } | null;
    return el?.data?.length ?? -1;
  });
}

/** The text of the error element an input points to with aria-describedby. */
async function describedError(page: Page, input: Locator): Promise<string | null> {
  const id = await input.getAttribute("aria-describedby");
  if (!id) return null;
  return page.locator(`[id="${id}"]`).textContent();
}

describe("Sketchpad", () => {
  it("draws a shared sketch, follows a configuration change, keeps the inputs in the address and marks bad input", async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    const seen = watchPage(page);
    await signInAs(page, "Inés Arroyo-Vidal");

    await page.goto(`${baseUrl}/sketchpad?config=compact-3&${SKETCH}`);
    await page.getByText(/^Up to date/).waitFor({ timeout: 30_000 });
    // Station map, uv plane, elevation, dirty beam, dirty image, V², closure phases.
    await waitForPlots(page, 7);
    const compact = await tracesByFigure(page);
    // compact-3: 3 baselines, each drawn twice (measured and Hermitian), and 1 triangle.
    expect(compact["uv plane"]).toBe(6);
    expect(compact["Closure phase"]).toBe(1);
    // V²: 1 model curve per position angle (4 for a binary) + 1 trace of points per baseline.
    expect(compact["Model squared visibility against spatial frequency"]).toBe(4 + 3);
    expect(compact["Dirty beam"]).toBe(2); // heatmap + fitted ellipse
    expect(compact["Dirty image of the model"]).toBe(1);
    expect(
      compact[
        "Target elevation and air mass against UT and local sidereal time, with twilight and the observable window"
      ],
    ).toBeGreaterThanOrEqual(4);
    // Plotly really drew points in the uv plane and cells in the beam heatmap.
    const drawn = await page.evaluate(() => ({
      uvPoints: document.querySelectorAll('figure[aria-label^="uv plane"] .scatterlayer .point').length,
      heatmaps: document.querySelectorAll(
        'figure[aria-label^="Dirty beam"] .heatmaplayer image, figure[aria-label^="Dirty beam"] .hm image',
      ).length,
    }));
    expect(drawn.uvPoints).toBeGreaterThan(100);
    expect(drawn.heatmaps).toBeGreaterThan(0);
    await expect(page.getByText("Angular resolution").isVisible()).resolves.toBe(true);
    await screenshot(page, "sketchpad-compact-3");

    // The address now carries every input, completed with the defaults (instrument, band).
    const url = new URL(page.url());
    expect(Object.fromEntries(url.searchParams)).toMatchObject({
      config: "compact-3",
      ra: "11:00:00",
      dec: "-36:00:00",
      date: "2027-03-15",
      model: "binary",
      sep: "4",
      pa: "60",
      ratio: "0.4",
      inst: "Brasa",
      band: "H",
    });

    // Another configuration: 4 stations → 6 baselines → 12 uv traces, 4 triangles.
    await page.getByLabel("Configuration", { exact: true }).selectOption("medium-4");
    await page.waitForFunction(
      () =>
        (
          document.querySelector('figure[aria-label^="uv plane"] .js-plotly-plot') as unknown as {
            data?: unknown[];
          } | null
        )?.data?.length === 12,
      null,
      { timeout: 30_000 },
    );
    await page.getByText(/^Up to date/).waitFor();
    expect((await tracesByFigure(page))["Closure phase"]).toBe(4);
    await page.waitForURL(/config=medium-4/);

    // The uv plane in metres: same traces, the axis title says so.
    await page.getByText("metres", { exact: true }).click();
    await page.waitForFunction(() =>
      document.querySelector('figure[aria-label^="uv plane"]')?.getAttribute("aria-label")?.includes(" in m,"),
    );
    await page.waitForURL(/uv=m/);
    expect(await uvTraceCount(page)).toBe(12);

    // An impossible declination: the message sits beside the field, the typed text stays.
    const dec = page.getByLabel("Declination", { exact: true });
    await dec.fill("-95:00:00");
    await page.getByText("Declination: must be between -90° and +90° (got -95°)").waitFor();
    expect(await describedError(page, dec)).toBe("Declination: must be between -90° and +90° (got -95°)");
    await expect(dec.inputValue()).resolves.toBe("-95:00:00");
    await expect(dec.getAttribute("aria-invalid")).resolves.toBe("true");
    await page.waitForURL(/dec=-95%3A00%3A00/);
    await page.getByText(/last sketch that could be computed/).waitFor();
    await screenshot(page, "sketchpad-bad-declination");

    // A negative separation passes the page's checks; the API's 400 is shown beside the field.
    await dec.fill("-36:00:00");
    const separation = page.getByRole("textbox", { name: /^Separation/ });
    await separation.fill("-4");
    await page.getByText("Separation: must be zero or positive").waitFor({ timeout: 30_000 });
    expect(await describedError(page, separation)).toBe("Separation: must be zero or positive");
    expect(seen.clientErrors.some((e) => /status of 400/.test(e))).toBe(true);
    await screenshot(page, "sketchpad-api-error");
    await separation.fill("4");
    await page.getByText(/^Up to date/).waitFor({ timeout: 30_000 });

    await page.waitForURL((u) => u.searchParams.get("sep") === "4");
    expect(await uvTraceCount(page)).toBe(12);
    expect(seen.errors).toEqual([]);
    await context.close();
  });

  it("fits a 360 px wide screen", async () => {
    const context = await browser.newContext({ viewport: { width: 360, height: 780 } });
    const page = await context.newPage();
    const seen = watchPage(page);
    await signInAs(page, "Inés Arroyo-Vidal");
    await page.goto(`${baseUrl}/sketchpad?config=medium-4&${SKETCH}`);
    await page.getByText(/^Up to date/).waitFor({ timeout: 30_000 });
    await waitForPlots(page, 7);
    const overflow = await page.evaluate(
      () => document.documentElement.scrollWidth - document.documentElement.clientWidth,
    );
    expect(overflow).toBeLessThanOrEqual(0);
    await screenshot(page, "sketchpad-360px");
    expect(seen.errors).toEqual([]);
    await context.close();
  });
});

describe("Triangle finder", () => {
  it("ranks the triangles of every station and opens one in the Sketchpad", async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    const seen = watchPage(page);
    await signInAs(page, "Inés Arroyo-Vidal");
    await page.goto(`${baseUrl}/triangles?pool=all&${SKETCH}`);
    await page.getByRole("button", { name: "Rank triangles" }).click();
    await page.getByRole("heading", { name: "Ranked triangles" }).waitFor({ timeout: 30_000 });
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
    const url = new URL(page.url());
    expect(url.searchParams.get("st")).toBe(triangle.join(","));
    expect(url.searchParams.get("ra")).toBe("11:00:00");
    expect(url.searchParams.get("model")).toBe("binary");
    expect(url.searchParams.get("date")).toBe("2027-03-15");
    await page.getByText(/^Up to date/).waitFor({ timeout: 30_000 });
    await waitForPlots(page, 7);
    // A free pick of the triangle's three stations: 3 baselines × 2.
    expect(await uvTraceCount(page)).toBe(6);
    await expect(page.getByLabel("Configuration", { exact: true }).inputValue()).resolves.toBe("");
    await screenshot(page, "sketchpad-from-triangle");
    expect(seen.errors).toEqual([]);
    await context.close();
  });
});
