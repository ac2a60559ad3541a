/**
 * The built app behind its own server, in this process: client addresses, body caps, content
 * types, security headers and what an API token may open, each as a client on the network sees it.
 */
import { type BuiltApp, rawRequest, startBuiltApp } from "@test/built-app";
import { testDb } from "@test/routes";
import { eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { sessions, signInAttempts } from "~/db/schema/auth";
import { ensureUser } from "~/db/seed/factories.server";
import { createApiToken } from "~/services/auth/api-tokens.server";
import { RATE_LIMITS } from "~/services/auth/config.server";
import { sendSignInLink } from "~/services/auth/email-link.server";
import { createSession } from "~/services/auth/sessions.server";

let app: BuiltApp;
let proxied: BuiltApp;
let cookie: string;
let userId: number;

beforeAll(async () => {
  app = await startBuiltApp();
  proxied = await startBuiltApp({ trustedProxies: ["loopback"] });
  const user = await ensureUser(testDb(), {
    email: "server-test@lumbre.example",
    name: "Server Test",
    roles: ["proposer"],
  });
  userId = user.id;
  cookie = `fd_session=${(await createSession(testDb(), user.id, { method: "sso" })).token}`;
});
afterAll(async () => {
  await app?.close();
  await proxied?.close();
});
beforeEach(async () => {
  await testDb().delete(signInAttempts);
});

/** A sign-in attempt that is refused after the rate limit counted it: a link token that was never issued. */
const attempt = (base: BuiltApp, localAddress: string, headers: Record<string, string> = {}) =>
  rawRequest(`${base.url}/auth/email/verify`, {
    method: "POST",
    localAddress,
    headers: { "Content-Type": "application/x-www-form-urlencoded", ...headers },
    body: "token=abcdefghijklmnopqrstuvwxyz234567",
  });

describe("client addresses", () => {
  it("counts sign-in attempts per real client address: one busy address locks out only itself", async () => {
    for (let i = 0; i < RATE_LIMITS.perAddress; i++) expect((await attempt(app, "127.0.0.2")).status).toBe(400);
    const locked = await attempt(app, "127.0.0.2");
    expect(locked.status).toBe(429);
    expect(locked.body).toContain("Too many sign-in attempts from this network address");
    // Another address is not affected.
    expect((await attempt(app, "127.0.0.3")).status).toBe(400);
    // A forwarded-for header from a client that is not a trusted proxy changes nothing.
    expect((await attempt(app, "127.0.0.2", { "X-Forwarded-For": "198.51.100.9" })).status).toBe(429);
    const keys = (await testDb().select({ key: signInAttempts.key }).from(signInAttempts)).map((r) => r.key);
    expect(new Set(keys)).toEqual(new Set(["ip:127.0.0.2", "ip:127.0.0.3"]));
  });

  it("believes X-Forwarded-For only from a proxy named in TRUSTED_PROXIES", async () => {
    await attempt(proxied, "127.0.0.2", { "X-Forwarded-For": "198.51.100.9" });
    await attempt(proxied, "127.0.0.2", { "X-Forwarded-For": "203.0.113.5, 198.51.100.10" });
    const keys = (await testDb().select({ key: signInAttempts.key }).from(signInAttempts)).map((r) => r.key);
    // The rightmost address a trusted proxy reports is the client: what the client itself wrote
    // before it (203.0.113.5) is not believed.
    expect(keys.sort()).toEqual(["ip:198.51.100.10", "ip:198.51.100.9"]);
  });

  it("records the address a session began from", async () => {
    const link = new URL(await sendSignInLink(testDb(), "server-test@lumbre.example", "/"));
    const res = await rawRequest(`${app.url}/auth/email/verify`, {
      method: "POST",
      localAddress: "127.0.0.4",
      headers: { "Content-Type": "application/x-www-form-urlencoded" },
      body: `token=${link.searchParams.get("token")}&next=/`,
    });
    expect(res.status).toBe(302);
    const rows = await testDb().select().from(sessions).where(eq(sessions.userId, userId));
    expect(rows.map((r) => r.ipAddress)).toContain("127.0.0.4");
  });
});

describe("request bodies", () => {
  const form = { "Content-Type": "application/x-www-form-urlencoded" };

  it("answers a body over the server's cap with a readable 413 page, not a reset", async () => {
    const body = Buffer.alloc(12 * 1024 * 1024, "a");
    const res = await rawRequest(`${app.url}/sign-in`, { method: "POST", headers: form, body });
    expect(res.status).toBe(413);
    expect(res.headers["content-type"]).toMatch(/text\/html/);
    expect(res.body).toContain("That was more than this page takes");
  });

  it("cuts off a chunked body at the cap while it streams, and answers 413", async () => {
    const chunk = Buffer.alloc(1024 * 1024, "b");
    const res = await rawRequest(`${app.url}/proposals/new`, {
      method: "POST",
      headers: { "Content-Type": "multipart/form-data; boundary=xyz", "Transfer-Encoding": "chunked", Cookie: cookie },
      body: Array.from({ length: 13 }, () => chunk),
    });
    expect(res.status).toBe(413);
  });

  it("refuses a form larger than a form may be before any action reads it, with or without a length", async () => {
    const body = `title=${"t".repeat(2 * 1024 * 1024)}`;
    const declared = await rawRequest(`${app.url}/proposals/new`, {
      method: "POST",
      headers: { ...form, Cookie: cookie },
      body,
    });
    expect(declared.status).toBe(413);
    expect(declared.body).toContain("The request is larger than 1 MB.");
    const chunked = await rawRequest(`${app.url}/proposals/new`, {
      method: "POST",
      headers: { ...form, Cookie: cookie, "Transfer-Encoding": "chunked" },
      body: [body.slice(0, 1_000_000), body.slice(1_000_000)],
    });
    expect(chunked.status).toBe(413);
  });

  it("answers JSON to an API call that is too large, and 415 to the wrong content type", async () => {
    const big = await rawRequest(`${app.url}/api/coverage`, {
      method: "POST",
      headers: { "Content-Type": "application/json", Cookie: cookie },
      body: `{"pad":"${"x".repeat(3 * 1024 * 1024)}"}`,
    });
    expect(big.status).toBe(413);
    expect(JSON.parse(big.body)).toEqual({ error: "The request is larger than 2 MB.", field: null });
    const chunkedBig = await rawRequest(`${app.url}/api/coverage`, {
      method: "POST",
      headers: { "Content-Type": "application/json", Cookie: cookie, "Transfer-Encoding": "chunked" },
      body: [`{"pad":"${"x".repeat(3 * 1024 * 1024)}`, `"}`],
    });
    expect(chunkedBig.status).toBe(413);
    expect(JSON.parse(chunkedBig.body).error).toMatch(/larger than 2 MB/);
    const text = await fetch(`${app.url}/api/coverage`, {
      method: "POST",
      headers: { "Content-Type": "text/plain", Cookie: cookie },
      body: "{}",
    });
    expect(text.status).toBe(415);
    expect((await text.json()).error).toBe("This address takes application/json, not text/plain.");
    const page = await fetch(`${app.url}/sign-in`, {
      method: "POST",
      headers: { "Content-Type": "text/plain" },
      body: "x",
    });
    expect(page.status).toBe(415);
    const json = await fetch(`${app.url}/account`, {
      method: "POST",
      headers: { "Content-Type": "application/json", Cookie: cookie },
      body: "{}",
    });
    expect(json.status).toBe(415);
    const broken = await fetch(`${app.url}/sign-in`, {
      method: "POST",
      headers: { "Content-Type": "multipart/form-data; boundary=zz" },
      body: "--zz\r\nnot a part",
    });
    expect(broken.status).toBe(400);
  });
});

describe("security headers", () => {
  it("sends a page's policy with a fresh nonce that its own inline scripts carry", async () => {
    const res = await fetch(`${app.url}/`);
    const csp = res.headers.get("Content-Security-Policy")!;
    const nonce = /'nonce-([^']+)'/.exec(csp)?.[1];
    expect(nonce).toMatch(/^[A-Za-z0-9+/]{22}==$/);
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).toContain("object-src 'none'");
    expect(csp).not.toMatch(/script-src[^;]*'unsafe-inline'/);
    expect(csp).not.toContain("unsafe-eval");
    const html = await res.text();
    const scripts = [...html.matchAll(/<script([^>]*)>/g)].map((m) => m[1]);
    expect(scripts.length).toBeGreaterThan(0);
    for (const attrs of scripts) expect(attrs).toContain(`nonce="${nonce}"`);
    const again = await fetch(`${app.url}/`);
    expect(again.headers.get("Content-Security-Policy")).not.toContain(nonce);
    expect(res.headers.get("X-Content-Type-Options")).toBe("nosniff");
    expect(res.headers.get("Referrer-Policy")).toBe("same-origin");
    expect(res.headers.get("X-Frame-Options")).toBe("DENY");
    expect(res.headers.get("Strict-Transport-Security")).toBeNull();
  });

  it("marks every answer to a signed-in person no-store, the page that shows a new token included", async () => {
    const account = await fetch(`${app.url}/account`, { headers: { Cookie: cookie } });
    expect(account.status).toBe(200);
    expect(account.headers.get("Cache-Control")).toBe("no-store");
    const created = await fetch(`${app.url}/account`, {
      method: "POST",
      headers: { Cookie: cookie, "Content-Type": "application/x-www-form-urlencoded", Origin: app.url },
      body: "intent=create-token&name=cache+check&scopes=computations%3Aread&lifetimeDays=90",
    });
    expect(created.status).toBe(200);
    expect(await created.text()).toContain("copy it now");
    expect(created.headers.get("Cache-Control")).toBe("no-store");
    const data = await fetch(`${app.url}/account.data`, { headers: { Cookie: cookie } });
    expect(data.headers.get("Cache-Control")).toBe("no-store");
  });

  it("adds HSTS when the app is reached over https through a trusted proxy, and only then", async () => {
    const https = await fetch(`${proxied.url}/`, { headers: { "X-Forwarded-Proto": "https" } });
    expect(https.headers.get("Strict-Transport-Security")).toBe("max-age=31536000; includeSubDomains");
    expect(https.headers.get("Content-Security-Policy")).toContain("upgrade-insecure-requests");
    const spoofed = await fetch(`${app.url}/`, { headers: { "X-Forwarded-Proto": "https" } });
    expect(spoofed.headers.get("Strict-Transport-Security")).toBeNull();
  });

  it("gives static files and JSON answers nosniff and no framing", async () => {
    const icon = await fetch(`${app.url}/favicon.svg`);
    expect(icon.headers.get("X-Content-Type-Options")).toBe("nosniff");
    const api = await fetch(`${app.url}/api/coverage`, { method: "POST" });
    expect(api.status).toBe(401);
    expect(api.headers.get("Content-Security-Policy")).toBe("frame-ancestors 'none'");
    expect(api.headers.get("X-Content-Type-Options")).toBe("nosniff");
  });
});

describe("an API token", () => {
  it("opens the API within its scopes and no page at all", async () => {
    const { token } = await createApiToken(testDb(), userId, "server test", {
      scopes: ["computations:read", "proposals:read", "proposals:write"],
    });
    const auth = { Authorization: `Bearer ${token}` };
    for (const path of ["/account", "/admin/users", "/proposals", "/mailbox"]) {
      const res = await fetch(`${app.url}${path}`, { headers: auth, redirect: "manual" });
      expect(res.status, path).toBe(403);
    }
    const mint = await fetch(`${app.url}/account`, {
      method: "POST",
      headers: { ...auth, "Content-Type": "application/x-www-form-urlencoded" },
      body: "intent=create-token&name=child&scopes=computations%3Aread&lifetimeDays=365",
      redirect: "manual",
    });
    expect(mint.status).toBe(403);
    const [{ n }] = await testDb().execute<{ n: number }>(
      sql`select count(*)::int as n from api_tokens where name = 'child'`,
    );
    expect(n).toBe(0);
    const { token: narrow } = await createApiToken(testDb(), userId, "narrow", { scopes: ["proposals:read"] });
    const refused = await fetch(`${app.url}/api/ephemeris`, {
      method: "POST",
      headers: { Authorization: `Bearer ${narrow}`, "Content-Type": "application/json" },
      body: JSON.stringify({ site: { latitudeDeg: -31.4, longitudeDeg: -68.9, altitudeM: 2450 }, date: "2027-03-15" }),
    });
    expect(refused.status).toBe(403);
    expect((await refused.json()).error).toMatch(/computations:read scope/);
  });
});
