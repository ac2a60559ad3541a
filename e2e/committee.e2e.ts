/**
 * The committee's season in Chromium: the chair starts the review of a cycle and auto-assigns; a
 * reviewer declares a conflict, scores and submits; the chair reads the board, places the triage line,
 * allocates and releases the decisions; the PI's decision e-mail is in the mailbox and the PI's page
 * shows the decision.
 */
import { eq } from "drizzle-orm";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { createDatabase } from "~/db/client.server";
import { bands, configurations } from "~/db/schema/array";
import { reviewAssignments, reviews } from "~/db/schema/committee";
import { cycles, proposalHours, proposals, proposalTargets } from "~/db/schema/proposals";
import { users } from "~/db/schema/users";
import { createCycle } from "~/services/cycles/cycles.server";
import { freezeVersion } from "~/services/proposals/versions.server";
import { screenshot, signedInPage, useBrowser } from "./browser";

const baseUrl = inject("baseUrl");
const browser = useBrowser();
const CYCLE = "Season test";
const TITLES = ["Orbit of Duna Gemela 3", "Diameter of Roca Fria 8", "Envelope of Humo Lento 2"];
const DAY = 86_400_000;
let close: () => Promise<void>;
let db: ReturnType<typeof createDatabase>["db"];
let cycleId = 0;
const proposalIds: number[] = [];

/** A cycle past its deadline, still open, with a committee of three and three submitted proposals by Inés. */
beforeAll(async () => {
  const made = createDatabase(inject("databaseUrl"), { max: 2 });
  db = made.db;
  close = () => made.client.end();
  const people = await db.select().from(users);
  const id = (name: string) => people.find((p) => p.name === name)!.id;
  const [medium] = await db.select().from(configurations).where(eq(configurations.name, "medium-4"));
  const [h] = await db.select().from(bands).where(eq(bands.name, "H"));
  const now = Date.now();
  const cycle = await createCycle(
    db,
    {
      name: CYCLE,
      description: "A cycle for the browser test of the committee's season.",
      observingStart: new Date(now + 120 * DAY).toISOString().slice(0, 10),
      observingEnd: new Date(now + 150 * DAY).toISOString().slice(0, 10),
      submissionDeadline: new Date(now - 2 * DAY),
      reviewDeadline: new Date(now + 10 * DAY),
      decisionDate: null,
      state: "open",
      offers: [{ configurationId: medium.id, nightsAvailable: 3 }],
      committee: [id("Kenji Morrow"), id("Yusuf Karaca"), id("Mirela Voinea")],
    },
    null,
  );
  cycleId = cycle.id;
  for (const [i, title] of TITLES.entries()) {
    await db.transaction(async (tx) => {
      const [p] = await tx
        .insert(proposals)
        .values({
          cycleId,
          piId: id("Inés Arroyo-Vidal"),
          title,
          abstract: `Invented request number ${i + 1}.`,
          scienceCategory: "Stellar surfaces and diameters",
          bandId: h.id,
        })
        .returning();
      proposalIds.push(p.id);
      await tx.insert(proposalHours).values({ proposalId: p.id, configurationId: medium.id, hours: 4 + 2 * i });
      await tx.insert(proposalTargets).values({
        proposalId: p.id,
        name: `${title.split(" of ")[1]}`,
        raDeg: 150 + 25 * i,
        decDeg: -35,
        model: { type: "uniformDisk", diameterMas: 2.5 },
        magnitudes: { H: 3 },
      });
      const [c] = await tx.select().from(cycles).where(eq(cycles.id, cycleId));
      const [locked] = await tx.select().from(proposals).where(eq(proposals.id, p.id)).for("update");
      await freezeVersion(tx, { proposal: locked, cycle: c, submittedById: locked.piId, now: new Date(now - 3 * DAY) });
    });
  }
});
afterAll(async () => {
  await close?.();
});

async function sizes(page: Page, name: string) {
  await page.setViewportSize({ width: 1366, height: 900 });
  await screenshot(page, `${name}-1366`);
  await page.setViewportSize({ width: 360, height: 800 });
  // Plots redraw to the new width on the window's resize event.
  await page.waitForTimeout(500);
  const overflow = await page.evaluate(
    () => document.documentElement.scrollWidth - document.documentElement.clientWidth,
  );
  await screenshot(page, `${name}-360`);
  await page.setViewportSize({ width: 1366, height: 900 });
  return overflow;
}

describe("the committee's season", () => {
  it("runs from the start of the review to the decision on the PI's page", async () => {
    // The chair starts the review and auto-assigns.
    const chair = await signedInPage(browser, "Henrik Solberg", { viewport: { width: 1366, height: 900 } });
    let page = chair.page;
    await page.goto(`${baseUrl}/cycles/${cycleId}`);
    await page.getByRole("heading", { level: 1, name: `Cycle ${CYCLE}` }).waitFor();
    await expect(page.getByText("Nights and darkness").isVisible()).resolves.toBe(true);
    await page.getByRole("button", { name: "Start the review" }).click();
    await page.getByRole("dialog", { name: "Start the review?" }).waitFor();
    expect(await sizes(page, "committee-cycle")).toBeLessThanOrEqual(0);
    await page.getByRole("button", { name: "Yes, start the review" }).click();
    await page.getByText(/3 proposals are under review/).waitFor();
    await page.getByRole("link", { name: "Assignments" }).click();
    await page.getByRole("heading", { level: 1, name: `Assignments — ${CYCLE}` }).waitFor();
    await page.getByLabel("Reviewers per proposal").fill("3");
    await page.getByRole("button", { name: "Preview" }).click();
    const preview = page.getByRole("region", { name: "Auto-assign preview" });
    await preview.getByText("9 new assignments; loads after the run from 3 to 3 per reviewer.").waitFor();
    await preview.getByRole("button", { name: /Save these 9 assignments/ }).click();
    await page.getByText("9 assignments saved; 3 reviewers notified.").waitFor();
    expect(await sizes(page, "committee-assignments")).toBeLessThanOrEqual(0);
    expect(chair.seen.errors).toEqual([]);

    // A reviewer declares a conflict, then scores and submits.
    const kenji = await signedInPage(browser, "Kenji Morrow", { viewport: { width: 1366, height: 900 } });
    page = kenji.page;
    await page.getByRole("navigation", { name: "Sections" }).getByRole("link", { name: "Review desk" }).click();
    await page.getByRole("heading", { level: 1, name: "Review desk" }).waitFor();
    const seat = page.locator("section").filter({ hasText: `Cycle ${CYCLE}` });
    await expect(seat.getByText("0 of 3 submitted").isVisible()).resolves.toBe(true);
    expect(await sizes(page, "committee-desk")).toBeLessThanOrEqual(0);
    await seat.getByRole("link", { name: "Declare conflicts" }).click();
    await page.getByRole("heading", { level: 1, name: `Conflicts — ${CYCLE}` }).waitFor();
    const third = page.getByRole("form", { name: `Declare a conflict on ${TITLES[2]}` });
    await third.getByLabel("Reason for a conflict").fill("I observed this star with the PI last year.");
    await third.getByRole("button", { name: "Declare a conflict" }).click();
    await page.getByText(/Conflict declared; your assignment to it is declined/).waitFor();
    expect(await sizes(page, "committee-conflicts")).toBeLessThanOrEqual(0);
    await page.getByRole("link", { name: "Back to the Review desk" }).click();
    await page.getByRole("link", { name: TITLES[0] }).click();
    await page.getByRole("heading", { level: 1, name: TITLES[0] }).waitFor();
    await page.getByRole("region", { name: "Feasibility report" }).waitFor();
    const form = page.getByRole("form", { name: "Your review" });
    await expect(form.getByText("The cycle's scale: 1 = best … 5 = poorest.").isVisible()).resolves.toBe(true);
    await form.getByLabel("Score").selectOption("2");
    await form.getByLabel("Comment to the PI").fill("A clear case; the configuration resolves the orbit.");
    await form.getByLabel("Comment to the committee").fill("Would grant it.");
    await form.getByLabel("High").check();
    await form.getByRole("button", { name: "Save draft" }).click();
    await page.getByText("Draft saved.").first().waitFor();
    await page.getByRole("button", { name: "Submit…" }).click();
    await page
      .getByRole("dialog", { name: "Submit your review?" })
      .getByRole("button", { name: "Yes, submit" })
      .click();
    await page.getByRole("heading", { name: "Your review (submitted)" }).waitFor();
    await page.getByRole("heading", { name: "The other reviewers" }).waitFor();
    expect(await sizes(page, "committee-review")).toBeLessThanOrEqual(0);
    expect(kenji.seen.errors).toEqual([]);
    await kenji.context.close();

    // The other reviewers' scores arrive (written here, as their own desks would).
    const [kenjiRow] = await db.select().from(users).where(eq(users.name, "Kenji Morrow"));
    const others = await db.select().from(reviewAssignments).where(eq(reviewAssignments.cycleId, cycleId));
    for (const a of others) {
      if (a.status !== "active" || a.reviewerId === kenjiRow.id) continue;
      const score = 1 + proposalIds.indexOf(a.proposalId);
      await db.insert(reviews).values({
        assignmentId: a.id,
        score,
        commentToPi: `Comment ${score}.`,
        confidence: "medium",
        submittedAt: new Date(),
      });
    }

    // The chair closes the review, reads the board, places the triage line, allocates and releases.
    page = chair.page;
    await page.goto(`${baseUrl}/cycles/${cycleId}`);
    await page.getByRole("button", { name: "Close the review" }).click();
    await page.getByRole("button", { name: "Yes, close the review" }).click();
    await page.getByText(/close the review — done/).waitFor();
    await page.goto(`${baseUrl}/board/${cycleId}`);
    await page.getByRole("heading", { level: 1, name: `Ranking board — ${CYCLE}` }).waitFor();
    const table = page.getByRole("table", { name: `Ranking board of ${CYCLE}` });
    await expect(table.locator("tbody tr").count()).resolves.toBe(3);
    await expect(table.locator("tbody tr").first().textContent()).resolves.toContain(TITLES[0]);
    await page.getByRole("figure", { name: /LST pressure of medium-4/ }).waitFor();
    await page.locator(".js-plotly-plot").first().waitFor();
    const triage = page.getByRole("form", { name: "Triage line" });
    await triage.getByLabel("Triage line after position").fill("2");
    await triage.getByRole("button", { name: "Place the line" }).click();
    await page.getByText("Triage line placed after position 2.").waitFor();
    const decisions = page.getByRole("form", { name: "Decisions" });
    // Below the triage line the suggestion is to decline; the chair keeps it, waitlists the second, and
    // grants the first 3.5 h: the chart's allocation follows each change.
    await expect(decisions.getByLabel(`Decision on ${TITLES[2]}`).inputValue()).resolves.toBe("decline");
    await decisions.getByLabel(`Decision on ${TITLES[1]}`).selectOption("waitlist");
    await decisions.getByLabel(`Decision on ${TITLES[0]}`).selectOption("accept");
    await decisions.getByLabel(`Hours of ${TITLES[0]} on medium-4`).fill("3.5");
    await expect(page.getByTestId("lst-sums").textContent()).resolves.toMatch(/allocated 3\.5 h in the bins/);
    await decisions.getByLabel(`Message to the team of ${TITLES[0]}`).fill("Granted 3.5 of the 4 hours.");
    await decisions.getByRole("button", { name: "Save grades and decisions" }).click();
    await page.getByText("Grades and decisions of 3 proposals saved.").waitFor();
    expect(await sizes(page, "committee-board")).toBeLessThanOrEqual(0);
    await page.getByRole("button", { name: "Release the decisions" }).click();
    await page.getByRole("button", { name: "Yes, send them" }).click();
    await page.getByText("3 decisions sent to the teams; the cycle is closed.").waitFor();
    expect(chair.seen.errors).toEqual([]);
    await chair.context.close();

    // The PI reads the decision in the mailbox and on the proposal's page.
    const ines = await signedInPage(browser, "Inés Arroyo-Vidal", { viewport: { width: 1366, height: 900 } });
    page = ines.page;
    await page.goto(`${baseUrl}/mailbox?q=${encodeURIComponent(TITLES[0])}`);
    await page.getByText(`Accepted: "${TITLES[0]}" (${CYCLE})`).first().click();
    await page.getByText("medium-4: 3.5 h").first().waitFor();
    await page.getByText("Granted 3.5 of the 4 hours.").first().waitFor();
    await screenshot(page, "committee-decision-mail");
    await page.goto(`${baseUrl}/proposals/${proposalIds[0]}`);
    await page.getByRole("heading", { level: 1, name: TITLES[0] }).waitFor();
    await expect(page.getByText("Accepted", { exact: true }).first().isVisible()).resolves.toBe(true);
    await screenshot(page, "committee-pi-proposal");
    expect(ines.seen.errors).toEqual([]);
    await ines.context.close();
  });

  it("shows the demo's cycle under review with real content on every screen", async () => {
    const chair = await signedInPage(browser, "Henrik Solberg", { viewport: { width: 1366, height: 900 } });
    await chair.page.getByRole("navigation", { name: "Sections" }).getByRole("link", { name: "Ranking board" }).click();
    await chair.page.getByRole("heading", { level: 1, name: "Ranking board" }).waitFor();
    const [review] = await db.select().from(cycles).where(eq(cycles.state, "reviewing"));
    await chair.page.getByRole("link", { name: review.name, exact: true }).click();
    const table = chair.page.getByRole("table", { name: `Ranking board of ${review.name}` });
    await table.waitFor();
    expect(await table.locator("tbody tr").count()).toBeGreaterThanOrEqual(12);
    await chair.page.locator(".js-plotly-plot").first().waitFor();
    expect(await sizes(chair.page, "committee-demo-board")).toBeLessThanOrEqual(0);
    await chair.page.goto(`${baseUrl}/cycles/${review.id}/assignments`);
    await chair.page
      .getByText(/declined: Outside my field/)
      .first()
      .waitFor();
    expect(await sizes(chair.page, "committee-demo-assignments")).toBeLessThanOrEqual(0);
    expect(chair.seen.errors).toEqual([]);
    await chair.context.close();
  });
});
