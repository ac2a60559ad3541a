/**
 * The proposal editor as a proposer walks through it: the co-investigator field clears after Add,
 * "From my targets" marks what is already on the proposal, a time window outside the cycle is refused,
 * submit (anyway, with a failing line), withdraw and delete ask in a dialog, and hours read as text
 * once the proposal is read-only. Screenshots of the dialogs at 1366 px and 360 px.
 */
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { eq } from "drizzle-orm";
import type { Page } from "playwright-core";
import { beforeAll, describe, expect, inject, it } from "vitest";
import { createDatabase } from "~/db/client.server";
import { targets } from "~/db/schema/proposals";
import { users } from "~/db/schema/users";
import { demoCycles } from "~/db/seed/scenario";
import { makeTinyPdf } from "~/services/proposals/pdf";
import { observingPeriodText } from "~/services/proposals/period";
import { screenshot, signedInPage, useBrowser } from "./browser";

const baseUrl = inject("baseUrl");
const browser = useBrowser();
const WIDE = { viewport: { width: 1366, height: 900 } };
const NARROW = { viewport: { width: 360, height: 780 } };

// Two targets of Inés's own list: one bright, one fainter than the H band's limit (its magnitude line fails).
beforeAll(async () => {
  const { db, client } = createDatabase(inject("databaseUrl"), { max: 1 });
  const [ines] = await db.select().from(users).where(eq(users.name, "Inés Arroyo-Vidal"));
  const mine = (name: string, raDeg: number, decDeg: number, h: number) => ({
    ownerId: ines.id,
    name,
    raDeg,
    decDeg,
    model: { type: "uniformDisk", diameterMas: 1 },
    magnitudes: { H: h },
  });
  await db
    .insert(targets)
    .values([mine("Editor Kite 5", 164.1, -45.6, 4), mine("Editor Faint 9", 152.5, -35, 12)])
    .onConflictDoNothing();
  await client.end();
});

/** A new draft of Inés in the open cycle, its editor open. */
async function newDraft(page: Page, title: string) {
  await page.goto(`${baseUrl}/proposals/new`);
  await page.getByLabel("Title").fill(title);
  await page.getByRole("button", { name: "Create the draft" }).click();
  await page.getByRole("heading", { level: 1, name: title }).waitFor();
}

const flash = (page: Page, text: string | RegExp) => page.getByText(text).first().waitFor();

describe("the proposal editor", () => {
  it("walks a proposer from a draft to a submission with a failing line acknowledged, then a withdrawal", async () => {
    const { context, page, seen } = await signedInPage(browser, "Inés Arroyo-Vidal", WIDE);
    await newDraft(page, "Editor walkthrough");

    const text = page.getByRole("form", { name: "Proposal text" });
    await text.getByLabel("Abstract").fill("Diameters of two invented stars, one of them faint.");
    await text.getByLabel("Science category").selectOption("Stellar surfaces and diameters");
    await text.getByLabel("Instrument and band").selectOption({ label: "Brasa — H (1.65 µm, limit 7.5 mag)" });
    await page
      .getByTestId("autosave-status")
      .getByText(/^Saved /)
      .waitFor();
    const hours = page.getByRole("form", { name: "Requested hours" });
    await hours.getByLabel("compact-3").fill("6");
    await hours.getByRole("button", { name: "Save hours" }).click();
    await flash(page, "Requested hours saved (6 h in all).");

    // From my targets: a target copied in is marked and cannot be chosen again.
    const copy = page.getByRole("form", { name: "Copy from my targets" });
    for (const name of ["Editor Kite 5", "Editor Faint 9"]) {
      await copy.getByLabel("From my targets").selectOption({ label: name });
      await copy.getByRole("button", { name: "Copy into the proposal" }).click();
      await flash(page, `${name} added from your targets.`);
    }
    const added = copy.locator("option", { hasText: "Editor Kite 5 (already added)" });
    await expect(added.isDisabled()).resolves.toBe(true);
    await expect(copy.locator("option", { hasText: "Editor Faint 9 (already added)" }).isDisabled()).resolves.toBe(
      true,
    );

    // A time window outside the cycle's observing period is refused, naming the period in UTC.
    await page.getByRole("link", { name: "Edit Editor Faint 9" }).click();
    await page.getByRole("button", { name: "Add a time window" }).click();
    await page.getByLabel("Window 1 start").fill("2020-01-10T00:00");
    await page.locator(`input[name="windowEnd"]`).first().fill("2020-01-12T00:00");
    await page.getByRole("button", { name: "Save the target" }).click();
    const open = demoCycles(new Date()).open;
    const refusal = page.getByRole("group", { name: /Time-critical windows/ }).getByRole("alert");
    await refusal.waitFor();
    await expect(refusal.textContent()).resolves.toBe(
      `Time window 1: must lie inside the ${open.name} observing period, ${observingPeriodText(open)}.`,
    );
    await screenshot(page, "proposal-editor-window-refused");
    await page.getByRole("link", { name: "Cancel" }).click();

    // The co-investigator field keeps a refused address and clears after a good one is added.
    const team = page.getByRole("form", { name: "Add a co-investigator" });
    const email = team.getByLabel("Co-investigator e-mail");
    await email.fill("not-an-address");
    await team.getByRole("button", { name: "Add" }).click();
    await page.getByText("Co-investigator e-mail: not an e-mail address.").waitFor();
    await expect(email.inputValue()).resolves.toBe("not-an-address");
    await email.fill("tomasz.wierzbicki@baltic-stellar.example");
    await team.getByRole("button", { name: "Add" }).click();
    await flash(page, /tomasz\.wierzbicki@baltic-stellar\.example is now a co-investigator/);
    await expect(
      page.getByRole("form", { name: "Add a co-investigator" }).getByLabel("Co-investigator e-mail").inputValue(),
    ).resolves.toBe("");

    const dir = mkdtempSync(join(tmpdir(), "fd-editor-"));
    const pdf = join(dir, "case.pdf");
    writeFileSync(pdf, makeTinyPdf(["Editor walkthrough", "Science case."]));
    await page.setInputFiles("#document", pdf);
    await page.getByRole("button", { name: "Upload" }).click();
    await flash(page, /Science case uploaded: case\.pdf/);

    // Submit asks first; with a failing line it lists it and wants "submit anyway" ticked.
    await page.getByRole("button", { name: "Submit the proposal" }).click();
    const dialog = page.getByRole("dialog", { name: "Submit with failing feasibility lines?" });
    await dialog.waitFor();
    await expect(dialog.getByRole("list", { name: "Failing feasibility lines" }).textContent()).resolves.toContain(
      "Editor Faint 9 with compact-3 — Magnitude: H = 12.00 mag is fainter than the band's limit",
    );
    await screenshot(page, "proposal-editor-submit-dialog-1366");
    await page.setViewportSize(NARROW.viewport);
    await screenshot(page, "proposal-editor-submit-dialog-360");
    await page.setViewportSize(WIDE.viewport);
    // Escape closes it and nothing is sent.
    await page.keyboard.press("Escape");
    await expect(dialog.isVisible()).resolves.toBe(false);
    await page.getByRole("button", { name: "Submit the proposal" }).click();
    // Without the tick the browser keeps the dialog open.
    await dialog.getByRole("button", { name: "Submit anyway" }).click();
    await expect(dialog.isVisible()).resolves.toBe(true);
    await dialog.getByRole("checkbox", { name: /submit anyway/ }).check();
    await dialog.getByRole("button", { name: "Submit anyway" }).click();
    await flash(page, /^Submitted\. Version 1 is frozen/);
    await page
      .getByText(
        /^Submitted with \d+ feasibility warnings? acknowledged by Inés Arroyo-Vidal, \d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC\.$/,
      )
      .waitFor();

    // Read-only now: the hours are text, not inputs.
    const hoursCard = page.locator("section", { has: page.getByRole("heading", { name: "Requested hours" }) });
    await expect(page.getByRole("textbox", { name: /compact-3/ }).count()).resolves.toBe(0);
    await expect(hoursCard.getByRole("definition").first().textContent()).resolves.toMatch(/^6 h/);
    await screenshot(page, "proposal-editor-submitted");

    // Withdraw asks first; Cancel keeps it submitted.
    await page.getByRole("button", { name: "Withdraw the proposal" }).click();
    const withdraw = page.getByRole("dialog", { name: "Withdraw the proposal?" });
    await withdraw.getByRole("button", { name: "Cancel" }).click();
    await expect(withdraw.isVisible()).resolves.toBe(false);
    await page.getByRole("button", { name: "Withdraw the proposal" }).click();
    await withdraw.getByRole("button", { name: "Yes, withdraw" }).click();
    await flash(page, "Proposal withdrawn; the team has been sent a notice.");
    expect(seen.errors).toEqual([]);
    await context.close();
  });

  it("deletes a draft after the confirmation and goes back to My proposals (360 px)", async () => {
    const { context, page, seen } = await signedInPage(browser, "Inés Arroyo-Vidal", NARROW);
    await newDraft(page, "Editor delete me");
    await page.getByRole("button", { name: "Delete the draft" }).click();
    const dialog = page.getByRole("dialog", { name: "Delete this draft?" });
    await dialog.waitFor();
    // The dialog takes the focus and fits the narrow screen.
    await expect(dialog.evaluate((d) => d.contains(document.activeElement))).resolves.toBe(true);
    const box = await dialog.boundingBox();
    expect(box && box.x >= 0 && box.x + box.width <= 360).toBe(true);
    await screenshot(page, "proposal-editor-delete-dialog-360");
    await dialog.getByRole("button", { name: "Yes, delete the draft" }).click();
    await page.getByRole("heading", { level: 1, name: "My proposals" }).waitFor();
    await flash(page, 'Draft "Editor delete me" deleted, with its team, hours, targets and science case.');
    await expect(page.getByRole("link", { name: "Editor delete me" }).count()).resolves.toBe(0);
    expect(seen.errors).toEqual([]);
    await context.close();
  });
});
