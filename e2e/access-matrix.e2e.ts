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
/** A JSON API call: `o` for everyone signed in (or with a token), 401 without. */
const apiCall = (o: Outcome): Record<Who, Outcome> => ({ ...all(o), anonymous: "unauthorized" });
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
const schedulerOnly: Record<Who, Outcome> = {
  anonymous: "sign-in",
  proposer: "forbidden",
  reviewer: "forbidden",
  chair: "forbidden",
  scheduler: "ok",
  admin: "forbidden",
};
const committee: Record<Who, Outcome> = { ...chairOnly, reviewer: "ok" };
const adminOnly: Record<Who, Outcome> = {
  anonymous: "sign-in",
  proposer: "forbidden",
  reviewer: "forbidden",
  chair: "forbidden",
  scheduler: "forbidden",
  admin: "ok",
};

/** A GET row: the route's pattern in app/routes.ts, the address tried, and what each caller gets. */
const get = (pattern: string, path: string, expect: Record<Who, Outcome>): Row => ({
  pattern,
  method: "GET",
  path,
  expect,
});

/** A POST row: as `get`, with the JSON body sent. */
const post = (pattern: string, path: string, body: unknown, expect: Record<Who, Outcome>): Row => ({
  pattern,
  method: "POST",
  path,
  body,
  expect,
});

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
  get("/", "/", all("ok")),
  get("/sign-in", "/sign-in", { ...all(302), anonymous: "ok" }),
  get("/sign-out", "/sign-out", all(302)),
  get("/auth/sso/start", "/auth/sso/start", all(302)),
  // A callback without the flow cookie goes back to the sign-in page with the reason.
  get("/auth/sso/callback", "/auth/sso/callback?code=x&state=y", all("sign-in")),
  get("/auth/email/verify", "/auth/email/verify?token=abc", all("ok")),
  get("/account", "/account", signedIn("ok")),
  get("/admin/users", "/admin/users", adminOnly),
  get("/registry", "/registry", all("ok")),
  // Registry pages by id: the seeded site, its first station, configuration, instrument and band are number 1.
  get("/registry/stations/:stationId", "/registry/stations/1", all("ok")),
  get("/registry/export/:file", "/registry/export/stations.csv", all("ok")),
  get("/registry/export/:file", "/registry/export/registry.json", all("ok")),
  get("/registry/export/:file", "/registry/export/nothing.txt", all(404)),
  get("/registry/sites/new", "/registry/sites/new", adminOnly),
  get("/registry/sites/:siteId/edit", "/registry/sites/1/edit", adminOnly),
  get("/registry/stations/new", "/registry/stations/new", adminOnly),
  get("/registry/stations/:stationId/edit", "/registry/stations/1/edit", adminOnly),
  get("/registry/configurations/new", "/registry/configurations/new", adminOnly),
  get("/registry/configurations/:configurationId/edit", "/registry/configurations/1/edit", adminOnly),
  get("/registry/instruments/new", "/registry/instruments/new", adminOnly),
  get("/registry/instruments/:instrumentId/edit", "/registry/instruments/1/edit", adminOnly),
  get("/registry/instruments/:instrumentId/bands/new", "/registry/instruments/1/bands/new", adminOnly),
  get("/registry/bands/:bandId/edit", "/registry/bands/1/edit", adminOnly),
  get("/registry/import", "/registry/import", adminOnly),
  // The guard comes before the body is read: nobody but an administrator gets as far as the form.
  post("/registry/import", "/registry/import", {}, { ...adminOnly, admin: 400 }),
  get("/sketchpad", "/sketchpad?config=compact-3&ra=05:36:12&dec=-01:12:07", signedIn("ok")),
  get("/triangles", "/triangles?pool=all", signedIn("ok")),
  get("/cycles", "/cycles", signedIn("ok")),
  get("/targets", "/targets", proposerOnly),
  get("/targets/import", "/targets/import", proposerOnly),
  get("/targets/export.csv", "/targets/export.csv", proposerOnly),
  // Somebody else's (or no) target: not found, never revealed.
  get("/targets/:targetId", "/targets/999999", { ...proposerOnly, proposer: 404 }),
  // Proposals: proposers only; a proposal of someone else (or none at all) is the same 404.
  get("/proposals", "/proposals", proposerOnly),
  get("/proposals/new", "/proposals/new", proposerOnly),
  get("/proposals/:proposalId", "/proposals/999999", { ...proposerOnly, proposer: 404 }),
  post("/proposals/:proposalId", "/proposals/1", {}, { ...proposerOnly, proposer: 404 }),
  get("/proposals/:proposalId/targets/:targetId", "/proposals/1/targets/new", { ...proposerOnly, proposer: 404 }),
  get("/proposals/:proposalId/feasibility", "/proposals/1/feasibility", { ...proposerOnly, proposer: 404 }),
  get("/proposals/:proposalId/science-case", "/proposals/4/science-case", { ...proposerOnly, proposer: 404 }),
  get("/proposals/:proposalId/versions/:version", "/proposals/4/versions/1", { ...proposerOnly, proposer: 404 }),
  // Calibrator shortlists: any signed-in person for a typed target; a proposal's target for its team only.
  get("/catalogue/calibrators", "/catalogue/calibrators?target=Betelgeuse&date=2027-01-10", signedIn("ok")),
  get(
    "/catalogue/proposals/:proposalId/targets/:targetId/calibrators",
    "/catalogue/proposals/1/targets/1/calibrators",
    { ...proposerOnly, proposer: 404 },
  ),
  post(
    "/catalogue/proposals/:proposalId/targets/:targetId/calibrators",
    "/catalogue/proposals/1/targets/1/calibrators",
    {},
    { ...proposerOnly, proposer: 404 },
  ),
  get("/cycles/new", "/cycles/new", chairOnly),
  get("/cycles/:cycleId/edit", "/cycles/1/edit", chairOnly),
  // Night builder: the scheduler's. A night's files go to the scheduler and to the teams of its programs once
  // published; a night without a plan is a 404 for everyone. Posts that are not forms are refused with 400.
  get("/nights", "/nights", schedulerOnly),
  post("/nights", "/nights", {}, { ...schedulerOnly, scheduler: 400 }),
  get("/nights/:date", "/nights/2027-03-15", schedulerOnly),
  post("/nights/:date", "/nights/2027-03-15", {}, { ...schedulerOnly, scheduler: 400 }),
  get("/nights/:date/export/:file", "/nights/2027-03-15/export/plan.csv", signedIn(404)),
  // The committee's season (demo: cycle 1 decided, 2 under review; proposal 1 submitted to cycle 1).
  get("/cycles/:cycleId", "/cycles/2", chairOnly),
  post("/cycles/:cycleId", "/cycles/2", {}, { ...chairOnly, chair: 400 }),
  get("/cycles/:cycleId/assignments", "/cycles/2/assignments", chairOnly),
  get("/review", "/review", committee),
  // The matrix's reviewer and chair sit on no committee and are assigned nothing: the same 404 as for no cycle.
  get("/review/cycles/:cycleId/conflicts", "/review/cycles/2/conflicts", { ...committee, reviewer: 404, chair: 404 }),
  get("/review/proposals/:proposalId", "/review/proposals/1", { ...committee, reviewer: 404 }),
  post("/review/proposals/:proposalId", "/review/proposals/1", {}, { ...committee, reviewer: 404, chair: "forbidden" }),
  get("/review/proposals/:proposalId/science-case", "/review/proposals/1/science-case", {
    ...committee,
    reviewer: 404,
  }),
  get("/board", "/board", chairOnly),
  get("/board/:cycleId", "/board/2", chairOnly),
  post("/board/:cycleId", "/board/2", {}, { ...chairOnly, chair: 400 }),
  // Every signed-in person reads their own mail there (administrators everyone's); demo mode or not.
  get("/mailbox", "/mailbox", signedIn("ok")),
  get("/mailbox/:messageId", "/mailbox/999999", signedIn(404)),
  post("/api/coverage", "/api/coverage", coverageBody, apiCall("ok")),
  post("/api/ephemeris", "/api/ephemeris", { site: coverageBody.site, date: "2027-03-15" }, apiCall("ok")),
  post("/api/triangles", "/api/triangles", {}, apiCall(400)),
  post("/api/resolve", "/api/resolve", { name: "HD 39801" }, apiCall("ok")),
  post(
    "/api/calibrators",
    "/api/calibrators",
    {
      target: { name: "Betelgeuse" },
      wavelengthM: 1.65e-6,
      longestBaselineM: 160,
      site: coverageBody.site,
      date: "2027-01-10",
    },
    apiCall("ok"),
  ),
  get("/api/stars", "/api/stars?q=betel", apiCall("ok")),
  post("/api/plan", "/api/plan", {}, apiCall(400)),
  get("/api/nights/:date/plan", "/api/nights/2027-03-15/plan?format=csv", apiCall(404)),
  post(
    "/api/rank",
    "/api/rank",
    { scale: { best: 1, worst: 5 }, reviews: [{ reviewer: "r1", proposal: "P1", score: 2 }] },
    apiCall("ok"),
  ),
  get("/api/cycles/:cycleId/board", "/api/cycles/2/board?format=json", { ...apiCall("forbidden"), chair: "ok" }),
  // Imaging previews: everyone's own; a preview nobody may read is the same 404 as a missing one.
  get("/api/imaging/jobs", "/api/imaging/jobs", apiCall("ok")),
  post("/api/imaging/jobs", "/api/imaging/jobs", {}, apiCall(400)),
  get("/api/imaging/jobs/:id", "/api/imaging/jobs/999999", apiCall(404)),
  post("/api/imaging/jobs/:id/cancel", "/api/imaging/jobs/999999/cancel", {}, apiCall(404)),
  get("/api/imaging/jobs/:id/oifits", "/api/imaging/jobs/999999/oifits", apiCall(404)),
  get("/*", "/no/such/page", all(404)),
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

/** A row's body as its route takes it: JSON for the API, a form (its fields) for a page. */
function bodyOf(row: Row): { body?: string; headers: Record<string, string> } {
  if (row.body === undefined) return { headers: {} };
  if (row.path.startsWith("/api/")) {
    return { body: JSON.stringify(row.body), headers: { "Content-Type": "application/json" } };
  }
  const form = new URLSearchParams(row.body as Record<string, string>).toString();
  return { body: form, headers: { "Content-Type": "application/x-www-form-urlencoded" } };
}

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
        const headers: Record<string, string> = { ...bodyOf(row).headers };
        if (cookies[who as Role]) headers.Cookie = cookies[who as Role]!;
        const res = await fetch(`${baseUrl}${row.path}`, {
          method: row.method,
          headers,
          body: bodyOf(row).body,
          redirect: "manual",
        });
        outcomes[who] = judge(res);
        await res.arrayBuffer();
      }
      expect(outcomes).toEqual(row.expect);
    });
  }

  it("never lets an API token open a page: what needs a sign-in answers it 403, the API as its owner", async () => {
    const mismatches: string[] = [];
    for (const row of MATRIX) {
      const res = await fetch(`${baseUrl}${row.path}`, {
        method: row.method,
        headers: { Authorization: `Bearer ${tokenOfProposer}`, ...bodyOf(row).headers },
        body: bodyOf(row).body,
        redirect: "manual",
      });
      await res.arrayBuffer();
      const api = row.path.startsWith("/api/");
      // A token is nobody on a page: what sends strangers to sign in refuses it (unless everyone is sent there).
      const sameForAll = new Set(Object.values(row.expect)).size === 1;
      const stranger = row.expect.anonymous;
      const expected = api ? row.expect.proposer : stranger === "sign-in" && !sameForAll ? "forbidden" : stranger;
      const got = judge(res);
      if (got !== expected) mismatches.push(`${row.method} ${row.path}: ${got}, expected ${expected}`);
    }
    expect(mismatches).toEqual([]);
  });

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
