/**
 * Who may open what: one table of route families × roles, checked by status code against the
 * production server. Every route in app/routes.ts must appear here, so a new route cannot skip it.
 */

import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { createDatabase } from "~/db/client.server";
import { apiTokens } from "~/db/schema/auth";
import type { Role } from "~/db/schema/users";
import { ensureUser } from "~/db/seed/factories.server";
import routes from "~/routes";
import { createApiToken } from "~/services/auth/api-tokens.server";
import { createSession } from "~/services/auth/sessions.server";

const baseUrl = inject("baseUrl");
type Who = "anonymous" | Role;
const WHO: Who[] = ["anonymous", "proposer", "reviewer", "chair", "scheduler", "admin"];

// Expected outcome per caller: "ok" = 2xx, "sign-in" = redirect to /sign-in, "forbidden" = 403,
// "unauthorized" = 401 JSON, a number = that exact status. One row per route pattern.
type Outcome = "ok" | "sign-in" | "forbidden" | "unauthorized" | number;
type Row = { pattern: string; method: "GET" | "POST"; path: string; body?: unknown; expect: Record<Who, Outcome> };
const all = (o: Outcome): Record<Who, Outcome> => ({
  anonymous: o,
  proposer: o,
  reviewer: o,
  chair: o,
  scheduler: o,
  admin: o,
});
const signedIn = (o: Outcome): Record<Who, Outcome> => ({ ...all(o), anonymous: "sign-in" });
const proposerOnly: Record<Who, Outcome> = {
  anonymous: "sign-in",
  proposer: "ok",
  reviewer: "forbidden",
  chair: "forbidden",
  scheduler: "forbidden",
  admin: "forbidden",
};
const chairOnly: Record<Who, Outcome> = {
  anonymous: "sign-in",
  proposer: "forbidden",
  reviewer: "forbidden",
  chair: "ok",
  scheduler: "forbidden",
  admin: "forbidden",
};
const adminOnly: Record<Who, Outcome> = {
  anonymous: "sign-in",
  proposer: "forbidden",
  reviewer: "forbidden",
  chair: "forbidden",
  scheduler: "forbidden",
  admin: "ok",
};

const coverageBody = {
  site: { latitudeDeg: -31.4, longitudeDeg: -68.9, altitudeM: 2450 },
  stations: [
    { name: "C01", eastM: 0, northM: 0, upM: 0, pathOffsetM: 0 },
    { name: "C02", eastM: 16, northM: 0, upM: 0, pathOffsetM: 0 },
  ],
  target: { raDeg: 84.05, decDeg: -1.2, model: { type: "point" } },
  wavelengthsM: [1.65e-6],
  hourAnglesH: [-1, 0, 1],
  minElevationDeg: 30,
  delayLineStrokeM: null,
};

const MATRIX: Row[] = [
  { pattern: "/", method: "GET", path: "/", expect: all("ok") },
  { pattern: "/sign-in", method: "GET", path: "/sign-in", expect: { ...all(302), anonymous: "ok" } },
  { pattern: "/sign-out", method: "GET", path: "/sign-out", expect: all(302) },
  { pattern: "/auth/sso/start", method: "GET", path: "/auth/sso/start", expect: all(302) },
  // A callback without the flow cookie goes back to the sign-in page with the reason.
  { pattern: "/auth/sso/callback", method: "GET", path: "/auth/sso/callback?code=x&state=y", expect: all("sign-in") },
  { pattern: "/auth/email/verify", method: "GET", path: "/auth/email/verify?token=abc", expect: all("ok") },
  { pattern: "/account", method: "GET", path: "/account", expect: signedIn("ok") },
  { pattern: "/admin/users", method: "GET", path: "/admin/users", expect: adminOnly },
  { pattern: "/registry", method: "GET", path: "/registry", expect: all("ok") },
  // Registry pages by id: the seeded site, its first station, configuration, instrument and band are number 1.
  { pattern: "/registry/stations/:stationId", method: "GET", path: "/registry/stations/1", expect: all("ok") },
  { pattern: "/registry/export/:file", method: "GET", path: "/registry/export/stations.csv", expect: all("ok") },
  { pattern: "/registry/export/:file", method: "GET", path: "/registry/export/registry.json", expect: all("ok") },
  { pattern: "/registry/export/:file", method: "GET", path: "/registry/export/nothing.txt", expect: all(404) },
  { pattern: "/registry/sites/new", method: "GET", path: "/registry/sites/new", expect: adminOnly },
  { pattern: "/registry/sites/:siteId/edit", method: "GET", path: "/registry/sites/1/edit", expect: adminOnly },
  { pattern: "/registry/stations/new", method: "GET", path: "/registry/stations/new", expect: adminOnly },
  {
    pattern: "/registry/stations/:stationId/edit",
    method: "GET",
    path: "/registry/stations/1/edit",
    expect: adminOnly,
  },
  { pattern: "/registry/configurations/new", method: "GET", path: "/registry/configurations/new", expect: adminOnly },
  {
    pattern: "/registry/configurations/:configurationId/edit",
    method: "GET",
    path: "/registry/configurations/1/edit",
    expect: adminOnly,
  },
  { pattern: "/registry/instruments/new", method: "GET", path: "/registry/instruments/new", expect: adminOnly },
  {
    pattern: "/registry/instruments/:instrumentId/edit",
    method: "GET",
    path: "/registry/instruments/1/edit",
    expect: adminOnly,
  },
  {
    pattern: "/registry/instruments/:instrumentId/bands/new",
    method: "GET",
    path: "/registry/instruments/1/bands/new",
    expect: adminOnly,
  },
  { pattern: "/registry/bands/:bandId/edit", method: "GET", path: "/registry/bands/1/edit", expect: adminOnly },
  { pattern: "/registry/import", method: "GET", path: "/registry/import", expect: adminOnly },
  // The guard comes before the body is read: nobody but an administrator gets as far as the form.
  {
    pattern: "/registry/import",
    method: "POST",
    path: "/registry/import",
    body: {},
    expect: { ...adminOnly, admin: 400 },
  },
  {
    pattern: "/sketchpad",
    method: "GET",
    path: "/sketchpad?config=compact-3&ra=05:36:12&dec=-01:12:07",
    expect: signedIn("ok"),
  },
  { pattern: "/triangles", method: "GET", path: "/triangles?pool=all", expect: signedIn("ok") },
  { pattern: "/cycles", method: "GET", path: "/cycles", expect: signedIn("ok") },
  { pattern: "/targets", method: "GET", path: "/targets", expect: proposerOnly },
  { pattern: "/targets/import", method: "GET", path: "/targets/import", expect: proposerOnly },
  { pattern: "/targets/export.csv", method: "GET", path: "/targets/export.csv", expect: proposerOnly },
  // Somebody else's (or no) target: not found, never revealed.
  { pattern: "/targets/:targetId", method: "GET", path: "/targets/999999", expect: { ...proposerOnly, proposer: 404 } },
  // Proposals: proposers only; a proposal of someone else (or none at all) is the same 404.
  { pattern: "/proposals", method: "GET", path: "/proposals", expect: proposerOnly },
  { pattern: "/proposals/new", method: "GET", path: "/proposals/new", expect: proposerOnly },
  {
    pattern: "/proposals/:proposalId",
    method: "GET",
    path: "/proposals/999999",
    expect: { ...proposerOnly, proposer: 404 },
  },
  {
    pattern: "/proposals/:proposalId",
    method: "POST",
    path: "/proposals/1",
    body: {},
    expect: { ...proposerOnly, proposer: 404 },
  },
  {
    pattern: "/proposals/:proposalId/targets/:targetId",
    method: "GET",
    path: "/proposals/1/targets/new",
    expect: { ...proposerOnly, proposer: 404 },
  },
  {
    pattern: "/proposals/:proposalId/feasibility",
    method: "GET",
    path: "/proposals/1/feasibility",
    expect: { ...proposerOnly, proposer: 404 },
  },
  {
    pattern: "/proposals/:proposalId/science-case",
    method: "GET",
    path: "/proposals/4/science-case",
    expect: { ...proposerOnly, proposer: 404 },
  },
  {
    pattern: "/proposals/:proposalId/versions/:version",
    method: "GET",
    path: "/proposals/4/versions/1",
    expect: { ...proposerOnly, proposer: 404 },
  },
  { pattern: "/cycles/new", method: "GET", path: "/cycles/new", expect: chairOnly },
  { pattern: "/cycles/:cycleId/edit", method: "GET", path: "/cycles/1/edit", expect: chairOnly },
  // Demo mode (as the test server runs): every signed-in person may read the mailbox.
  { pattern: "/mailbox", method: "GET", path: "/mailbox", expect: signedIn("ok") },
  { pattern: "/mailbox/:messageId", method: "GET", path: "/mailbox/999999", expect: signedIn(404) },
  {
    pattern: "/api/coverage",
    method: "POST",
    path: "/api/coverage",
    body: coverageBody,
    expect: { ...all("ok"), anonymous: "unauthorized" },
  },
  {
    pattern: "/api/ephemeris",
    method: "POST",
    path: "/api/ephemeris",
    body: { site: coverageBody.site, date: "2027-03-15" },
    expect: { ...all("ok"), anonymous: "unauthorized" },
  },
  {
    pattern: "/api/triangles",
    method: "POST",
    path: "/api/triangles",
    body: {},
    expect: { ...all(400), anonymous: "unauthorized" },
  },
  { pattern: "/*", method: "GET", path: "/no/such/page", expect: all(404) },
];

type RouteNode = { path?: string; index?: boolean; children?: RouteNode[] };
function patterns(nodes: RouteNode[], parent = ""): string[] {
  return nodes.flatMap((n) => {
    const here = n.index ? parent || "/" : `${parent}/${n.path ?? ""}`.replace(/\/+/g, "/");
    return [...(n.children ? patterns(n.children, here) : []), ...(n.children && !n.index && !n.path ? [] : [here])];
  });
}

const cookies: Partial<Record<Who, string>> = {};
let tokenOfProposer = "";
let close: () => Promise<void>;

beforeAll(async () => {
  const { db, client } = createDatabase(inject("databaseUrl"), { max: 2 });
  close = () => client.end();
  for (const role of WHO) {
    if (role === "anonymous") continue;
    const user = await ensureUser(db, {
      email: `matrix-${role}@matrix.example`,
      name: `Matrix ${role}`,
      roles: [role],
    });
    const { token } = await createSession(db, user.id, { method: "sso" });
    cookies[role] = `fd_session=${token}`;
    if (role === "proposer") tokenOfProposer = (await createApiToken(db, user.id, "matrix")).token;
  }
});
afterAll(async () => {
  await close?.();
});

function judge(res: Response): Outcome {
  if (res.status === 302 && (res.headers.get("Location") ?? "").startsWith("/sign-in")) return "sign-in";
  if (res.status === 403) return "forbidden";
  if (res.status === 401) return "unauthorized";
  if (res.status >= 200 && res.status < 300) return "ok";
  return res.status;
}

describe("access matrix", () => {
  it("lists every route of app/routes.ts", () => {
    const declared = new Set(patterns(routes as RouteNode[]));
    const covered = new Set(MATRIX.map((r) => r.pattern));
    expect([...declared].filter((p) => !covered.has(p))).toEqual([]);
  });

  for (const row of MATRIX) {
    it(`${row.method} ${row.path}`, async () => {
      const outcomes: Partial<Record<Who, Outcome>> = {};
      for (const who of WHO) {
        const headers: Record<string, string> = {};
        if (cookies[who as Role]) headers.Cookie = cookies[who as Role]!;
        if (row.body !== undefined) headers["Content-Type"] = "application/json";
        const res = await fetch(`${baseUrl}${row.path}`, {
          method: row.method,
          headers,
          body: row.body === undefined ? undefined : JSON.stringify(row.body),
          redirect: "manual",
        });
        outcomes[who] = judge(res);
        await res.arrayBuffer();
      }
      expect(outcomes).toEqual(row.expect);
    });
  }

  it("accepts an API token in place of a session, and refuses a bad one with 401 JSON", async () => {
    const ok = await fetch(`${baseUrl}/api/coverage`, {
      method: "POST",
      headers: { Authorization: `Bearer ${tokenOfProposer}`, "Content-Type": "application/json" },
      body: JSON.stringify(coverageBody),
    });
    expect(ok.status).toBe(200);
    const bad = await fetch(`${baseUrl}/api/coverage`, {
      method: "POST",
      headers: { Authorization: "Bearer fdk_wrong", "Content-Type": "application/json" },
      body: JSON.stringify(coverageBody),
    });
    expect(bad.status).toBe(401);
    expect(bad.headers.get("Content-Type")).toMatch(/application\/json/);
  });

  it("refuses cross-site posts even with a valid session, and writes nothing", async () => {
    // Page forms: React Router's own origin check answers 400 before our middleware's 403; either
    // way the action never runs.
    const res = await fetch(`${baseUrl}/account`, {
      method: "POST",
      headers: {
        Cookie: cookies.admin!,
        Origin: "http://evil.example",
        "Content-Type": "application/x-www-form-urlencoded",
      },
      body: "intent=create-token&name=stolen",
      redirect: "manual",
    });
    expect([400, 403]).toContain(res.status);
    const marked = await fetch(`${baseUrl}/account`, {
      method: "POST",
      headers: {
        Cookie: cookies.admin!,
        "Sec-Fetch-Site": "cross-site",
        "Content-Type": "application/x-www-form-urlencoded",
      },
      body: "intent=create-token&name=stolen",
      redirect: "manual",
    });
    expect(marked.status).toBe(403);
    const api = await fetch(`${baseUrl}/api/coverage`, {
      method: "POST",
      headers: { Cookie: cookies.proposer!, Origin: "http://evil.example", "Content-Type": "application/json" },
      body: JSON.stringify(coverageBody),
    });
    expect(api.status).toBe(403);
    expect((await api.json()).error).toMatch(/not accepted/);
    const { db, client } = createDatabase(inject("databaseUrl"), { max: 1 });
    const stolen = await db.select().from(apiTokens).where(eq(apiTokens.name, "stolen"));
    await client.end();
    expect(stolen).toEqual([]);
  });
});
