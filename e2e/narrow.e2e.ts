/**
 * Every page at 360 px wide, as each demo role sees it: nothing is wider than the screen (wide tables
 * scroll inside their own box). A page's detail pages are found by following the first link of its
 * list, so the test walks the demo data as a person would. Screenshots of each page at 360 px.
 */
import { eq } from "drizzle-orm";
import type { Page } from "playwright-core";
import { beforeAll, describe, expect, inject, it } from "vitest";
import { createDatabase } from "~/db/client.server";
import { outboxMessages } from "~/db/schema/mail";
import { users } from "~/db/schema/users";
import { screenshot, signedInPage, useBrowser } from "./browser";

const baseUrl = inject("baseUrl");
const browser = useBrowser();
const NARROW = { viewport: { width: 360, height: 780 } };

// Whatever ran before, Inés has a message with a long subject, so her mailbox is tested with content.
beforeAll(async () => {
  const { db, client } = createDatabase(inject("databaseUrl"), { max: 1 });
  const [ines] = await db.select().from(users).where(eq(users.name, "Inés Arroyo-Vidal"));
  await db.insert(outboxMessages).values({
    kind: "submission",
    toAddress: ines.email,
    subject: "Proposal submitted: “Limb darkening along the giant branch of an invented cluster” (2027B)",
    html: "<p>A notice of the narrow-screen test.</p>",
    text: "A notice of the narrow-screen test.",
    userId: ines.id,
  });
  await client.end();
});

/** A page to visit: a path, or the first link on `from` whose address matches `link`. */
type Visit = string | { from: string; link: RegExp };

const ROLES: { person: string; pages: Visit[] }[] = [
  {
    person: "Inés Arroyo-Vidal",
    pages: [
      "/",
      "/sketchpad",
      "/triangles",
      "/catalogue/calibrators?target=Betelgeuse",
      "/registry",
      { from: "/registry", link: /^\/registry\/stations\/\d+$/ },
      "/targets",
      "/targets/import",
      "/proposals",
      "/proposals/new",
      { from: "/proposals", link: /^\/proposals\/\d+$/ },
      "/mailbox",
      { from: "/mailbox", link: /^\/mailbox\/\d+$/ },
      "/account",
    ],
  },
  {
    person: "Henrik Solberg",
    pages: [
      "/cycles",
      "/cycles/new",
      { from: "/cycles", link: /^\/cycles\/\d+$/ },
      // The demo's cycle under review (as in the access matrix).
      "/cycles/2/assignments",
      "/board",
      { from: "/board", link: /^\/board\/\d+$/ },
      "/review",
    ],
  },
  {
    person: "Kenji Morrow",
    pages: ["/review", { from: "/review", link: /^\/review\/proposals\/\d+$/ }],
  },
  {
    person: "Mei-Lin Chao",
    pages: ["/nights", { from: "/nights", link: /^\/nights\/\d{4}-\d{2}-\d{2}$/ }],
  },
  {
    person: "Rafael Quispe",
    pages: ["/admin/users", "/registry/stations/new", "/registry/import"],
  },
];

/** The address of the first link on the page whose path matches `pattern`. */
async function firstLink(page: Page, pattern: RegExp): Promise<string> {
  const paths = await page
    .locator("a[href]")
    .evaluateAll((links) => links.map((a) => (a as HTMLAnchorElement).getAttribute("href") ?? ""));
  const found = paths.map((p) => p.split(/[?#]/)[0]).find((p) => pattern.test(p));
  if (!found) throw new Error(`no link matching ${pattern} on ${page.url()}`);
  return found;
}

/** How far the page reaches past the right edge of the screen, CSS pixels (0 when it fits). */
const overflow = (page: Page) =>
  page.evaluate(() => Math.max(document.documentElement.scrollWidth, document.body.scrollWidth) - window.innerWidth);

describe("every page at 360 px", () => {
  for (const { person, pages } of ROLES) {
    it(`fits the screen for ${person}`, async () => {
      const { context, page, seen } = await signedInPage(browser, person, NARROW);
      const wide: string[] = [];
      for (const visit of pages) {
        let path: string;
        if (typeof visit === "string") path = visit;
        else {
          await page.goto(`${baseUrl}${visit.from}`);
          path = await firstLink(page, visit.link);
        }
        const res = await page.goto(`${baseUrl}${path}`);
        expect(res?.status(), path).toBe(200);
        await page.waitForLoadState("networkidle");
        const extra = await overflow(page);
        if (extra > 1) wide.push(`${path}: ${extra} px too wide`);
        await screenshot(page, `narrow${path.replace(/[^a-z0-9]+/gi, "-").replace(/-$/, "") || "-home"}`);
      }
      expect(wide).toEqual([]);
      expect(seen.errors).toEqual([]);
      await context.close();
    });
  }
});
