import { formPost, routeArgs, settle, testDb } from "@test/routes";
import { eq } from "drizzle-orm";
import { beforeEach, describe, expect, it } from "vitest";
import { apiTokens, sessions } from "~/db/schema/auth";
import { users } from "~/db/schema/users";
import { seedDemoScenario } from "~/db/seed/factories.server";
import { getViewer, requireApiUser, requirePermission, requireUser } from "~/lib/guards.server";
import { action as accountAction, loader as accountLoader } from "~/routes/account/index";
import { findUserByEmail } from "~/services/auth/accounts.server";
import { authenticateApiToken, checkApiToken, createApiToken, revokeApiToken } from "~/services/auth/api-tokens.server";
import { SESSION_LIFETIME_MS } from "~/services/auth/config.server";
import { createSession, readCookie, revokeSession, validateSessionToken } from "~/services/auth/sessions.server";
import { hashSecret } from "~/services/auth/tokens.server";

const DAY = 24 * 3600 * 1000;
let userId: number;

beforeEach(async () => {
  // One database per file: start each test with the demo people active and nobody signed in.
  await seedDemoScenario(testDb());
  await testDb().delete(sessions);
  await testDb().delete(apiTokens);
  await testDb().update(users).set({ active: true });
  userId = (await findUserByEmail(testDb(), "ines.arroyo@valle-alto.example"))!.id;
});

const withCookie = (token: string, path = "/") =>
  new Request(`http://localhost:3000${path}`, { headers: { Cookie: `fd_session=${token}` } });

describe("sessions", () => {
  it("stores only the SHA-256 of the cookie token", async () => {
    const { token, session } = await createSession(testDb(), userId, { method: "sso" });
    expect(token).toMatch(/^[a-z2-7]{32}$/);
    expect(session.id).toBe(hashSecret(token));
    const rows = await testDb().select().from(sessions);
    expect(rows.map((r) => r.id)).not.toContain(token);
  });

  it("expires after 30 days without use, and slides forward when used", async () => {
    const t0 = new Date("2027-01-01T00:00:00Z");
    const { token } = await createSession(testDb(), userId, { method: "sso" }, t0);
    // Used on day 20: less than 15 days left, so the expiry moves to day 50.
    const day20 = new Date(t0.getTime() + 20 * DAY);
    const used = await validateSessionToken(testDb(), token, day20);
    expect(used?.renewed).toBe(true);
    expect(used?.session.expiresAt.getTime()).toBe(day20.getTime() + SESSION_LIFETIME_MS);
    // Day 49 still valid, day 51 not.
    expect(await validateSessionToken(testDb(), token, new Date(t0.getTime() + 49 * DAY))).not.toBeNull();
    expect(await validateSessionToken(testDb(), token, new Date(t0.getTime() + 81 * DAY))).toBeNull();
    // An expired session is removed.
    expect(await testDb().select().from(sessions)).toHaveLength(0);
  });

  it("ends on revocation and when the account is deactivated", async () => {
    const a = await createSession(testDb(), userId, { method: "sso" });
    const b = await createSession(testDb(), userId, { method: "email-link" });
    expect(await revokeSession(testDb(), userId, a.session.id)).toBe(true);
    expect(await getViewer(withCookie(a.token))).toBeNull();
    expect(await getViewer(withCookie(b.token))).not.toBeNull();
    await testDb().update(users).set({ active: false }).where(eq(users.id, userId));
    expect(await validateSessionToken(testDb(), b.token)).toBeNull();
  });

  it("lets a person see and revoke only their own sessions", async () => {
    const mine = await createSession(testDb(), userId, { method: "sso", userAgent: "Browser A" });
    const other = await createSession(testDb(), userId, { method: "sso", userAgent: "Browser B" });
    const someoneElse = (await findUserByEmail(testDb(), "kenji.morrow@tidewater.example"))!.id;
    const theirs = await createSession(testDb(), someoneElse, { method: "sso" });

    const page = await accountLoader(routeArgs("/account", { headers: { Cookie: `fd_session=${mine.token}` } }));
    expect(page.sessions.map((s: { id: string }) => s.id).sort()).toEqual([mine.session.id, other.session.id].sort());

    const refused = await accountAction(
      routeArgs(
        "/account",
        formPost({ intent: "revoke-session", sessionId: theirs.session.id }, { Cookie: `fd_session=${mine.token}` }),
      ),
    );
    expect(refused).toMatchObject({ init: { status: 404 } });
    expect(await validateSessionToken(testDb(), theirs.token)).not.toBeNull();

    const ok = await settle(() =>
      accountAction(
        routeArgs(
          "/account",
          formPost({ intent: "revoke-session", sessionId: other.session.id }, { Cookie: `fd_session=${mine.token}` }),
        ),
      ),
    );
    expect(ok.status).toBe(302);
    expect(await validateSessionToken(testDb(), other.token)).toBeNull();
  });

  it("guards: anonymous is sent to sign-in with the way back; a missing role gets 403", async () => {
    const anon = await settle(() => requireUser(new Request("http://localhost:3000/account?tab=x")));
    expect(anon.status).toBe(302);
    expect(anon.headers.get("Location")).toBe("/sign-in?next=%2Faccount%3Ftab%3Dx");
    const { token } = await createSession(testDb(), userId, { method: "sso" });
    let thrown: unknown;
    try {
      await requirePermission(withCookie(token), "users:manage");
    } catch (e) {
      thrown = e;
    }
    expect(thrown).toMatchObject({ init: { status: 403 } });
  });
});

describe("API tokens", () => {
  it("authenticate /api calls with Bearer until revoked; bad tokens get 401 JSON", async () => {
    const { token, row } = await createApiToken(testDb(), userId, "batch script");
    expect(token.startsWith("fdk_")).toBe(true);
    expect(row.tokenHash).toBe(hashSecret(token));
    const bearer = (t: string) =>
      new Request("http://localhost:3000/api/coverage", { method: "POST", headers: { Authorization: `Bearer ${t}` } });

    const viewer = await requireApiUser(bearer(token));
    expect(viewer.user.email).toBe("ines.arroyo@valle-alto.example");
    expect(viewer.via).toBe("token");
    expect((await authenticateApiToken(testDb(), token))?.id).toBe(userId);

    const bad = await settle(() => requireApiUser(bearer("fdk_notarealtoken")));
    expect(bad.status).toBe(401);
    expect(await bad.json()).toMatchObject({ error: expect.stringContaining("API token") });

    expect(await revokeApiToken(testDb(), userId, row.id)).toBe(true);
    const revoked = await settle(() => requireApiUser(bearer(token)));
    expect(revoked.status).toBe(401);
  });

  it("are created and revoked from the account page, shown once", async () => {
    const { token: session } = await createSession(testDb(), userId, { method: "sso" });
    const cookie = { Cookie: `fd_session=${session}` };
    const empty = await accountAction(routeArgs("/account", formPost({ intent: "create-token", name: "   " }, cookie)));
    expect(empty).toMatchObject({
      init: { status: 400 },
      data: { error: expect.stringContaining("Give the token a name") },
    });
    const created = (await accountAction(
      routeArgs(
        "/account",
        formPost(
          { intent: "create-token", name: "nightly plots", scopes: "computations:read", lifetimeDays: "90" },
          cookie,
        ),
      ),
    )) as {
      newToken: { token: string };
    };
    expect(created.newToken.token).toMatch(/^fdk_[a-z2-7]{32}$/);
    const page = await accountLoader(routeArgs("/account", { headers: cookie }));
    expect(JSON.stringify(page)).not.toContain(created.newToken.token);
    expect(page.tokens[0]).toMatchObject({ name: "nightly plots", revokedAt: null, scopes: ["computations:read"] });
  });

  it("carry the scopes they were given and an expiry, 90 days unless chosen otherwise", async () => {
    const t0 = new Date("2027-01-01T00:00:00Z");
    const { token, row } = await createApiToken(testDb(), userId, "plots", { now: t0 });
    expect(row.scopes).toEqual(["computations:read"]);
    expect(row.expiresAt.getTime() - t0.getTime()).toBe(90 * DAY);
    expect((await checkApiToken(testDb(), token, new Date(t0.getTime() + 89 * DAY))).ok).toBe(true);
    expect(await checkApiToken(testDb(), token, new Date(t0.getTime() + 90 * DAY))).toMatchObject({
      ok: false,
      reason: "expired",
    });
    const short = await createApiToken(testDb(), userId, "one week", { lifetimeDays: 7, scopes: ["proposals:read"] });
    expect(short.row.expiresAt.getTime() - short.row.createdAt.getTime()).toBe(7 * DAY);
    await expect(createApiToken(testDb(), userId, "forever", { lifetimeDays: 3650 })).rejects.toThrow(/1 to 365 days/);
    await expect(createApiToken(testDb(), userId, "nothing", { scopes: [] })).rejects.toThrow(/at least one scope/);
  });

  it("are refused past their expiry with a 401 that says so", async () => {
    const past = new Date(Date.now() - 91 * DAY);
    const { token } = await createApiToken(testDb(), userId, "old", { now: past });
    const res = await settle(() =>
      requireApiUser(
        new Request("http://localhost:3000/api/coverage", { headers: { Authorization: `Bearer ${token}` } }),
      ),
    );
    expect(res.status).toBe(401);
    expect((await res.json()).error).toMatch(/^This API token expired on \d{4}-\d\d-\d\d \d\d:\d\d UTC/);
  });

  it("do only what their scopes allow: a token without computations cannot run one", async () => {
    const { token } = await createApiToken(testDb(), userId, "reader", { scopes: ["proposals:read"] });
    const req = () =>
      new Request("http://localhost:3000/api/coverage", {
        method: "POST",
        headers: { Authorization: `Bearer ${token}` },
      });
    const res = await settle(() => requireApiUser(req(), "sketch:use"));
    expect(res.status).toBe(403);
    expect((await res.json()).error).toBe(
      "This API token does not have the computations:read scope; create one that has it.",
    );
    const ok = await requireApiUser(req(), undefined, { scope: "proposals:read" });
    expect(ok.scopes && [...ok.scopes]).toEqual(["proposals:read"]);
  });

  it("never open a page: not the account page, where more tokens could be made, nor People", async () => {
    const { token } = await createApiToken(testDb(), userId, "all of it", {
      scopes: ["computations:read", "proposals:read", "proposals:write"],
    });
    const auth = { Authorization: `Bearer ${token}` };
    const page = await settle(() => accountLoader(routeArgs("/account", { headers: auth })));
    expect(page.status).toBe(403);
    expect(await page.text()).toMatch(/An API token opens the JSON API/);
    const mint = await settle(() =>
      accountAction(
        routeArgs(
          "/account",
          formPost({ intent: "create-token", name: "second", scopes: "computations:read", lifetimeDays: "365" }, auth),
        ),
      ),
    );
    expect(mint.status).toBe(403);
    const asAdmin = await settle(() =>
      requirePermission(new Request("http://localhost:3000/admin/users", { headers: auth }), "users:manage"),
    );
    expect(asAdmin.status).toBe(403);
    expect(await getViewer(new Request("http://localhost:3000/", { headers: auth }))).toBeNull();
    expect((await testDb().select().from(apiTokens).where(eq(apiTokens.userId, userId))).map((t) => t.name)).toEqual([
      "all of it",
    ]);
  });

  it("states the limits on the form and refuses what is outside them with a reason", async () => {
    const { token: session } = await createSession(testDb(), userId, { method: "sso" });
    const cookie = { Cookie: `fd_session=${session}` };
    const post = (fields: Record<string, string | string[]>) =>
      accountAction(routeArgs("/account", formPost({ intent: "create-token", ...fields }, cookie)));
    const cases: [Record<string, string | string[]>, RegExp][] = [
      [{ name: "x".repeat(81), scopes: "computations:read", lifetimeDays: "90" }, /80 characters or fewer/],
      [{ name: "none", lifetimeDays: "90" }, /Tick at least one/],
      [{ name: "odd", scopes: "everything", lifetimeDays: "90" }, /Unknown scope/],
      [{ name: "hex", scopes: "computations:read", lifetimeDays: "0x5a" }, /lifetime must be a whole number/],
      [{ name: "exp", scopes: "computations:read", lifetimeDays: "9e1" }, /lifetime must be a whole number/],
      [
        { name: "long", scopes: "computations:read", lifetimeDays: "3650" },
        /Choose a lifetime of 7, 30, 90, 180, 365 days/,
      ],
    ];
    for (const [fields, message] of cases) {
      const res = await post(fields);
      expect(res, JSON.stringify(fields)).toMatchObject({
        init: { status: 400 },
        data: { error: expect.stringMatching(message) },
      });
    }
    expect(await testDb().select().from(apiTokens).where(eq(apiTokens.userId, userId))).toEqual([]);
    const revokeHex = await accountAction(
      routeArgs("/account", formPost({ intent: "revoke-token", tokenId: "0x10" }, cookie)),
    );
    expect(revokeHex).toMatchObject({ init: { status: 400 }, data: { error: "Unknown token." } });
  });
});

describe("a mangled session cookie", () => {
  it("counts as no cookie, never as an error", async () => {
    for (const cookie of ["fd_session=%", "fd_session=%E0%A4%A", "fd_session=%%%; other=1"]) {
      const req = new Request("http://localhost:3000/account", { headers: { Cookie: cookie } });
      expect(readCookie(req, "fd_session"), cookie).toBeNull();
      expect(await getViewer(req)).toBeNull();
    }
  });
});
