import { mkdirSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { type Browser, type BrowserContext, type BrowserContextOptions, chromium, type Page } from "playwright-core";
import { afterAll, beforeAll, expect, inject } from "vitest";

export const ARTIFACTS = fileURLToPath(new URL("./artifacts", import.meta.url));

/**
 * Debian's Chromium, headless, with the flags this sandbox needs (no network beyond loopback).
 * playwright-core gives every launch a fresh, temporary user-data dir of its own.
 */
export async function launchBrowser(): Promise<{ browser: Browser; close: () => Promise<void> }> {
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    headless: true,
    args: [
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
      "--disable-dev-shm-usage",
    ],
  });
  return {
    browser,
    close: () => browser.close(),
  };
}

/**
 * One Chromium for the test file: launched before its tests, closed after them. Returns a handle
 * with the two methods tests use, so a file writes `const browser = useBrowser();` at the top.
 */
export function useBrowser(): Pick<Browser, "newPage" | "newContext"> {
  let launched: Awaited<ReturnType<typeof launchBrowser>> | undefined;
  beforeAll(async () => {
    launched = await launchBrowser();
  });
  afterAll(async () => {
    await launched?.close();
  });
  const current = () => {
    if (!launched) throw new Error("the browser is not running: call useBrowser() at the top of the test file");
    return launched.browser;
  };
  return {
    newPage: (...args) => current().newPage(...args),
    newContext: (...args) => current().newContext(...args),
  };
}

/** Saves a full-page screenshot under e2e/artifacts/ (git-ignored). */
export async function screenshot(page: Page, name: string) {
  mkdirSync(ARTIFACTS, { recursive: true });
  await page.screenshot({ path: join(ARTIFACTS, `${name}.png`), fullPage: true });
}

/**
 * Collects browser console errors and failed requests so a test can assert there were none.
 * The browser also logs every 4xx answer as a console error; those are expected answers to bad input
 * (a form's 400 with field errors, a 404 page) and are kept apart in `clientErrors`.
 */
export function watchPage(page: Page) {
  const errors: string[] = [];
  const clientErrors: string[] = [];
  const requests: string[] = [];
  page.on("console", (msg) => {
    if (msg.type() !== "error") return;
    const text = `${msg.text()} ${msg.location().url ?? ""}`.trim();
    if (/Failed to load resource: the server responded with a status of 4\d\d/.test(text)) clientErrors.push(text);
    else errors.push(text);
  });
  page.on("pageerror", (err) => errors.push(err.message));
  page.on("request", (req) => requests.push(req.url()));
  return { errors, clientErrors, requests };
}

/** Signs in through the local sign-on page by picking a demo person; ends on the home page. */
export async function signInAs(page: Page, name: string) {
  const baseUrl = inject("baseUrl");
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByRole("link", { name: /Continue with/ }).click();
  await page.getByRole("button", { name: new RegExp(name) }).click();
  await page.waitForURL(`${baseUrl}/`);
}

/**
 * A fresh browser context (cookies of its own) with one page, signed in as `name`; `seen` watches the
 * page from before the sign-in. Close `context` at the end of the test.
 */
export async function signedInPage(
  browser: Pick<Browser, "newContext">,
  name: string,
  options?: BrowserContextOptions,
) {
  const context = await browser.newContext(options);
  const page = await context.newPage();
  const seen = watchPage(page);
  await signInAs(page, name);
  return { context, page, seen };
}

/** The query parameters of the page's address, as one object. */
export function addressParams(page: Page): Record<string, string> {
  return Object.fromEntries(new URL(page.url()).searchParams);
}

/** The desktop viewport most browser tests use. */
export const DESKTOP = { viewport: { width: 1366, height: 900 } };

/** Ends a test on a signed-in page: no console error or failed request was seen, then its context closes. */
export async function closeWithoutErrors({ context, seen }: { context: BrowserContext; seen: { errors: string[] } }) {
  expect(seen.errors).toEqual([]);
  await context.close();
}
