import { mkdirSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { chromium, type Browser, type Page } from "playwright-core";

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

/** Saves a full-page screenshot under e2e/artifacts/ (git-ignored). */
export async function screenshot(page: Page, name: string) {
  mkdirSync(ARTIFACTS, { recursive: true });
  await page.screenshot({ path: join(ARTIFACTS, `${name}.png`), fullPage: true });
}

/** Collects browser console errors and failed requests so a test can assert there were none. */
export function watchPage(page: Page) {
  const errors: string[] = [];
  const requests: string[] = [];
  page.on("console", (msg) => {
    if (msg.type() === "error") errors.push(`${msg.text()} ${msg.location().url ?? ""}`.trim());
  });
  page.on("pageerror", (err) => errors.push(err.message));
  page.on("request", (req) => requests.push(req.url()));
  return { errors, requests };
}
