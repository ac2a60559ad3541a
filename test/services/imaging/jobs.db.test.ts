/**
 * Imaging previews end to end in one process: a start writes the row and queues it on pg-boss, an
 * in-process worker runs it (simulate, reconstruct, assess) and stores the result and the OIFITS file;
 * the per-person limit, cancellation and a failure's error.
 */

import { imagingCoverage, startSketchPreview, viewerWith } from "@test/imaging";
import { testDb } from "@test/routes";
import { eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { imagingJobs } from "~/db/schema/imaging";
import { cancelPreview, startPreviews } from "~/services/imaging/commands.server";
import { readJob } from "~/services/imaging/queries.server";
import { IMAGING_QUEUE, imagingQueue, stopImagingQueues } from "~/services/imaging/queue.server";
import { type ImagingWorker, startImagingWorker } from "~/services/imaging/worker.server";

const db = testDb();
const small = { gridSize: 32, maxIterations: 60 };

async function waitFor(jobId: number, states: string[], timeoutMs = 60_000) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const [row] = await db.select().from(imagingJobs).where(eq(imagingJobs.id, jobId));
    if (states.includes(row.state)) return row;
    if (Date.now() > deadline) throw new Error(`job ${jobId} still ${row.state}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

afterAll(async () => {
  await stopImagingQueues();
});

describe("imaging previews without a worker", () => {
  it("refuses a fourth preview queued at once with 429 and a clear message, and cancels a queued one", async () => {
    const viewer = await viewerWith(db, "limit@example.test", ["proposer"]);
    const ids: number[] = [];
    for (let i = 0; i < 3; i++) {
      const a = await startSketchPreview(db, viewer, small);
      expect(a.ok).toBe(true);
      if (a.ok) ids.push(a.jobs[0].id);
    }
    const fourth = await startSketchPreview(db, viewer);
    expect(fourth).toMatchObject({ ok: false, status: 429 });
    expect(!fourth.ok && fourth.message).toMatch(/at most 3 at a time/);
    expect(await cancelPreview(db, { viewer, jobId: ids[0] })).toBe(true);
    expect((await readJob(db, { viewer, jobId: ids[0] }))?.state).toBe("cancelled");
    // A cancelled preview no longer counts; another person cannot cancel or read the rest.
    const other = await viewerWith(db, "other@example.test", ["proposer"]);
    expect(await cancelPreview(db, { viewer: other, jobId: ids[1] })).toBe(false);
    expect(await readJob(db, { viewer: other, jobId: ids[1] })).toBeNull();
    const again = await startSketchPreview(db, viewer);
    expect(again.ok).toBe(true);
    for (const id of ids.slice(1)) await cancelPreview(db, { viewer, jobId: id });
    if (again.ok) await cancelPreview(db, { viewer, jobId: again.jobs[0].id });
  });

  it("names the field of a bad request", async () => {
    const viewer = await viewerWith(db, "bad@example.test", ["proposer"]);
    const grid = await startSketchPreview(db, viewer, { gridSize: 16 });
    expect(grid).toMatchObject({ ok: false, status: 400, field: "settings.gridSize" });
    expect(!grid.ok && grid.message).toMatch(/between 32 and 128/);
    const coverage = await startSketchPreview(db, viewer, undefined, imagingCoverage({ wavelengthsM: "x" }));
    expect(coverage).toMatchObject({ ok: false, status: 400 });
    expect(!coverage.ok && coverage.message).toMatch(/wavelengthsM/);
    const kind = await startPreviews(db, { viewer, json: { source: { kind: "nothing" } } });
    expect(kind).toMatchObject({ ok: false, status: 400 });
    const cycle = await startPreviews(db, { viewer, json: { source: { kind: "cycle", cycleId: 1 } } });
    expect(cycle).toMatchObject({ ok: false, status: 403 });
  });
});

describe("a preview pg-boss gives up on", () => {
  it("ends failed with the reason, not running forever", async () => {
    const viewer = await viewerWith(db, "lost@example.test", ["proposer"]);
    const a = await startSketchPreview(db, viewer, small);
    if (!a.ok) throw new Error(a.message);
    const boss = await imagingQueue("sender", process.env.DATABASE_URL);
    // As if a worker had taken it and every retry had been used up, then it failed once more.
    const [taken] = await boss.fetch<{ jobId: number }>(IMAGING_QUEUE);
    expect(taken.data.jobId).toBe(a.jobs[0].id);
    await db.update(imagingJobs).set({ state: "running" }).where(eq(imagingJobs.id, a.jobs[0].id));
    await db.execute(sql`update pgboss.job set retry_count = retry_limit where id = ${taken.id}`);
    await boss.fail(IMAGING_QUEUE, taken.id);
    const worker = await startImagingWorker(db, { url: process.env.DATABASE_URL, concurrency: 1 });
    try {
      const row = await waitFor(a.jobs[0].id, ["failed"], 20_000);
      expect(row.error).toMatch(/stopped before it was done \(4 attempts\)/);
    } finally {
      await worker.stop();
    }
  });
});

describe("imaging previews with a worker", () => {
  let worker: ImagingWorker;
  beforeAll(async () => {
    worker = await startImagingWorker(db, { url: process.env.DATABASE_URL, concurrency: 1 });
  });
  afterAll(async () => {
    await worker.stop();
  });

  it("runs a preview to the end: progress, images, χ² per observable, fidelity, verdict and OIFITS", async () => {
    const viewer = await viewerWith(db, "runner@example.test", ["proposer"]);
    const a = await startSketchPreview(db, viewer, small);
    if (!a.ok) throw new Error(a.message);
    const row = await waitFor(a.jobs[0].id, ["done", "failed"]);
    expect(row.error).toBeNull();
    expect(row.state).toBe("done");
    expect(row.attempts).toBe(1);
    expect(row.iteration).toBeGreaterThan(0);
    const job = await readJob(db, { viewer, jobId: row.id });
    const result = job?.result as Record<string, any>;
    expect(result.image).toHaveLength(32 * 32);
    expect(result.modelImage).toHaveLength(32 * 32);
    expect(result.dirtyImage).toHaveLength(32 * 32);
    expect(result.chi2Vis2).toBeGreaterThan(0);
    expect(result.chi2ClosurePhase).toBeGreaterThan(0);
    expect(result.fidelity.verdict).toMatch(/\w/);
    // 15 baselines × 25 samples × 3 channels; 20 triangles × 25 × 3 (every closure phase by default).
    expect(result.simulation).toMatchObject({ vis2Count: 1125, closurePhaseCount: 1500, closurePhaseTriangles: "all" });
    // FITS standard 4.0 §3.3.1: the primary header begins with SIMPLE = T; §3.1: 2880-byte blocks.
    expect(row.oifits?.subarray(0, 30).toString("latin1")).toMatch(/^SIMPLE {2}=\s+T/);
    expect((row.oifits?.byteLength ?? 1) % 2880).toBe(0);
  });

  it("stores a failure's error in plain words", async () => {
    const viewer = await viewerWith(db, "fails@example.test", ["proposer"]);
    // Declination +75° from latitude −31.4° never rises above 30° (its highest elevation is 90 − 106.4 < 0).
    const coverage = imagingCoverage({
      target: { name: "Far north", raDeg: 10, decDeg: 75, model: { type: "uniformDisk", diameterMas: 2 } },
    });
    const a = await startSketchPreview(db, viewer, small, coverage);
    if (!a.ok) throw new Error(a.message);
    const row = await waitFor(a.jobs[0].id, ["done", "failed"]);
    expect(row.state).toBe("failed");
    expect(row.error).toMatch(/never observable/);
  });

  it("stops a running preview that is cancelled and leaves it cancelled", async () => {
    const viewer = await viewerWith(db, "cancels@example.test", ["proposer"]);
    const a = await startSketchPreview(db, viewer, { gridSize: 128, maxIterations: 1000 });
    if (!a.ok) throw new Error(a.message);
    const id = a.jobs[0].id;
    await waitFor(id, ["running"]);
    expect(await cancelPreview(db, { viewer, jobId: id })).toBe(true);
    await new Promise((r) => setTimeout(r, 1500));
    const [row] = await db.select().from(imagingJobs).where(eq(imagingJobs.id, id));
    expect(row.state).toBe("cancelled");
    expect(row.result).toBeNull();
  });
});
