/**
 * A property over the whole app: whatever a client sends (any route of app/routes.ts with any route
 * parameters, query string, cookies, content type and body, anonymous or signed in), the built app
 * never answers with a 5xx. fast-check shrinks a failure to the smallest request that shows it.
 */
import { type BuiltApp, startBuiltApp } from "@test/built-app";
import { testDb } from "@test/routes";
import fc from "fast-check";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { seedDemoScenario } from "~/db/seed/factories.server";
import routes from "~/routes";
import { findUserByEmail } from "~/services/auth/accounts.server";
import { createApiToken } from "~/services/auth/api-tokens.server";
import { createSession } from "~/services/auth/sessions.server";

type RouteNode = { path?: string; index?: boolean; children?: RouteNode[] };

/** Every path pattern of the route config ("/proposals/:proposalId", "/*"). */
function patterns(nodes: RouteNode[], parent = ""): string[] {
  return nodes.flatMap((n) => {
    const here = n.index ? parent || "/" : `${parent}/${n.path ?? ""}`.replace(/\/+/g, "/");
    return [...(n.children ? patterns(n.children, here) : []), ...(n.children && !n.index && !n.path ? [] : [here])];
  });
}

const PATTERNS = [...new Set(patterns(routes as RouteNode[]))];

/** Text that has broken apps before: huge and odd numbers, percent escapes, NUL, CR/LF, slashes. */
const nasty = fc.constantFrom(
  "1",
  "0",
  "-1",
  "1e3",
  "0x10",
  "99999999999999999999",
  "2147483648",
  "1.5",
  "NaN",
  "%",
  "%00",
  "%E0%A4%A",
  "%0D%0A",
  "%5C%5Cevil.example",
  "..%2F..",
  "%2F%2Fevil.example",
  "%F0%9F%94%AD",
  "new",
  "",
);

/** One path segment: a nasty value, or any text percent-encoded. */
const segment = fc.oneof(nasty, fc.string({ maxLength: 40, unit: "binary" }).map(encodeURIComponent));

const pathArb = fc
  .tuple(fc.constantFrom(...PATTERNS), fc.array(segment, { minLength: 4, maxLength: 4 }))
  .map(([pattern, values]) => {
    let i = 0;
    const path = pattern.replace(/:[A-Za-z]+|\*/g, () => values[i++ % values.length] || "x");
    return path.startsWith("/") ? path : `/${path}`;
  });

const queryArb = fc
  .array(
    fc.tuple(fc.constantFrom("next", "q", "page", "token", "error", "site", "version", "ra", "dec", "index"), segment),
    {
      maxLength: 4,
    },
  )
  .map((pairs) => (pairs.length ? `?${pairs.map(([k, v]) => `${k}=${v}`).join("&")}` : ""));

const cookieArb = fc.oneof(
  fc.constant(""),
  fc.constantFrom("fd_session=%", "fd_session=%E0%A4%A", "fd_flash=%", "fd_oidc=%7B", "fd_session=; fd_flash=x"),
  fc.string({ maxLength: 60 }).map((s) => `fd_session=${s.replace(/[;\r\n\0]/g, "")}`),
);

type Body = { type: string | null; body: Uint8Array<ArrayBuffer> | undefined };
const text = (s: string): Uint8Array<ArrayBuffer> => new TextEncoder().encode(s) as Uint8Array<ArrayBuffer>;

const bodyArb: fc.Arbitrary<Body> = fc.oneof(
  fc.constant({ type: null, body: undefined }),
  fc
    .array(
      fc.tuple(
        fc.constantFrom("intent", "name", "email", "token", "next", "userId", "tokenId", "roles", "title", "notes"),
        fc.string({ maxLength: 30, unit: "binary" }),
      ),
      { maxLength: 5 },
    )
    .map((pairs) => ({
      type: "application/x-www-form-urlencoded",
      body: text(new URLSearchParams(pairs).toString()),
    })),
  fc
    .string({ maxLength: 80, unit: "binary" })
    .map((s) => ({ type: "multipart/form-data; boundary=zz", body: text(s) })),
  fc.json({ maxDepth: 3 }).map((s) => ({ type: "application/json", body: text(s) })),
  fc.string({ maxLength: 80 }).map((s) => ({ type: "text/plain", body: text(s) })),
  fc.tuple(fc.string({ maxLength: 30 }), fc.string({ maxLength: 40 })).map(([t, s]) => ({ type: t, body: text(s) })),
);

type Who = "anonymous" | "proposer" | "admin" | "token";

const requestArb = fc.record({
  method: fc.constantFrom("GET", "POST", "POST", "PUT", "DELETE"),
  path: pathArb,
  query: queryArb,
  cookie: cookieArb,
  who: fc.constantFrom<Who>("anonymous", "proposer", "admin", "token"),
  body: bodyArb,
  crossSite: fc.boolean(),
});

let app: BuiltApp;
const credentials: Record<Exclude<Who, "anonymous">, Record<string, string>> = { proposer: {}, admin: {}, token: {} };

beforeAll(async () => {
  const db = testDb();
  await seedDemoScenario(db);
  const proposer = (await findUserByEmail(db, "ines.arroyo@valle-alto.example"))!;
  const admin = (await findUserByEmail(db, "rafael.quispe@sierra-lumbre.example"))!;
  credentials.proposer = { Cookie: `fd_session=${(await createSession(db, proposer.id, { method: "sso" })).token}` };
  credentials.admin = { Cookie: `fd_session=${(await createSession(db, admin.id, { method: "sso" })).token}` };
  credentials.token = { Authorization: `Bearer ${(await createApiToken(db, proposer.id, "property")).token}` };
  app = await startBuiltApp();
});
afterAll(async () => {
  await app?.close();
});

describe("no request makes the app answer 5xx", () => {
  it("covers every route pattern", () => {
    expect(PATTERNS).toContain("/proposals/:proposalId");
    expect(PATTERNS.length).toBeGreaterThan(30);
  });

  it("answers any route, parameters, query, cookies and body with less than 500", async () => {
    await fc.assert(
      fc.asyncProperty(requestArb, async (r) => {
        const headers: Record<string, string> = r.who === "anonymous" ? {} : { ...credentials[r.who] };
        if (r.cookie) headers.Cookie = [headers.Cookie, r.cookie].filter(Boolean).join("; ");
        if (r.crossSite) headers.Origin = "http://evil.example";
        const withBody = r.method !== "GET" && r.body.body !== undefined;
        if (withBody && r.body.type !== null) headers["Content-Type"] = r.body.type.replace(/[\r\n\0]/g, "");
        let res: Response;
        try {
          res = await fetch(`${app.url}${r.path}${r.query}`, {
            method: r.method,
            headers,
            body: withBody ? r.body.body : undefined,
            redirect: "manual",
          });
        } catch (e) {
          // fetch itself refuses some header values; that request never reached the app.
          if (e instanceof TypeError && /header|Headers/i.test(String(e.message) + String(e.cause))) return;
          throw e;
        }
        const body = await res.text();
        expect(res.status, `${r.method} ${r.path}${r.query} → ${res.status}: ${body.slice(0, 200)}`).toBeLessThan(500);
      }),
      { numRuns: 400, seed: Number(process.env.FC_SEED ?? 20270115), endOnFailure: true },
    );
  });
});
