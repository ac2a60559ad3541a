import { routeArgs, settle, testDb } from "@test/routes";
import ICAL from "ical.js";
import Papa from "papaparse";
import * as v from "valibot";
import { beforeAll, describe, expect, it } from "vitest";
import { seedDemoScenario } from "~/db/seed/factories.server";
import { loader as apiNightLoader } from "~/routes/api/night-plan";
import { action as apiPlanAction, loader as apiPlanLoader } from "~/routes/api/plan";
import { loader as exportLoader } from "~/routes/nights/export";
import { createApiToken } from "~/services/auth/api-tokens.server";
import { installRun } from "~/services/nights/calendar.server";
import { autoPlan } from "~/services/nights/commands.server";
import { publishPlan } from "~/services/nights/publish.server";
import { NightPlanExportSchema } from "~/services/nights/schemas";
import { createNightsFixture, fixtureTargets, type NightsFixture } from "../../services/nights/fixture";

// The plan's files by resource route (session) and by the API (token): who gets what, and the files
// read back by independent parsers (papaparse, ical.js) and the JSON schema.
const NIGHT = "2025-05-20";
let fx: NightsFixture;
const tokens: Record<"scheduler" | "pi" | "other", string> = { scheduler: "", pi: "", other: "" };

beforeAll(async () => {
  await seedDemoScenario(testDb());
  fx = await createNightsFixture(testDb(), { night: NIGHT });
  await installRun(testDb(), {
    input: { cycleId: fx.cycle.id, firstNight: NIGHT, lastNight: NIGHT, configurationId: fx.configurationIds.medium },
    userId: null,
  });
  await autoPlan(testDb(), { date: NIGHT, userId: null });
  for (const who of ["scheduler", "pi", "other"] as const) {
    tokens[who] = `Bearer ${(await createApiToken(testDb(), fx.people[who].id, "tests")).token}`;
  }
});

const file = (name: string, cookie?: string, date = NIGHT) =>
  settle(() =>
    exportLoader(
      routeArgs(`/nights/${date}/export/${name}`, {
        headers: cookie ? { Cookie: cookie } : {},
        params: { date, file: name },
      }),
    ),
  );
const api = (query: string, auth?: string, date = NIGHT) =>
  settle(() =>
    apiNightLoader(
      routeArgs(`/api/nights/${date}/plan${query}`, { headers: auth ? { Authorization: auth } : {}, params: { date } }),
    ),
  );

describe("plan files by resource route", () => {
  it("gives the scheduler the draft in every format, read back by independent parsers", async () => {
    const csv = await file("plan.csv", fx.cookies.scheduler);
    expect(csv.status).toBe(200);
    expect(csv.headers.get("Content-Type")).toMatch(/^text\/csv/);
    expect(csv.headers.get("Content-Disposition")).toBe('attachment; filename="night-plan-2025-05-20.csv"');
    const rows = Papa.parse<Record<string, string>>(await csv.text(), { header: true, skipEmptyLines: true });
    expect(rows.errors).toEqual([]);
    expect(new Set(rows.data.map((r) => r.target))).toEqual(
      new Set(["Ardilla 1", "Ardilla 2", "Ardilla 3", "Zorzal 7"]),
    );
    const ics = await file("plan.ics", fx.cookies.scheduler);
    const events = new ICAL.Component(ICAL.parse(await ics.text())).getAllSubcomponents("vevent");
    expect(events).toHaveLength(rows.data.length);
    const json = await (await file("plan.json", fx.cookies.scheduler)).json();
    expect(v.safeParse(NightPlanExportSchema, json).success).toBe(true);
    expect(json.night).toMatchObject({ date: NIGHT, configuration: "medium-4", state: "draft" });
  });

  it("shows a program's team nothing of a draft, then only its own blocks once published", async () => {
    expect((await file("plan.csv", fx.cookies.pi)).status).toBe(404);
    expect((await publishPlan(testDb(), { date: NIGHT, userId: null })).ok).toBe(true);
    const mine = await file("plan.ics", fx.cookies.pi);
    expect(mine.status).toBe(200);
    expect(mine.headers.get("Content-Disposition")).toContain("night-plan-2025-05-20-mine.ics");
    const summaries = new ICAL.Component(ICAL.parse(await mine.text()))
      .getAllSubcomponents("vevent")
      .map((e) => String(e.getFirstPropertyValue("summary")));
    expect(summaries.length).toBeGreaterThan(0);
    expect(summaries.every((s) => s.includes("Ardilla"))).toBe(true);
    const coi = await (await file("plan.json", fx.cookies.coi)).json();
    expect(coi.filtered).toBe(true);
    expect(
      coi.blocks.every((b: { program: { proposalId: number } }) => b.program.proposalId === fx.programs.first.id),
    ).toBe(true);
  });

  it("answers a bad file, a bad date or a night without plan with 404, a stranger with the sign-in page", async () => {
    expect((await file("plan.pdf", fx.cookies.scheduler)).status).toBe(404);
    expect((await file("plan.csv", fx.cookies.scheduler, "2025-02-30")).status).toBe(404);
    expect((await file("plan.csv", fx.cookies.scheduler, "2025-05-25")).status).toBe(404);
    expect((await file("plan.csv")).status).toBe(302);
  });
});

describe("GET /api/nights/:date/plan", () => {
  it("answers a token with the plan in the format asked for", async () => {
    const csv = await api("?format=csv", tokens.scheduler);
    expect(csv.status).toBe(200);
    expect(csv.headers.get("Content-Type")).toMatch(/^text\/csv/);
    const json = await (await api("", tokens.scheduler)).json();
    expect(v.safeParse(NightPlanExportSchema, json).success).toBe(true);
    expect(json.filtered).toBe(false);
    const theirs = await (await api("?format=json", tokens.other)).json();
    expect(theirs.blocks.every((b: { target: string }) => b.target === "Zorzal 7")).toBe(true);
    expect((await api("?format=ics", tokens.pi)).headers.get("Content-Type")).toMatch(/^text\/calendar/);
  });

  it("names a bad format or date, hides nights without plan, and wants a token", async () => {
    const badFormat = await api("?format=xml", tokens.scheduler);
    expect(badFormat.status).toBe(400);
    expect(await badFormat.json()).toEqual({ error: "format: must be csv, json or ics", field: "format" });
    const badDate = await api("", tokens.scheduler, "20250520");
    expect(await badDate.json()).toMatchObject({ field: "date" });
    expect((await api("", tokens.scheduler, "2025-05-26")).status).toBe(404);
    expect((await api("")).status).toBe(401);
  });
});

describe("POST /api/plan", () => {
  const body = () => {
    const t = fixtureTargets(NIGHT);
    return {
      site: { latitudeDeg: -31.4, longitudeDeg: -68.9, altitudeM: 2450 },
      date: NIGHT,
      targets: t.first.map((x, i) => ({ ...x, priority: i + 1, hoursOwed: 1 })),
    };
  };
  const post = (json: unknown, auth?: string) =>
    settle(() =>
      apiPlanAction(
        routeArgs("/api/plan", {
          method: "POST",
          body: JSON.stringify(json),
          headers: { "Content-Type": "application/json", ...(auth ? { Authorization: auth } : {}) },
        }),
      ),
    );

  it("answers the CLI contract: the night, blocks, unplaced and warnings", async () => {
    const res = await post(body(), tokens.scheduler);
    expect(res.status).toBe(200);
    const out = await res.json();
    expect(Object.keys(out)).toEqual(expect.arrayContaining(["night", "blocks", "unplaced", "warnings"]));
    expect(out.blocks.filter((b: { kind: string }) => b.kind === "science")).toHaveLength(6);
    expect(out.warnings[0]).toMatch(/observatory's own safety rules/);
  });

  it("answers a bad request with 400 naming the field, a stranger with 401, a GET with 405", async () => {
    const b = body();
    b.targets[1].decDeg = -100;
    const res = await post(b, tokens.pi);
    expect(res.status).toBe(400);
    expect(await res.json()).toEqual({
      error: "targets[1].decDeg: must be between -90 and 90",
      field: "targets[1].decDeg",
    });
    expect((await post(body())).status).toBe(401);
    expect(
      (await settle(() => apiPlanLoader(routeArgs("/api/plan", { headers: { Authorization: tokens.pi } })))).status,
    ).toBe(405);
  });
});
