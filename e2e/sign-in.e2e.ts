import { describe, expect, inject, it } from "vitest";
import { DEMO_PEOPLE } from "~/db/seed/scenario";
import { screenshot, signedInPage, useBrowser } from "./browser";

const baseUrl = inject("baseUrl");
const browser = useBrowser();

// The sections each demo role must see in the menu (app/lib/permissions.ts), demo mode on.
const expectedMenus: Record<string, string[]> = {
  "Inés Arroyo-Vidal": ["Sketchpad", "Triangle finder", "Array registry", "My targets", "Proposals", "Mailbox"],
  "Kenji Morrow": ["Sketchpad", "Triangle finder", "Array registry", "Review desk", "Mailbox"],
  "Henrik Solberg": [
    "Sketchpad",
    "Triangle finder",
    "Array registry",
    "Review desk",
    "Ranking board",
    "Cycles",
    "Mailbox",
  ],
  "Mei-Lin Chao": ["Sketchpad", "Triangle finder", "Array registry", "Mailbox"],
  "Rafael Quispe": ["Sketchpad", "Triangle finder", "Array registry", "Mailbox", "People"],
};

describe("sign-in through the local sign-on service", () => {
  for (const [name, menu] of Object.entries(expectedMenus)) {
    const person = DEMO_PEOPLE.find((p) => p.name === name)!;
    it(`signs in ${name} (${person.roles.join(", ")}) and shows that role's menu`, async () => {
      const { context, page, seen } = await signedInPage(browser, name, { viewport: { width: 1280, height: 800 } });
      await page.getByRole("link", { name: "Account", exact: true }).waitFor();
      const items = await page.getByRole("navigation", { name: "Sections" }).getByRole("link").allTextContents();
      expect(items).toEqual(menu);
      // The home page lists the same sections, each with a line on what it is for.
      await page.getByRole("heading", { name: `Your sections, ${name}` }).waitFor();
      const cards = await page
        .getByRole("region", { name: `Your sections, ${name}` })
        .getByRole("link")
        .count();
      expect(cards).toBe(menu.length);
      if (person.roles.includes("proposer")) await screenshot(page, "home-signed-in");
      await page.getByRole("link", { name: "Account", exact: true }).click();
      await page.getByRole("heading", { level: 1, name: "Your account" }).waitFor();
      for (const role of person.roles)
        await expect(page.getByText(role, { exact: true }).first().isVisible()).resolves.toBe(true);
      expect(seen.errors).toEqual([]);
      if (person.roles.includes("admin")) await screenshot(page, "account-admin");
      await context.close();
    });
  }

  it("keeps people out of pages their roles do not allow, with a kind 403", async () => {
    const { context, page } = await signedInPage(browser, "Inés Arroyo-Vidal");
    const response = await page.goto(`${baseUrl}/admin/users`);
    expect(response?.status()).toBe(403);
    await page.getByRole("heading", { level: 1, name: "This page is not yours to open" }).waitFor();
    await screenshot(page, "forbidden");
    await context.close();
  });

  it("lets an administrator grant a role, records it in the audit log and notifies the person", async () => {
    const { context, page } = await signedInPage(browser, "Rafael Quispe", { viewport: { width: 1280, height: 900 } });
    await page.goto(`${baseUrl}/admin/users?q=Kenji`);
    const roles = page.getByRole("form", { name: "Roles of Kenji Morrow" });
    await roles.getByLabel("scheduler").check();
    await roles.getByRole("button", { name: "Save roles" }).click();
    await page.getByText("Roles of Kenji Morrow updated; granted scheduler.").waitFor();
    await page.getByText(/Rafael Quispe role granted \(scheduler\) for Kenji Morrow/).waitFor();
    await screenshot(page, "admin-people");
    await page.goto(`${baseUrl}/mailbox`);
    await page.getByText("Your roles in Fringe Docket have changed").first().waitFor();
    await context.close();
  });

  it("signs out", async () => {
    const { context, page } = await signedInPage(browser, "Mei-Lin Chao");
    await page.getByRole("button", { name: "Sign out" }).click();
    await page.getByRole("banner").getByRole("link", { name: "Sign in", exact: true }).waitFor();
    const response = await page.goto(`${baseUrl}/account`);
    expect(new URL(page.url()).pathname).toBe("/sign-in");
    expect(response?.status()).toBe(200);
    await context.close();
  });
});
