/**
 * The Sketchpad in Chromium, signed in as a proposer through the local sign-on page: plots are drawn
 * by Plotly and follow the inputs (a pick at once, typing once it pauses, a superseded request
 * cancelled, plots updated in place with the heatmaps last), the status line tells the time from the
 * change to the plots drawn, the address carries the inputs, input errors (with the allowed range)
 * appear beside their field, each plot is one Tab stop, and the elevation plot says why each sample
 * is not observable.
 */
import type { Locator, Page } from "playwright-core";
import { describe, expect, inject, it } from "vitest";
import { addressParams, closeWithoutErrors, DESKTOP, screenshot, signedInPage, useBrowser } from "./browser";

const baseUrl = inject("baseUrl");
const browser = useBrowser();

// A target near the meridian at local midnight in mid-March at the demo site, a binary so closure
// phases are not trivially zero.
const SKETCH = "name=Test%20field&ra=11:00:00&dec=-36:00:00&date=2027-03-15&model=binary&sep=4&pa=60&ratio=0.4";
const PERSON = "Inés Arroyo-Vidal";
const HEAVY = ["Dirty beam", "Dirty image of the model"];

/** Number of Plotly traces per drawn figure, keyed by the start of the figure's accessible name. */
async function tracesByFigure(page: Page): Promise<Record<string, number>> {
  return page.evaluate(() => {
    const out: Record<string, number> = {};
    for (const el of document.querySelectorAll(".js-plotly-plot")) {
      const label = el.closest("figure")?.getAttribute("aria-label") ?? "?";
      out[label.split(":")[0].split(" in ")[0].split(",")[0]] = (
        (el as unknown as { data?: unknown[] }).data ?? []
      ).length;
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

const uvTraceCount = async (page: Page) => (await tracesByFigure(page))["uv plane"] ?? -1;

/** The text of the error element an input points to with aria-describedby. */
async function describedText(page: Page, input: Locator): Promise<string | null> {
  const id = await input.getAttribute("aria-describedby");
  return id ? page.locator(`[id="${id}"]`).textContent() : null;
}

/** Every text the status line shows from now on, with the page's clock; and the time of the last input. */
async function watchStatus(page: Page) {
  await page.evaluate(() => {
    const w = window as unknown as { __status: [number, string][]; __input: number };
    w.__status = [];
    w.__input = 0;
    const note = () => {
      w.__input = performance.now();
    };
    document.addEventListener("change", note, true);
    document.addEventListener("input", note, true);
    new MutationObserver(() => {
      const text = document.querySelector('[data-sketch-status="true"]')?.textContent ?? "";
      if (w.__status.at(-1)?.[1] !== text) w.__status.push([performance.now(), text]);
    }).observe(document.body, { subtree: true, childList: true, characterData: true });
  });
  return {
    texts: () => page.evaluate(() => (window as unknown as { __status: [number, string][] }).__status.map((s) => s[1])),
    clear: () =>
      page.evaluate(() => {
        (window as unknown as { __status: unknown[] }).__status = [];
      }),
    /** Milliseconds from the last input to the status line saying "Up to date". */
    elapsed: () =>
      page.evaluate(() => {
        const w = window as unknown as { __status: [number, string][]; __input: number };
        const done = w.__status.find(([t, s]) => t >= w.__input && /^Up to date/.test(s));
        return done ? done[0] - w.__input : null;
      }),
  };
}

const upToDate = (page: Page) => page.getByText(/^Up to date/).waitFor({ timeout: 30_000 });

/** PERSON's Sketchpad at 1366 px on `query` (compact-3 and the test sketch unless given), its first answer shown. */
async function openSketchpad(query = `config=compact-3&${SKETCH}`) {
  const opened = await signedInPage(browser, PERSON, DESKTOP);
  await opened.page.goto(`${baseUrl}/sketchpad?${query}`);
  await upToDate(opened.page);
  return opened;
}

describe("Sketchpad", () => {
  it("draws a shared sketch, follows a configuration change, keeps the inputs in the address and marks bad input", async () => {
    const { context, page, seen } = await openSketchpad();
    // Station map, uv plane, elevation, dirty beam, dirty image, V², closure phases.
    await waitForPlots(page, 7);
    const compact = await tracesByFigure(page);
    // compact-3: 3 baselines, each a track and its Hermitian twin, and 1 triangle.
    expect(compact["uv plane"]).toBe(6);
    expect(compact["Closure phase"]).toBe(1);
    // V²: 1 model curve per position angle (4 for a binary) + 1 trace of samples per baseline.
    expect(compact["Model squared visibility against spatial frequency"]).toBe(4 + 3);
    expect(compact["Dirty beam"]).toBe(2); // heatmap + fitted ellipse
    expect(compact["Dirty image of the model"]).toBe(1);
    expect(compact["Target elevation and air mass against UTC and local sidereal time"]).toBeGreaterThanOrEqual(4);
    const drawn = await page.evaluate(() => ({
      uvLines: document.querySelectorAll('figure[aria-label^="uv plane"] .scatterlayer .js-line').length,
      heatmaps: document.querySelectorAll('figure[aria-label^="Dirty beam"] .hm image').length,
    }));
    expect(drawn.uvLines).toBeGreaterThanOrEqual(6);
    expect(drawn.heatmaps).toBeGreaterThan(0);
    await expect(page.getByText("Angular resolution").isVisible()).resolves.toBe(true);
    await screenshot(page, "sketchpad-compact-3");

    // The address carries every input, completed with the defaults (instrument, band).
    expect(addressParams(page)).toMatchObject({
      config: "compact-3",
      ra: "11:00:00",
      dec: "-36:00:00",
      date: "2027-03-15",
      model: "binary",
      sep: "4",
      inst: "Brasa",
      band: "H",
    });

    // Another configuration: 4 stations → 6 baselines → 12 uv traces, 4 triangles.
    await page.getByLabel("Configuration", { exact: true }).selectOption("medium-4");
    await page.waitForFunction(
      () =>
        (document.querySelector('figure[aria-label^="uv plane"] .js-plotly-plot') as unknown as { data?: unknown[] })
          ?.data?.length === 12,
      null,
      { timeout: 30_000 },
    );
    await upToDate(page);
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
    expect(await describedText(page, dec)).toBe("Declination: must be between -90° and +90° (got -95°)");
    await expect(dec.inputValue()).resolves.toBe("-95:00:00");
    await expect(dec.getAttribute("aria-invalid")).resolves.toBe("true");
    await page.waitForURL(/dec=-95%3A00%3A00/);
    await page.getByText(/last sketch that could be computed/).waitFor();
    await screenshot(page, "sketchpad-bad-declination");

    // A night the page cannot judge (1850) reaches the API; its 400 is shown beside the field.
    await dec.fill("-36:00:00");
    const night = page.getByLabel("Night of");
    await night.fill("1850-03-15");
    await page.getByText("Night: must be a date between the years 1900 and 2200").first().waitFor({ timeout: 30_000 });
    expect(await describedText(page, night)).toBe("Night: must be a date between the years 1900 and 2200");
    expect(seen.clientErrors.some((e) => /status of 400/.test(e))).toBe(true);
    await night.fill("2027-03-15");
    await upToDate(page);
    expect(await uvTraceCount(page)).toBe(12);
    await closeWithoutErrors({ context, seen });
  });

  it("answers a pick at once, typing once it pauses, cancels a superseded request and says how long it took", async () => {
    const { context, page, seen } = await openSketchpad();
    const status = await watchStatus(page);

    // A dropdown pick: no wait for typing; the time given runs from the change to the plots drawn,
    // which is longer than the server's round trip and not longer than what the page took to show it.
    const trips: number[] = [];
    page.on("requestfinished", (r) => {
      if (r.url().endsWith("/api/coverage")) trips.push(r.timing().responseEnd - r.timing().requestStart);
    });
    await page.getByLabel("Configuration", { exact: true }).selectOption("medium-4");
    await page.getByText(/^Up to date: drawn [\d.]+ s after your change/).waitFor({ timeout: 30_000 });
    const texts = await status.texts();
    expect(texts).not.toContain("Waiting for you to finish typing…");
    expect(texts).toContain("Computing the sketch…");
    const said = Number(/drawn ([\d.]+) s/.exec(texts.at(-1) ?? "")?.[1]) * 1000;
    const elapsed = (await status.elapsed()) ?? 0;
    expect(trips.length).toBe(2); // the quick coverage and the one with the beam images
    expect(said).toBeGreaterThan(Math.max(...trips) - 10);
    expect(said).toBeLessThanOrEqual(elapsed + 20);

    // Typing waits for the pause, then computes.
    await status.clear();
    const separation = page.getByRole("textbox", { name: /^Separation/ });
    await separation.fill("4.5");
    await upToDate(page);
    expect(await status.texts()).toContain("Waiting for you to finish typing…");

    // Two picks in quick succession: the answers to the first are no longer wanted and are cancelled.
    await page.route("**/api/coverage", async (route) => {
      await new Promise((r) => setTimeout(r, 400));
      await route.continue().catch(() => {});
    });
    const aborted: string[] = [];
    page.on("requestfailed", (r) => {
      if (r.url().endsWith("/api/coverage")) aborted.push(r.failure()?.errorText ?? "");
    });
    const config = page.getByLabel("Configuration", { exact: true });
    await config.selectOption("extended-6");
    await config.selectOption("compact-3");
    await upToDate(page);
    expect(aborted.length).toBeGreaterThanOrEqual(1);
    expect(aborted.every((e) => /ABORTED/i.test(e))).toBe(true);
    expect(await uvTraceCount(page)).toBe(6);
    await closeWithoutErrors({ context, seen });
  });

  it("updates the plots in place and draws the heatmaps after the other plots", async () => {
    const { context, page, seen } = await openSketchpad();
    await waitForPlots(page, 7);
    // Mark each plot's element and its drawing surface; note when Plotly finishes drawing each one.
    await page.evaluate(() => {
      const w = window as unknown as { __drawnAt: Record<string, number> };
      w.__drawnAt = {};
      for (const el of document.querySelectorAll(".js-plotly-plot")) {
        const gd = el as HTMLElement & { on: (e: string, f: () => void) => void; __mark?: number };
        const name = gd.closest("figure")?.getAttribute("aria-label")?.split(" in ")[0] ?? "?";
        gd.__mark = 1;
        (gd.querySelector(".main-svg") as unknown as { __mark?: number }).__mark = 1;
        gd.on("plotly_afterplot", () => {
          w.__drawnAt[name] = performance.now();
        });
      }
    });
    await page.getByLabel("Configuration", { exact: true }).selectOption("medium-4");
    await page.getByText(/^Up to date: drawn/).waitFor({ timeout: 30_000 });
    const after = await page.evaluate(() => {
      const plots = [...document.querySelectorAll(".js-plotly-plot")];
      return {
        sameElements: plots.every((p) => (p as unknown as { __mark?: number }).__mark === 1),
        sameSurfaces: plots.every((p) => (p.querySelector(".main-svg") as unknown as { __mark?: number }).__mark === 1),
        drawnAt: (window as unknown as { __drawnAt: Record<string, number> }).__drawnAt,
      };
    });
    expect(after.sameElements).toBe(true);
    expect(after.sameSurfaces).toBe(true); // Plotly.react on the drawn plot, not a new plot
    const light = Object.entries(after.drawnAt).filter(([n]) => !HEAVY.includes(n));
    const heavy = Object.entries(after.drawnAt).filter(([n]) => HEAVY.includes(n));
    expect(light.length).toBeGreaterThanOrEqual(4);
    expect(heavy.length).toBe(2);
    expect(Math.min(...heavy.map(([, t]) => t))).toBeGreaterThan(Math.max(...light.map(([, t]) => t)));
    await closeWithoutErrors({ context, seen });
  });

  it("gives each plot one Tab stop, with its toolbar on the arrow keys", async () => {
    const { context, page, seen } = await openSketchpad();
    await waitForPlots(page, 7);
    const stops: Record<string, number> = {};
    let start = "";
    for (let i = 0; i < 160; i++) {
      await page.keyboard.press("Tab");
      const at = await page.evaluate(() => {
        const a = document.activeElement as HTMLElement | null;
        // The imaging preview's images (when the sketch has one) are counted apart from the sketch's plots.
        const fig = a?.closest("figure");
        const preview = !!a?.closest('[aria-labelledby="imaging-preview-title"]');
        return {
          preview,
          key: `${a?.tagName}#${a?.id}|${a?.getAttribute("aria-label")}|${a?.textContent?.slice(0, 20)}`,
          fig: fig?.getAttribute("aria-label") ?? null,
        };
      });
      if (i === 0) start = at.key;
      else if (at.key === start) break; // round the page once
      if (at.fig && !at.preview) stops[at.fig] = (stops[at.fig] ?? 0) + 1;
    }
    // uv plane, elevation, dirty beam, dirty image, V², closure phases: one stop each; the station map
    // has no toolbar (stations are picked with the checkboxes below it).
    expect(Object.keys(stops)).toHaveLength(6);
    for (const n of Object.values(stops)) expect(n).toBe(1);

    const uv = page.locator('figure[aria-label^="uv plane"]');
    await uv.focus();
    await page.keyboard.press("ArrowRight");
    await expect(page.evaluate(() => document.activeElement?.classList.contains("modebar-btn"))).resolves.toBe(true);
    // The toolbar shows while one of its buttons has focus.
    await page.waitForFunction(
      () => getComputedStyle(document.activeElement?.closest(".modebar-group") as Element).opacity === "1",
    );
    await page.keyboard.press("Escape");
    await expect(page.evaluate(() => document.activeElement?.tagName)).resolves.toBe("FIGURE");
    await closeWithoutErrors({ context, seen });
  });

  it("refuses a physically absurd input with the allowed range", async () => {
    const { context, page, seen } = await openSketchpad(
      `config=compact-3&${SKETCH.replace(/model=.*$/, "model=uniformDisk&diam=2")}`,
    );
    const diameter = page.getByRole("textbox", { name: /^Diameter/ });
    expect(await describedText(page, diameter)).toBe("Above 0 and at most 1000 mas.");
    await diameter.fill("1e9");
    const message = "Diameter: must be above 0 and at most 1000 mas (got 1000000000 mas)";
    await page.getByText(message).waitFor();
    expect(await describedText(page, diameter)).toBe(message);
    await expect(page.getByText("Fix the marked inputs to update").isVisible()).resolves.toBe(true);
    await expect(page.getByText(/^Up to date/).count()).resolves.toBe(0);
    await screenshot(page, "sketchpad-absurd-diameter");
    await closeWithoutErrors({ context, seen }); // the API was not asked: nothing refused, nothing logged
  });

  it("marks why each sample is not observable, shows times in UTC and coordinates in sexagesimal", async () => {
    const { context, page, seen } = await signedInPage(browser, PERSON, DESKTOP);
    // The two outriggers farthest apart over ±8 h: low elevation far from the meridian, and the delay
    // line out of range in between (|w| changes by several hundred metres over the night).
    await page.goto(`${baseUrl}/sketchpad?st=X02,X04&ha=-8,8,0.25&${SKETCH}`);
    await upToDate(page);
    const elevation = page.locator('figure[aria-label^="Target elevation and air mass against hour angle"]');
    await elevation.locator(".js-plotly-plot").waitFor();
    const traces = await elevation.evaluate((f) =>
      ((f.querySelector(".js-plotly-plot") as unknown as { data: { name: string; text?: string[] }[] }).data ?? []).map(
        (t) => ({ name: t.name, text: t.text ?? [] }),
      ),
    );
    const names = traces.map((t) => t.name);
    expect(names).toContain("Below the minimum elevation");
    expect(names).toContain("Delay line out of range");
    const delay = traces.find((t) => t.name === "Delay line out of range");
    expect(delay?.text[0]).toMatch(/^Delay line out of range on 1 baseline \(worst X02–X04 needs [\d.]+ m, stroke/);
    const legend = page.getByRole("list", { name: "Elevation plot legend" });
    await expect(legend.getByText("Not observable: delay line out of range").isVisible()).resolves.toBe(true);
    await expect(legend.getByText("Not observable: below the minimum elevation").isVisible()).resolves.toBe(true);
    await screenshot(page, "sketchpad-reasons");

    // A night: the time axis and the notes in UTC, 24-hour; the coordinates sexagesimal, degrees on hover.
    await page.getByLabel("The dark hours of that night").check();
    await page.getByLabel("Configuration", { exact: true }).selectOption("compact-3");
    await page.getByText(/^Up to date: drawn/).waitFor({ timeout: 30_000 });
    await expect(
      page.getByText(/^Observable window(s)?: 2027-03-1[56] \d{2}:\d{2}.*UTC \([\d.]+ h\)/).count(),
    ).resolves.toBe(1);
    await expect(page.getByText(/Moon at local midnight \(\d{2}:\d{2} UTC\)/).count()).resolves.toBe(1);
    const axis = await page
      .locator('figure[aria-label^="Target elevation and air mass against UTC"] .xtitle')
      .first()
      .textContent();
    expect(axis).toBe("Time (UTC)");
    const shown = page.locator('abbr[title^="RA 165.0000°"]');
    await expect(shown.textContent()).resolves.toBe("11:00:00.0 -36:00:00");
    await expect(shown.getAttribute("title")).resolves.toBe("RA 165.0000°, Dec -36.0000° (J2000)");
    await expect(page.locator('abbr[title="165.0000°"]').textContent()).resolves.toBe("11:00:00.00");
    expect(await page.evaluate(() => /\b\d{1,2}:\d{2}\s?(AM|PM)\b/i.test(document.body.textContent ?? ""))).toBe(false);
    await closeWithoutErrors({ context, seen });
  });

  it("fits a 360 px wide screen, with no toolbar over a title", async () => {
    const { context, page, seen } = await signedInPage(browser, PERSON, { viewport: { width: 360, height: 780 } });
    await page.goto(`${baseUrl}/sketchpad?config=medium-4&${SKETCH}`);
    await upToDate(page);
    await waitForPlots(page, 7);
    const overflow = await page.evaluate(
      () => document.documentElement.scrollWidth - document.documentElement.clientWidth,
    );
    expect(overflow).toBeLessThanOrEqual(0);
    for (const figure of await page.locator("figure:has(.modebar)").all()) {
      await figure.scrollIntoViewIfNeeded();
      await figure.hover();
      const clash = await figure.evaluate((f) => {
        const bar = f.querySelector(".modebar")?.getBoundingClientRect();
        if (!bar || bar.width === 0) return "no toolbar";
        const titles = [
          ...f.querySelectorAll("figcaption > *:not(.sr-only), .gtitle, .xtitle, .x2title, .ytitle, .y2title"),
        ];
        const hit = titles.find((t) => {
          const r = t.getBoundingClientRect();
          return r.width > 0 && r.left < bar.right && r.right > bar.left && r.top < bar.bottom && r.bottom > bar.top;
        });
        return hit ? hit.textContent : null;
      });
      expect(clash, `toolbar of ${await figure.getAttribute("aria-label")}`).toBeNull();
    }
    await page.locator('figure[aria-label^="Dirty beam"]').hover();
    await screenshot(page, "sketchpad-360px");
    await closeWithoutErrors({ context, seen });
  });
});
