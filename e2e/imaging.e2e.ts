/**
 * The imaging preview in Chromium: a proposer starts a preview on a target of their submitted proposal,
 * watches its progress, sees the model, dirty image and reconstruction with the verdict, and downloads
 * the OIFITS file; a reviewer assigned to the proposal sees the same preview, read-only. The previews
 * are run by the worker process the server starts beside itself (scripts/serve.ts).
 */
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { and, eq, inArray, ne } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { createDatabase } from "~/db/client.server";
import { reviewAssignments, reviewConflicts } from "~/db/schema/committee";
import { imagingJobs } from "~/db/schema/imaging";
import { proposals, proposalTargets } from "~/db/schema/proposals";
import { users } from "~/db/schema/users";
import { ARTIFACTS, closeWithoutErrors, DESKTOP, screenshot, signedInPage, useBrowser } from "./browser";

const baseUrl = inject("baseUrl");
const browser = useBrowser();
const TITLE = "Imaging the spots of Brasero 9";
let close: () => Promise<void>;
let proposalId = 0;
let targetId = 0;
let reviewerName = "";
let cycleId = 0;
let db: ReturnType<typeof createDatabase>["db"];

beforeAll(async () => {
  const made = createDatabase(inject("databaseUrl"), { max: 2 });
  close = () => made.client.end();
  db = made.db;
  const [p] = await db.select().from(proposals).where(eq(proposals.title, TITLE));
  proposalId = p.id;
  cycleId = p.cycleId;
  const [t] = await db.select().from(proposalTargets).where(eq(proposalTargets.proposalId, p.id));
  targetId = t.id;
  // A reviewer with an active assignment to it and no conflict declared.
  const conflicted = await db.select().from(reviewConflicts).where(eq(reviewConflicts.proposalId, p.id));
  const assigned = await db
    .select({ name: users.name, id: users.id })
    .from(reviewAssignments)
    .innerJoin(users, eq(users.id, reviewAssignments.reviewerId))
    .where(and(eq(reviewAssignments.proposalId, p.id), eq(reviewAssignments.status, "active"), ne(users.id, p.piId)));
  const reviewer = assigned.find((a) => !conflicted.some((c) => c.reviewerId === a.id));
  if (!reviewer) throw new Error(`no reviewer without a conflict is assigned to ${TITLE}`);
  reviewerName = reviewer.name;
});
afterAll(async () => {
  // Nothing of this file keeps the worker busy while the other browser tests run.
  await db
    ?.update(imagingJobs)
    .set({ state: "cancelled" })
    .where(inArray(imagingJobs.state, ["queued", "running"]));
  await close?.();
});

describe("imaging preview", () => {
  // A whole preview runs inside this test (queued, reconstructed, shown), then a second is cancelled.
  it("a proposer starts a preview, watches it, sees the images and the verdict, downloads OIFITS", {
    timeout: 300_000,
  }, async () => {
    const { context, page, seen } = await signedInPage(browser, "Oskar Lindfors", DESKTOP);
    await page.goto(`${baseUrl}/proposals/${proposalId}/targets/${targetId}`);
    const panel = page.getByRole("region", { name: "Imaging preview" });
    await panel.getByLabel(/Grid size/).fill("32");
    await panel.getByLabel("Closure phases").selectOption("independent");
    await panel.getByRole("button", { name: "Start the preview" }).click();
    // Progress, live: the iteration count and the reduced χ² while the worker reconstructs.
    // (A small preview may finish between two polls: then the verdict is there before any progress line.)
    await panel
      .getByText(/^Iteration \d+, reduced χ² \d/)
      .or(panel.getByTestId("imaging-verdict"))
      .first()
      .waitFor({ timeout: 150_000 });
    await panel.screenshot({ path: join(ARTIFACTS, "imaging-progress-1366.png") });
    await panel.getByTestId("imaging-verdict").waitFor({ timeout: 180_000 });
    await expect(panel.getByTestId("imaging-verdict").textContent()).resolves.toMatch(/\w{4,}/);
    await expect(panel.getByTestId("imaging-figures").textContent()).resolves.toMatch(/Reduced χ², V²/);
    await expect(panel.getByTestId("imaging-figures").textContent()).resolves.toMatch(/independent triangles/);
    const figures = panel.getByTestId("imaging-images").locator("figure");
    await expect.poll(() => figures.count()).toBe(3);
    await expect.poll(() => panel.locator(".main-svg").count(), { timeout: 20_000 }).toBeGreaterThanOrEqual(3);
    await panel.scrollIntoViewIfNeeded();
    await screenshot(page, "imaging-proposer-1366");

    const [download] = await Promise.all([
      page.waitForEvent("download"),
      panel.getByRole("link", { name: "Download OIFITS" }).click(),
    ]);
    expect(download.suggestedFilename()).toMatch(/^imaging-preview-\d+-Brasero_9.*\.fits$/);
    const bytes = readFileSync((await download.path()) as string);
    // FITS 4.0 §3.1 (2880-byte blocks) and §4.4.1.1 (SIMPLE first); OIFITS 2 tables by EXTNAME (Duvert et al. 2017).
    expect(bytes.byteLength % 2880).toBe(0);
    const text = bytes.toString("latin1");
    expect(text.slice(0, 30)).toMatch(/^SIMPLE {2}=\s+T/);
    for (const ext of ["OI_TARGET", "OI_ARRAY", "OI_WAVELENGTH", "OI_VIS2", "OI_T3"]) expect(text).toContain(`'${ext}`);

    // On a phone: the same page opened at 360 px shows the latest preview, nothing wider than the screen.
    await page.setViewportSize({ width: 360, height: 800 });
    await page.reload();
    await panel.getByTestId("imaging-verdict").waitFor({ timeout: 30_000 });
    await expect.poll(() => panel.locator(".main-svg").count(), { timeout: 20_000 }).toBeGreaterThanOrEqual(3);
    await panel.scrollIntoViewIfNeeded();
    await screenshot(page, "imaging-proposer-360");
    await panel.screenshot({ path: join(ARTIFACTS, "imaging-panel-360.png") });
    const wide = await page.evaluate(() =>
      [...document.querySelectorAll("body *")]
        .filter((el) => el.getBoundingClientRect().right > window.innerWidth + 1)
        .slice(0, 5)
        .map((el) => `${el.tagName}.${el.className}`.slice(0, 80)),
    );
    expect(wide).toEqual([]);

    // A second, larger preview, cancelled while it runs.
    await panel.getByLabel(/Grid size/).fill("128");
    await panel.getByRole("button", { name: "Start the preview" }).click();
    await panel.getByText(/^(Queued|Iteration \d+)/).waitFor({ timeout: 30_000 });
    await panel.getByRole("button", { name: "Cancel" }).click();
    await panel.getByText("This preview was cancelled.").waitFor({ timeout: 10_000 });
    await expect(panel.getByTestId("imaging-job").getAttribute("data-state")).resolves.toBe("cancelled");
    await closeWithoutErrors({ context, seen });
  });

  it("a reviewer assigned to the proposal sees the same preview, read-only", async () => {
    const { context, page, seen } = await signedInPage(browser, reviewerName, DESKTOP);
    await page.goto(`${baseUrl}/review/proposals/${proposalId}`);
    const panel = page.getByRole("region", { name: "Imaging preview" });
    await panel.getByTestId("imaging-verdict").waitFor({ timeout: 30_000 });
    await expect(panel.getByRole("button", { name: "Start the preview" }).count()).resolves.toBe(0);
    await expect(panel.getByRole("button", { name: "Cancel" }).count()).resolves.toBe(0);
    await expect(panel.getByRole("link", { name: "Download OIFITS" }).count()).resolves.toBe(1);
    await expect.poll(() => panel.locator(".main-svg").count(), { timeout: 20_000 }).toBeGreaterThanOrEqual(3);
    await panel.scrollIntoViewIfNeeded();
    await screenshot(page, "imaging-reviewer-1366");
    await page.setViewportSize({ width: 360, height: 800 });
    await screenshot(page, "imaging-reviewer-360");
    await closeWithoutErrors({ context, seen });
  });

  it("the chair queues previews for every imaging target of the cycle and sees the queue", async () => {
    const { context, page, seen } = await signedInPage(browser, "Henrik Solberg", DESKTOP);
    await page.goto(`${baseUrl}/cycles/${cycleId}`);
    const section = page.getByRole("region", { name: "Imaging previews" });
    await section.getByRole("button", { name: "Queue previews for every imaging target" }).click();
    await expect.poll(() => section.textContent(), { timeout: 20_000 }).toMatch(/\d+ previews queued\./);
    await expect.poll(() => section.textContent(), { timeout: 20_000 }).toMatch(/Queue: \d+ waiting, \d+ running/);
    await expect(section.getByRole("table").textContent()).resolves.toMatch(/Brasero 9/);
    // Leave the worker free for the other browser tests: the rest of the queue is cancelled.
    await db.update(imagingJobs).set({ state: "cancelled" }).where(eq(imagingJobs.cycleBatchId, cycleId));
    await section.scrollIntoViewIfNeeded();
    await screenshot(page, "imaging-chair-queue-1366");
    await page.setViewportSize({ width: 360, height: 800 });
    await section.screenshot({ path: join(ARTIFACTS, "imaging-chair-queue-360.png") });
    await closeWithoutErrors({ context, seen });
  });

  it("the Sketchpad previews the sketch as it stands", { timeout: 240_000 }, async () => {
    const { context, page, seen } = await signedInPage(browser, "Inés Arroyo-Vidal", DESKTOP);
    const sketch = "name=Preview%20field&ra=11:00:00&dec=-36:00:00&date=2027-03-15&model=binary&sep=4&pa=60&ratio=0.4";
    await page.goto(`${baseUrl}/sketchpad?config=medium-4&${sketch}`);
    const panel = page.getByRole("region", { name: "Imaging preview" });
    await panel.getByLabel(/Grid size/).fill("32");
    await panel.getByRole("button", { name: "Start the preview" }).click();
    await panel.getByTestId("imaging-verdict").waitFor({ timeout: 180_000 });
    await expect(panel.textContent()).resolves.toMatch(/Preview field \(Sketchpad\)/);
    await expect.poll(() => panel.locator(".main-svg").count(), { timeout: 20_000 }).toBeGreaterThanOrEqual(3);
    await panel.scrollIntoViewIfNeeded();
    await screenshot(page, "imaging-sketchpad-1366");
    await closeWithoutErrors({ context, seen });
  });
});
