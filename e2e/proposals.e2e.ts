import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, inject, it } from "vitest";
import { demoCycles } from "~/db/seed/scenario";
import { makeTinyPdf } from "~/services/proposals/pdf";
import { screenshot, signedInPage, useBrowser } from "./browser";

const baseUrl = inject("baseUrl");
const browser = useBrowser();
const WIDE = { viewport: { width: 1280, height: 900 } };

describe("proposals", () => {
  it("a proposer writes a proposal, uploads the science case, reads the report, submits and gets the notice", async () => {
    const title = "Limb darkening of Ceniza Lumbre 4";
    const { context, page, seen } = await signedInPage(browser, "Inés Arroyo-Vidal", WIDE);

    // My proposals: the demo proposals where Inés is PI or co-investigator, with their statuses.
    await page.getByRole("navigation", { name: "Sections" }).getByRole("link", { name: "Proposals" }).click();
    await page.getByRole("heading", { level: 1, name: "My proposals" }).waitFor();
    const list = page.getByRole("table", { name: /My proposals/ });
    await expect(list.textContent()).resolves.toContain("Diameters of cool dwarfs in the southern sky");
    await screenshot(page, "proposals-list");

    // A new draft in the open cycle.
    await page.getByRole("link", { name: "New proposal" }).click();
    await page.getByRole("heading", { level: 1, name: "New proposal" }).waitFor();
    await page.getByLabel("Title").fill(title);
    await page.getByRole("button", { name: "Create the draft" }).click();
    await page.getByRole("heading", { level: 1, name: title }).waitFor();

    // The text autosaves about a second after typing.
    const text = page.getByRole("form", { name: "Proposal text" });
    await text
      .getByLabel("Abstract")
      .fill("We will measure the limb darkening of an invented red giant on the compact configuration in the H band.");
    await text.getByLabel("Science category").selectOption("Stellar surfaces and diameters");
    await text.getByLabel("Instrument and band").selectOption({ label: "Brasa — H (1.65 µm, limit 7.5 mag)" });
    await page
      .getByTestId("autosave-status")
      .getByText(/^Saved \d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC$/)
      .waitFor();
    await expect(page.getByText("19 / 300 words").isVisible()).resolves.toBe(true);

    // Hours on the compact configuration.
    const hours = page.getByRole("form", { name: "Requested hours" });
    await hours.getByLabel("compact-3").fill("8");
    await hours.getByRole("button", { name: "Save hours" }).click();
    await page.getByText("Requested hours saved (8 h in all).").waitFor();

    // A typed target.
    await page.getByRole("link", { name: "Add a target" }).click();
    await page.getByRole("heading", { level: 1, name: "New target" }).waitFor();
    await page.getByLabel("Name").fill("Ceniza Lumbre 4");
    await page.getByLabel("Right ascension").fill("09:52:50");
    await page.getByLabel("Declination").fill("-41:22:12");
    await page.getByLabel("Model").selectOption("uniformDisk");
    await page.getByLabel("Diameter").fill("3");
    await page.getByLabel("H band").fill("3.2");
    await page.getByRole("button", { name: "Add a calibrator" }).click();
    await page.getByLabel("Calibrator 1 name").fill("Ceniza Cal");
    await page.getByLabel("RA", { exact: true }).fill("09:58:00");
    await page.getByLabel("Dec", { exact: true }).fill("-40:10:00");
    await screenshot(page, "proposal-target");
    await page.getByRole("button", { name: "Add the target" }).click();
    await page.getByText("Ceniza Lumbre 4 added to the proposal.").waitFor();
    // The target's position as every page writes it: sexagesimal, the degrees in the tooltip.
    await page
      .getByText(/^RA \d{2}:\d{2}:\d{2}\.\d{2}, Dec [+-]\d{2}:\d{2}:\d{2}\.\d$/)
      .first()
      .waitFor();

    // The science case: a small PDF made here.
    const dir = mkdtempSync(join(tmpdir(), "fd-proposal-"));
    const pdf = join(dir, "science-case.pdf");
    writeFileSync(pdf, makeTinyPdf([title, "Science case written for the browser test."]));
    await page.setInputFiles("#document", pdf);
    await page.getByRole("button", { name: "Upload" }).click();
    await page.getByText(/Science case uploaded: science-case\.pdf/).waitFor();
    await screenshot(page, "proposal-editor");

    // The feasibility report, computed by the engine for the target with compact-3.
    await page.getByRole("link", { name: "Feasibility report" }).click();
    await page.getByRole("heading", { level: 1, name: "Feasibility report" }).waitFor();
    await page.getByRole("status", { name: "Overall verdict" }).waitFor();
    const cell = page.getByRole("region", { name: "Ceniza Lumbre 4 with compact-3" });
    const rows = cell.getByRole("row");
    await expect(rows.count()).resolves.toBe(6);
    await expect(cell.getByRole("rowheader", { name: "Resolution" }).isVisible()).resolves.toBe(true);
    await expect(cell.textContent()).resolves.toMatch(/λ\/2B = \d+\.\d\d mas/);
    await screenshot(page, "proposal-feasibility");

    // Submit.
    await page.getByRole("link", { name: "Back to the proposal" }).click();
    await page.getByRole("button", { name: "Submit the proposal" }).click();
    await page
      .getByRole("dialog", { name: "Submit the proposal?" })
      .getByRole("button", { name: "Yes, submit" })
      .click();
    await page.getByText(/^Submitted\. Version 1 is frozen/).waitFor();
    await page.getByRole("link", { name: "Version 1" }).waitFor();
    await screenshot(page, "proposal-submitted");

    // My proposals shows the status.
    await page.getByRole("link", { name: "My proposals" }).first().click();
    await page.getByRole("heading", { level: 1, name: "My proposals" }).waitFor();
    const row = page.getByRole("row").filter({ hasText: title });
    await expect(row.getByText("Submitted", { exact: true }).isVisible()).resolves.toBe(true);

    // The notice is in the mailbox.
    await page.getByRole("navigation", { name: "Sections" }).getByRole("link", { name: "Mailbox" }).click();
    // The demo's open cycle is named after the day the demo was loaded (app/db/seed/demo-cycles.ts).
    await page
      .getByText(`Proposal submitted: "${title}" (${demoCycles(new Date()).open.name})`)
      .first()
      .waitFor();
    await screenshot(page, "proposal-mailbox");
    expect(seen.errors).toEqual([]);
    await context.close();
  });

  it("refuses a file that is not a PDF with a clear message and keeps the page", async () => {
    const { context, page } = await signedInPage(browser, "Tomasz Wierzbicki", WIDE);
    await page.goto(`${baseUrl}/proposals`);
    await page.getByRole("link", { name: "Periastron passage of Quebrada Twin 9" }).click();
    await page.getByRole("heading", { level: 1, name: "Periastron passage of Quebrada Twin 9" }).waitFor();
    const dir = mkdtempSync(join(tmpdir(), "fd-proposal-"));
    const fake = join(dir, "orbit.pdf");
    // A PNG signature under a .pdf name.
    writeFileSync(fake, Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, ...new Array(64).fill(0)]));
    await page.setInputFiles("#document", fake);
    await page.getByRole("button", { name: "Upload" }).click();
    await page.getByText(/The file is not a PDF/).waitFor();
    // What is missing before submission is listed.
    await expect(page.getByRole("list", { name: "Missing before submission" }).textContent()).resolves.toContain(
      "the science case (PDF)",
    );
    await screenshot(page, "proposal-upload-refused");
    await context.close();
  });
});
