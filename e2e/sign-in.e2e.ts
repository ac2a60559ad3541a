import { type ChildProcess, spawn } from "node:child_process";
import { fileURLToPath } from "node:url";
import { desc, eq } from "drizzle-orm";
import { describe, expect, inject, it } from "vitest";
import { createDatabase } from "~/db/client.server";
import { outboxMessages } from "~/db/schema/mail";
import { DEMO_PEOPLE } from "~/db/seed/scenario";
import { screenshot, signedInPage, useBrowser, watchPage } from "./browser";
import { freePort } from "./setup/app-server";

const baseUrl = inject("baseUrl");
const browser = useBrowser();

// The sections each demo role must see in the menu (app/lib/permissions.ts), demo mode on.
const expectedMenus: Record<string, string[]> = {
  "Inés Arroyo-Vidal": [
    "Sketchpad",
    "Triangle finder",
    "Calibrators",
    "Array registry",
    "My targets",
    "Proposals",
    "Cycles",
    "Mailbox",
  ],
  "Kenji Morrow": ["Sketchpad", "Triangle finder", "Calibrators", "Array registry", "Review desk", "Cycles", "Mailbox"],
  "Henrik Solberg": [
    "Sketchpad",
    "Triangle finder",
    "Calibrators",
    "Array registry",
    "Review desk",
    "Ranking board",
    "Cycles",
    "Mailbox",
  ],
  "Mei-Lin Chao": [
    "Sketchpad",
    "Triangle finder",
    "Calibrators",
    "Array registry",
    "Cycles",
    "Night builder",
    "Mailbox",
  ],
  "Rafael Quispe": ["Sketchpad", "Triangle finder", "Calibrators", "Array registry", "Cycles", "Mailbox", "People"],
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

describe("the app as configured by default", () => {
  it("signs in on a non-default port with no APP_ORIGIN set: sign-on callback and e-mail links follow the port", async () => {
    const [port, idpPort, smtpPort] = [await freePort(), await freePort(), await freePort()];
    const env: NodeJS.ProcessEnv = {
      ...process.env,
      NODE_ENV: "production",
      DATABASE_URL: inject("databaseUrl"),
      PORT: String(port),
      HOST: "127.0.0.1",
      FAKE_IDP_PORT: String(idpPort),
      SMTP_PORT: String(smtpPort),
      MAIL_SENDER_INTERVAL_MS: "500",
      DEMO_MODE: "1",
      // The same database counts every browser test's sign-ins from this one address.
      SIGN_IN_ATTEMPTS_PER_ADDRESS: "100000",
    };
    for (const key of ["APP_ORIGIN", "OIDC_ISSUER", "SMTP_HOST"]) delete env[key];
    const server = spawn(process.execPath, ["--import", "tsx", "scripts/serve.ts"], {
      cwd: fileURLToPath(new URL("..", import.meta.url)),
      env,
      stdio: ["ignore", "pipe", "pipe"],
    });
    const log: string[] = [];
    server.stdout?.on("data", (d) => log.push(String(d)));
    server.stderr?.on("data", (d) => log.push(String(d)));
    const origin = `http://localhost:${port}`;
    try {
      await waitUntilUp(`${origin}/`, server, log);
      expect(log.join("")).toContain(`Fringe Docket is running on ${origin}`);
      const context = await browser.newContext();
      const page = await context.newPage();
      const seen = watchPage(page);
      // This server's sign-on stand-in is another issuer than the one the demo people are linked to,
      // so somebody new signs in (and gets a proposer account).
      await page.goto(`${origin}/sign-in`);
      await page.getByRole("link", { name: /Continue with/ }).click();
      await page.getByLabel("Name").fill("Port Tester");
      await page.getByLabel("E-mail", { exact: true }).fill("port.tester@lagoa-obs.example");
      await page.getByRole("button", { name: "Sign in as this person" }).click();
      await page.waitForURL(`${origin}/`);
      await page.getByRole("link", { name: "Account", exact: true }).waitFor();

      // A sign-in link asked for on this port points at this port, and the page says it is queued.
      const anonymous = await browser.newPage();
      await anonymous.goto(`${origin}/sign-in`);
      await anonymous.getByLabel("E-mail address").fill("kenji.morrow@tidewater.example");
      await anonymous.getByRole("button", { name: "Send me a sign-in link" }).click();
      await anonymous
        .getByText("Your sign-in link for kenji.morrow@tidewater.example is queued for delivery.")
        .waitFor();
      await screenshot(anonymous, "sign-in-queued");
      await anonymous.close();
      const { db, client } = createDatabase(inject("databaseUrl"), { max: 1 });
      const [mail] = await db
        .select()
        .from(outboxMessages)
        .where(eq(outboxMessages.toAddress, "kenji.morrow@tidewater.example"))
        .orderBy(desc(outboxMessages.id))
        .limit(1);
      await client.end();
      expect(mail.text).toContain(`${origin}/auth/email/verify?token=`);
      expect(seen.errors).toEqual([]);
      await context.close();
    } finally {
      await new Promise<void>((resolve) => {
        if (server.exitCode !== null) return resolve();
        server.once("exit", () => resolve());
        server.kill("SIGTERM");
      });
    }
  }, 150_000);

  it("draws the Sketchpad's plots under the Content-Security-Policy without a single violation", async () => {
    const { context, page, seen } = await signedInPage(browser, "Inés Arroyo-Vidal", {
      viewport: { width: 1366, height: 900 },
    });
    await page.addInitScript(() => {
      const w = window as unknown as { cspViolations: string[] };
      w.cspViolations = [];
      document.addEventListener("securitypolicyviolation", (e) =>
        w.cspViolations.push(`${e.violatedDirective} ${e.blockedURI}`),
      );
    });
    const response = await page.goto(
      `${baseUrl}/sketchpad?config=compact-3&ra=11:00:00&dec=-36:00:00&date=2027-03-15&model=binary&sep=4&pa=60&ratio=0.4`,
    );
    expect(response?.headers()["content-security-policy"]).toMatch(/script-src 'self' 'nonce-/);
    await page.waitForFunction(
      () => {
        const plots = [...document.querySelectorAll(".js-plotly-plot")] as unknown as { _fullLayout?: unknown }[];
        return plots.length >= 3 && plots.every((p) => p._fullLayout);
      },
      undefined,
      { timeout: 30_000 },
    );
    const violations = await page.evaluate(() => (window as unknown as { cspViolations: string[] }).cspViolations);
    expect(violations).toEqual([]);
    expect(seen.errors.filter((e) => /Content Security Policy|Refused to/.test(e))).toEqual([]);
    await screenshot(page, "sketchpad-under-csp");
    await context.close();
  });
});

describe("the mailbox as each person's own inbox", () => {
  it("shows an administrator someone else's sign-in link hidden, and a proposer none of it", async () => {
    const anonymous = await browser.newPage();
    await anonymous.goto(`${baseUrl}/sign-in`);
    await anonymous.getByLabel("E-mail address").fill("amara.okafor@harmattan-obs.example");
    await anonymous.getByRole("button", { name: "Send me a sign-in link" }).click();
    await anonymous.getByText(/is queued for delivery/).waitFor();
    await anonymous.close();

    for (const width of [1366, 360]) {
      const admin = await signedInPage(browser, "Rafael Quispe", { viewport: { width, height: 900 } });
      await admin.page.goto(`${baseUrl}/mailbox?q=amara.okafor`);
      await admin.page.getByRole("link", { name: "Your Fringe Docket sign-in link" }).first().click();
      await admin.page.getByText(/one-time sign-in link that is still valid, so it is hidden here/).waitFor();
      const text = await admin.page.locator("pre").textContent();
      expect(text).toContain("token=hidden-until-used-or-expired");
      await screenshot(admin.page, `mailbox-admin-hidden-link-${width}`);
      await admin.context.close();
    }

    const ines = await signedInPage(browser, "Inés Arroyo-Vidal", { viewport: { width: 1366, height: 900 } });
    await ines.page.goto(`${baseUrl}/mailbox?q=amara.okafor`);
    await ines.page.getByText("No message matches “amara.okafor”").waitFor();
    await ines.page.goto(`${baseUrl}/mailbox`);
    await screenshot(ines.page, "mailbox-own");
    await ines.context.close();
  });
});

describe("API tokens on the account page", () => {
  it("makes a token with chosen scopes and lifetime, states the default, and lists both", async () => {
    for (const width of [1366, 360]) {
      const { context, page } = await signedInPage(browser, "Tomasz Wierzbicki", { viewport: { width, height: 900 } });
      await page.goto(`${baseUrl}/account`);
      await page.getByText(/It expires after 90 days unless you choose otherwise/).waitFor();
      await page.getByLabel("Token name").fill(`nightly plots ${width}`);
      await page.getByLabel("Read your own proposals").check();
      await page.getByLabel("Expires after").selectOption("30");
      await page.getByRole("button", { name: "Create token" }).click();
      await page.getByTestId("new-token").waitFor();
      await page
        .getByText(/It may: Run computations \(coverage, ephemeris, triangles\); Read your own proposals\./)
        .waitFor();
      await screenshot(page, `account-new-token-${width}`);
      await context.close();
    }
  });
});

async function waitUntilUp(url: string, server: ChildProcess, log: string[], timeoutMs = 90_000) {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (server.exitCode !== null) throw new Error(`the server exited: ${log.join("")}`);
    try {
      if ((await fetch(url)).status < 500) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`the server did not answer at ${url}: ${log.join("")}`);
}
