/**
 * The imaging previews' routes over their loaders and actions: validation with the field named, the
 * owner's rights, the team's and the committee's read-only view, the chair's queue of a cycle, the 429
 * beyond the person's limit and the OIFITS download.
 */

import { imagingCoverage } from "@test/imaging";
import { routeArgs, settle, testDb } from "@test/routes";
import { and, eq, ne } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { reviewAssignments, reviewConflicts } from "~/db/schema/committee";
import { cycles, proposals, proposalTargets } from "~/db/schema/proposals";
import { users } from "~/db/schema/users";
import { seedDemoScenario } from "~/db/seed/factories.server";
import { loader as jobLoader } from "~/routes/api/imaging-job";
import { action as cancelAction } from "~/routes/api/imaging-job-cancel";
import { loader as oifitsLoader } from "~/routes/api/imaging-job-oifits";
import { loader as listLoader, action as startAction } from "~/routes/api/imaging-jobs";
import { createApiToken } from "~/services/auth/api-tokens.server";
import { stopImagingQueues } from "~/services/imaging/queue.server";
import { runImagingJob } from "~/services/imaging/worker.server";

const db = testDb();
type Who = "pi" | "coI" | "stranger" | "reviewer" | "chair";
const bearer = {} as Record<Who, string>;
let proposalId = 0;
let targetId = 0;
let cycleId = 0;

beforeAll(async () => {
  await seedDemoScenario(db);
  const [p] = await db.select().from(proposals).where(eq(proposals.title, "Imaging the spots of Brasero 9"));
  proposalId = p.id;
  cycleId = p.cycleId;
  targetId = (await db.select().from(proposalTargets).where(eq(proposalTargets.proposalId, p.id)))[0].id;
  const conflicted = await db.select().from(reviewConflicts).where(eq(reviewConflicts.proposalId, p.id));
  const assigned = await db
    .select({ id: users.id })
    .from(reviewAssignments)
    .innerJoin(users, eq(users.id, reviewAssignments.reviewerId))
    .where(and(eq(reviewAssignments.proposalId, p.id), eq(reviewAssignments.status, "active"), ne(users.id, p.piId)));
  const reviewerId = assigned.find((a) => !conflicted.some((c) => c.reviewerId === a.id))?.id;
  const byEmail = async (email: string) => (await db.select().from(users).where(eq(users.email, email)))[0].id;
  const ids: Record<Who, number> = {
    pi: p.piId,
    coI: await byEmail("ines.arroyo@valle-alto.example"),
    stranger: await byEmail("tomasz.wierzbicki@baltic-stellar.example"),
    reviewer: reviewerId ?? 0,
    chair: await byEmail("henrik.solberg@fjellvik.example"),
  };
  for (const who of Object.keys(ids) as Who[])
    bearer[who] = `Bearer ${(await createApiToken(db, ids[who], "t")).token}`;
});
afterAll(async () => {
  await stopImagingQueues();
});

const json = (who: Who, body: unknown) => ({
  method: "POST",
  body: typeof body === "string" ? body : JSON.stringify(body),
  headers: { "Content-Type": "application/json", Authorization: bearer[who] },
});
const start = (who: Who, body: unknown) => settle(() => startAction(routeArgs("/api/imaging/jobs", json(who, body))));
const get = (who: Who, path: string, loader: (a: never) => unknown, params: Record<string, string> = {}) =>
  settle(() => loader(routeArgs(path, { headers: { Authorization: bearer[who] }, params })));
const job = (who: Who, id: number) => get(who, `/api/imaging/jobs/${id}`, jobLoader as never, { id: String(id) });
const cancel = (who: Who, id: number) =>
  settle(() =>
    cancelAction(routeArgs(`/api/imaging/jobs/${id}/cancel`, { ...json(who, {}), params: { id: String(id) } })),
  );
const targetBody = () => ({ source: { kind: "proposalTarget", proposalId, targetId }, settings: { gridSize: 32 } });

describe("POST /api/imaging/jobs", () => {
  it("refuses bad input with 400 naming the field", async () => {
    const cases: [unknown, RegExp][] = [
      ["{", /not valid JSON/],
      [{}, /source/],
      [{ source: { kind: "sketch" } }, /coverage/],
      [
        { source: { kind: "sketch", coverage: imagingCoverage() }, settings: { gridSize: 200 } },
        /settings\.gridSize: Grid size must be between 32 and 128/,
      ],
      [{ source: { kind: "sketch", coverage: imagingCoverage() }, settings: { weight: "lots" } }, /settings\.weight/],
      [{ source: { kind: "sketch", coverage: imagingCoverage({ stations: [] }) } }, /stations/],
      [{ source: { kind: "proposalTarget", proposalId: "x", targetId: 1 } }, /proposalId/],
    ];
    for (const [body, says] of cases) {
      const res = await start("pi", body);
      expect(res.status, JSON.stringify(body).slice(0, 80)).toBe(400);
      expect(((await res.json()) as { error: string }).error).toMatch(says);
    }
  });

  it("lets the team preview a proposal's target; anyone else gets a 404", async () => {
    expect((await start("stranger", targetBody())).status).toBe(404);
    expect((await start("reviewer", targetBody())).status).toBe(404);
    const res = await start("pi", targetBody());
    expect(res.status).toBe(202);
    const { jobs } = (await res.json()) as { jobs: { id: number; label: string }[] };
    expect(jobs[0].label).toMatch(/^Brasero 9 \(extended-6, night of \d{4}-\d{2}-\d{2}\)$/);
    const id = jobs[0].id;

    // Read: the owner may cancel; the co-investigator, the assigned reviewer and the chair read only.
    expect(await (await job("pi", id)).json()).toMatchObject({ id, readOnly: false, state: "queued" });
    for (const who of ["coI", "reviewer", "chair"] as const) {
      const r = await job(who, id);
      expect(r.status, who).toBe(200);
      expect(await r.json()).toMatchObject({ readOnly: true });
    }
    expect((await job("stranger", id)).status).toBe(404);
    const list = await get("reviewer", `/api/imaging/jobs?proposalId=${proposalId}`, listLoader as never);
    expect(((await list.json()) as { jobs: { id: number }[] }).jobs.map((j) => j.id)).toContain(id);
    expect((await get("stranger", `/api/imaging/jobs?proposalId=${proposalId}`, listLoader as never)).status).toBe(404);
    expect((await get("pi", "/api/imaging/jobs?proposalId=abc", listLoader as never)).status).toBe(400);
    expect((await get("pi", `/api/imaging/jobs?cycleId=${cycleId}`, listLoader as never)).status).toBe(404);

    // Cancel: the owner only; a second cancel is a 409; the OIFITS of a cancelled preview too.
    expect((await cancel("reviewer", id)).status).toBe(403);
    expect((await cancel("stranger", id)).status).toBe(404);
    const cancelled = await cancel("pi", id);
    expect(cancelled.status).toBe(200);
    expect(await cancelled.json()).toMatchObject({ state: "cancelled" });
    expect((await cancel("pi", id)).status).toBe(409);
    const oifits = await get("pi", `/api/imaging/jobs/${id}/oifits`, oifitsLoader as never, { id: String(id) });
    expect(oifits.status).toBe(409);
  });

  it("refuses a fourth preview under way with 429 and says why", async () => {
    const sketch = { source: { kind: "sketch", coverage: imagingCoverage() }, settings: { gridSize: 32 } };
    const ids: number[] = [];
    for (let i = 0; i < 3; i++) {
      const r = await start("stranger", sketch);
      expect(r.status).toBe(202);
      ids.push(((await r.json()) as { jobs: { id: number }[] }).jobs[0].id);
    }
    const refused = await start("stranger", sketch);
    expect(refused.status).toBe(429);
    expect(((await refused.json()) as { error: string }).error).toMatch(
      /3 imaging previews queued or running; at most 3/,
    );
    for (const id of ids) await cancel("stranger", id);
  });

  it("downloads the OIFITS 2 file of a finished preview", async () => {
    const r = await start("coI", {
      source: { kind: "sketch", coverage: imagingCoverage() },
      settings: { gridSize: 32, maxIterations: 30 },
    });
    const id = ((await r.json()) as { jobs: { id: number }[] }).jobs[0].id;
    expect(await runImagingJob(db, id)).toBe("done");
    const res = await get("coI", `/api/imaging/jobs/${id}/oifits`, oifitsLoader as never, { id: String(id) });
    expect(res.status).toBe(200);
    expect(res.headers.get("Content-Type")).toBe("application/fits");
    expect(res.headers.get("Content-Disposition")).toMatch(
      /attachment; filename="imaging-preview-\d+-Test_binary_Sketchpad.fits"/,
    );
    const bytes = new Uint8Array(await res.arrayBuffer());
    // FITS 4.0 §3.1: a file is a whole number of 2880-byte blocks; §4.4.1.1: SIMPLE is the first keyword.
    expect(bytes.byteLength % 2880).toBe(0);
    expect(Buffer.from(bytes.subarray(0, 8)).toString("latin1")).toBe("SIMPLE  ");
    // Somebody else's sketch preview is not theirs to read.
    expect((await get("pi", `/api/imaging/jobs/${id}/oifits`, oifitsLoader as never, { id: String(id) })).status).toBe(
      404,
    );
  });

  it("lets the chair queue every imaging target of a cycle once at a time; nobody else", async () => {
    expect((await start("pi", { source: { kind: "cycle", cycleId } })).status).toBe(403);
    const [cycle] = await db.select().from(cycles).where(eq(cycles.id, cycleId));
    const res = await start("chair", { source: { kind: "cycle", cycleId: cycle.id }, settings: { gridSize: 32 } });
    expect(res.status).toBe(202);
    const { jobs } = (await res.json()) as { jobs: { label: string }[] };
    expect(jobs.map((j) => j.label).some((l) => l.startsWith("Brasero 9"))).toBe(true);
    expect((await start("chair", { source: { kind: "cycle", cycleId } })).status).toBe(429);
    const queue = await get("chair", `/api/imaging/jobs?cycleId=${cycleId}`, listLoader as never);
    expect(((await queue.json()) as { jobs: unknown[] }).jobs).toHaveLength(jobs.length);
    expect((await start("chair", { source: { kind: "cycle", cycleId: 999999 } })).status).toBe(404);
  });
});
