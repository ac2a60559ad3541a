import { cookiesFrom, routeArgs, settle, testDb } from "@test/routes";
import { eq } from "drizzle-orm";
import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { users } from "~/db/schema/users";
import { seedDemoScenario } from "~/db/seed/factories.server";
import { getViewer } from "~/lib/guards.server";
import { loader as ssoCallback } from "~/routes/auth/sso-callback";
import { loader as ssoStart } from "~/routes/auth/sso-start";
import { startFakeIdentityProvider } from "../../../scripts/fakes/identity-provider";

const CLIENT = { clientId: "fringe-docket-test", clientSecret: "test-secret-value" };
let idp: Awaited<ReturnType<typeof startFakeIdentityProvider>>;
let shortIdp: Awaited<ReturnType<typeof startFakeIdentityProvider>>;

function useProvider(issuer: string) {
  process.env.OIDC_ISSUER = issuer;
  process.env.OIDC_CLIENT_ID = CLIENT.clientId;
  process.env.OIDC_CLIENT_SECRET = CLIENT.clientSecret;
}

beforeAll(async () => {
  const clients = [{ ...CLIENT, redirectUris: ["http://localhost:3000/auth/sso/callback"] }];
  idp = await startFakeIdentityProvider({ clients });
  shortIdp = await startFakeIdentityProvider({ clients, codeTtlMs: 30 });
  await seedDemoScenario(testDb());
});
afterAll(async () => {
  await idp.stop();
  await shortIdp.stop();
  delete process.env.OIDC_ISSUER;
});
afterEach(() => useProvider(idp.issuer));

/** The browser's part: start, pick an identity on the provider's page, come back with a code. */
async function authorize(
  identity: { email: string; name: string; institute?: string; sub?: string; emailVerified?: boolean },
  next = "/account",
) {
  const start = await settle(() => ssoStart(routeArgs(`/auth/sso/start?next=${encodeURIComponent(next)}`)));
  expect(start.status).toBe(302);
  const authorizeUrl = new URL(start.headers.get("Location")!);
  const flowCookie = cookiesFrom(start);
  expect(flowCookie).toMatch(/^fd_oidc=/);
  const form = new URLSearchParams(authorizeUrl.searchParams);
  form.set("email", identity.email);
  form.set("name", identity.name);
  form.set("institute", identity.institute ?? "");
  if (identity.sub) form.set("sub", identity.sub);
  if (identity.emailVerified === false) form.set("email_verified", "0");
  const consent = await fetch(`${authorizeUrl.origin}/authorize`, { method: "POST", body: form, redirect: "manual" });
  expect(consent.status).toBe(302);
  return { callbackUrl: new URL(consent.headers.get("Location")!), flowCookie };
}

/** A demo person who signs in through the provider in most of these tests. */
const KENJI = { email: "kenji.morrow@tidewater.example", name: "Kenji Morrow" };

/** Where an answer redirects to, decoded (the sign-in page carries its reason in the query). */
const whereTo = (res: Response) => decodeURIComponent(res.headers.get("Location")!);

/** The provider sends the browser back to the callback, with the flow cookie when the browser has it. */
function returnFrom(callbackUrl: URL, flowCookie?: string) {
  const headers = flowCookie ? { Cookie: flowCookie } : undefined;
  return settle(() => ssoCallback(routeArgs(callbackUrl.pathname + callbackUrl.search, { headers })));
}

describe("single sign-on through the local provider", () => {
  it("signs in a known person with PKCE, state and a verified ID token, then returns to `next`", async () => {
    useProvider(idp.issuer);
    const { callbackUrl, flowCookie } = await authorize({
      email: "henrik.solberg@fjellvik.example",
      name: "Henrik Solberg",
    });
    const done = await returnFrom(callbackUrl, flowCookie);
    expect(done.status).toBe(302);
    expect(done.headers.get("Location")).toBe("/account");
    const sessionCookie = done.headers.getSetCookie().find((c) => c.startsWith("fd_session="))!;
    expect(sessionCookie).toMatch(/HttpOnly/);
    expect(sessionCookie).toMatch(/SameSite=Lax/);
    const viewer = await getViewer(
      new Request("http://localhost:3000/", { headers: { Cookie: sessionCookie.split(";")[0] } }),
    );
    expect(viewer?.user.email).toBe("henrik.solberg@fjellvik.example");
    expect(viewer?.roles).toEqual(["reviewer", "chair"]);
    // The SSO identity is now linked to the account.
    const [row] = await testDb().select().from(users).where(eq(users.email, "henrik.solberg@fjellvik.example"));
    expect(row.ssoSubject).toContain(idp.issuer);
  });

  it("creates a proposer account for a first-time identity", async () => {
    useProvider(idp.issuer);
    const { callbackUrl, flowCookie } = await authorize({
      email: "new.person@lagoa-obs.example",
      name: "Noa Ferreira",
      institute: "Lagoa Observatory",
    });
    const done = await returnFrom(callbackUrl, flowCookie);
    expect(done.status).toBe(302);
    const viewer = await getViewer(new Request("http://localhost:3000/", { headers: { Cookie: cookiesFrom(done) } }));
    expect(viewer?.user).toMatchObject({ name: "Noa Ferreira", institute: "Lagoa Observatory" });
    expect(viewer?.roles).toEqual(["proposer"]);
  });

  it("rejects a forged state", async () => {
    useProvider(idp.issuer);
    const { callbackUrl, flowCookie } = await authorize(KENJI);
    callbackUrl.searchParams.set("state", "forged-state-value");
    const done = await returnFrom(callbackUrl, flowCookie);
    expect(done.status).toBe(302);
    expect(whereTo(done)).toContain("the sign-in state did not match");
    expect(done.headers.getSetCookie().some((c) => c.startsWith("fd_session="))).toBe(false);
  });

  it("rejects a callback without the flow cookie (started elsewhere)", async () => {
    useProvider(idp.issuer);
    const { callbackUrl } = await authorize(KENJI);
    const done = await returnFrom(callbackUrl);
    expect(whereTo(done)).toContain("started in another browser");
  });

  it("rejects an expired authorization code", async () => {
    useProvider(shortIdp.issuer);
    const { callbackUrl, flowCookie } = await authorize(KENJI);
    await new Promise((r) => setTimeout(r, 80));
    const done = await returnFrom(callbackUrl, flowCookie);
    expect(whereTo(done)).toContain("rejected the code (invalid_grant)");
  });

  it("rejects a code used twice", async () => {
    useProvider(idp.issuer);
    const { callbackUrl, flowCookie } = await authorize(KENJI);
    const first = await returnFrom(callbackUrl, flowCookie);
    expect(first.headers.getSetCookie().some((c) => c.startsWith("fd_session="))).toBe(true);
    const again = await returnFrom(callbackUrl, flowCookie);
    expect(whereTo(again)).toContain("rejected the code");
  });

  it("refuses a deactivated account", async () => {
    useProvider(idp.issuer);
    await testDb().update(users).set({ active: false }).where(eq(users.email, "mei.chao@sierra-lumbre.example"));
    const { callbackUrl, flowCookie } = await authorize({
      email: "mei.chao@sierra-lumbre.example",
      name: "Mei-Lin Chao",
    });
    const done = await returnFrom(callbackUrl, flowCookie);
    expect(whereTo(done)).toContain("deactivated");
  });

  it("does not redirect to another site after sign-in", async () => {
    useProvider(idp.issuer);
    const { callbackUrl, flowCookie } = await authorize(KENJI, "//evil.example/steal");
    const done = await returnFrom(callbackUrl, flowCookie);
    expect(done.headers.get("Location")).toBe("/");
  });

  it("explains when the provider is unreachable", async () => {
    useProvider("http://127.0.0.1:9");
    const start = await settle(() => ssoStart(routeArgs("/auth/sso/start")));
    expect(whereTo(start)).toContain("Single sign-on is unavailable");
  });

  it("does not redirect to another host through a tab, a backslash or CR/LF in `next`", async () => {
    useProvider(idp.issuer);
    for (const next of ["/\t/evil.example", "/\\evil.example", "/\r\nSet-Cookie: x=1"]) {
      const { callbackUrl, flowCookie } = await authorize(KENJI, next);
      const done = await returnFrom(callbackUrl, flowCookie);
      expect(done.headers.get("Location"), JSON.stringify(next)).toBe("/");
    }
  });
});

describe("linking a sign-on identity to an account", () => {
  const sessionOf = (res: Response) => res.headers.getSetCookie().some((c) => c.startsWith("fd_session="));
  const subjectOf = async (email: string) =>
    (await testDb().select().from(users).where(eq(users.email, email)))[0]?.ssoSubject ?? null;

  it("links by e-mail only when the provider has verified the address", async () => {
    useProvider(idp.issuer);
    const email = "tomasz.wierzbicki@baltic-stellar.example";
    await testDb().update(users).set({ ssoSubject: null }).where(eq(users.email, email));
    const unverified = await authorize({ email, name: "Impostor", sub: "someone-else", emailVerified: false });
    const refused = await returnFrom(unverified.callbackUrl, unverified.flowCookie);
    expect(whereTo(refused)).toContain("has not verified this e-mail address");
    expect(sessionOf(refused)).toBe(false);
    expect(await subjectOf(email)).toBeNull();

    const verified = await authorize({ email, name: "Tomasz Wierzbicki", sub: "tomasz-at-provider" });
    const done = await returnFrom(verified.callbackUrl, verified.flowCookie);
    expect(done.headers.get("Location")).toBe("/account");
    expect(await subjectOf(email)).toBe(`${idp.issuer} tomasz-at-provider`);
  });

  it("creates no account for an address the provider has not verified", async () => {
    useProvider(idp.issuer);
    const { callbackUrl, flowCookie } = await authorize({
      email: "unverified.newcomer@lagoa-obs.example",
      name: "Newcomer",
      emailVerified: false,
    });
    const done = await returnFrom(callbackUrl, flowCookie);
    expect(whereTo(done)).toContain("has not verified your e-mail address");
    expect(await testDb().select().from(users).where(eq(users.email, "unverified.newcomer@lagoa-obs.example"))).toEqual(
      [],
    );
  });

  it("never hands an account linked to one subject to another subject with the same address", async () => {
    useProvider(idp.issuer);
    const email = "amara.okafor@harmattan-obs.example";
    const first = await authorize({ email, name: "Amara Okafor", sub: "amara-1" });
    await returnFrom(first.callbackUrl, first.flowCookie);
    expect(await subjectOf(email)).toBe(`${idp.issuer} amara-1`);
    const second = await authorize({ email, name: "Amara Okafor", sub: "amara-2" });
    const refused = await returnFrom(second.callbackUrl, second.flowCookie);
    expect(whereTo(refused)).toContain("linked to another single sign-on identity");
    expect(sessionOf(refused)).toBe(false);
    expect(await subjectOf(email)).toBe(`${idp.issuer} amara-1`);
  });

  it("finds a linked account by its subject even when the provider's address for it changed", async () => {
    useProvider(idp.issuer);
    const email = "ilse.brandt@nordkap.example";
    await testDb().insert(users).values({ email, name: "Ilse Brandt" });
    const first = await authorize({ email, name: "Ilse Brandt", sub: "ilse-stable" });
    await returnFrom(first.callbackUrl, first.flowCookie);
    expect(await subjectOf(email)).toBe(`${idp.issuer} ilse-stable`);
    const moved = await authorize({ email: "i.brandt@new-domain.example", name: "Ilse Brandt", sub: "ilse-stable" });
    const done = await returnFrom(moved.callbackUrl, moved.flowCookie);
    const viewer = await getViewer(new Request("http://localhost:3000/", { headers: { Cookie: cookiesFrom(done) } }));
    expect(viewer?.user.email).toBe(email);
  });
});
