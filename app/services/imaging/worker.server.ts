/**
 * The worker side of imaging previews: takes jobs off the pg-boss queue (./queue.server.ts), runs each
 * on a thread of its own (./preview.thread.ts) and keeps its row in `imaging_jobs` up to date:
 * running with the attempt counted, progress (iteration, χ²) twice a second, then done (result and
 * OIFITS bytes), failed (the reason) or, when the row was cancelled meanwhile, stopped and left
 * cancelled. A database error is thrown back to pg-boss, which retries the job; so does a worker that
 * is killed (the job expires and another worker takes it). Several worker processes on several
 * machines share one queue: that is how a site scales out.
 */
import { Worker } from "node:worker_threads";
import { and, eq, inArray, sql } from "drizzle-orm";
import type PgBoss from "pg-boss";
import type { Database } from "~/db/client.server";
import { imagingJobs } from "~/db/schema/imaging";
import { env } from "~/env.server";
import type { ThreadMessage } from "./preview.thread";
import { IMAGING_LOST_QUEUE, IMAGING_QUEUE, imagingQueue, RETRY_LIMIT, stopImagingQueue } from "./queue.server";
import type { ImagingJobRequest } from "./schemas";

const PROGRESS_EVERY_MS = 500;

/** The thread's entry: a small module that registers tsx's loader in the thread, then runs ./preview.thread.ts. */
function threadEntry(): { url: URL; execArgv: string[] } {
  return { url: new URL("./preview-thread.mjs", import.meta.url), execArgv: [] };
}

type Outcome =
  | { kind: "done"; result: unknown; oifits: Uint8Array }
  | { kind: "failed"; message: string }
  | { kind: "stopped" }
  | { kind: "handed-back" };

/** Marks the job running (one more attempt); null when it is no longer to be run (cancelled, done, gone). */
async function claim(db: Database, jobId: number) {
  const [row] = await db
    .update(imagingJobs)
    .set({
      state: "running",
      attempts: sql`${imagingJobs.attempts} + 1`,
      iteration: 0,
      chi2: null,
      startedAt: new Date(),
      updatedAt: new Date(),
    })
    .where(and(eq(imagingJobs.id, jobId), inArray(imagingJobs.state, ["queued", "running"])))
    .returning({ request: imagingJobs.request, createdAt: imagingJobs.createdAt });
  return row ?? null;
}

/** Runs one preview's row to its end. Exported for the tests; the queue calls it through `startImagingWorker`. */
export async function runImagingJob(
  db: Database,
  jobId: number,
  hooks: { onStart?: (stop: () => void) => void } = {},
): Promise<"done" | "failed" | "cancelled" | "skipped" | "handed-back"> {
  const claimed = await claim(db, jobId);
  if (!claimed) return "skipped";
  const stop = new Int32Array(new SharedArrayBuffer(4));
  const entry = threadEntry();
  const thread = new Worker(entry.url, {
    execArgv: entry.execArgv,
    workerData: {
      request: claimed.request as unknown as ImagingJobRequest,
      writtenUtc: claimed.createdAt.toISOString().slice(0, 19),
      stop,
    },
  });
  type Progress = { iteration: number; chi2: number };
  let latest: Progress | null = null;
  let written: Progress | null = null;
  let cancelled = false;

  const flush = async () => {
    if (latest === written && !cancelled) {
      // Nothing new: still look whether the row was cancelled.
      const [row] = await db.select({ state: imagingJobs.state }).from(imagingJobs).where(eq(imagingJobs.id, jobId));
      if (row?.state !== "running") cancelled = true;
    } else if (latest) {
      const p = latest;
      const rows = await db
        .update(imagingJobs)
        .set({ iteration: p.iteration, chi2: Number.isFinite(p.chi2) ? p.chi2 : null, updatedAt: new Date() })
        .where(and(eq(imagingJobs.id, jobId), eq(imagingJobs.state, "running")))
        .returning({ id: imagingJobs.id });
      written = p;
      if (rows.length === 0) cancelled = true;
    }
    if (cancelled) Atomics.store(stop, 0, 1);
  };

  const outcome = await new Promise<Outcome>((resolve, reject) => {
    let settled = false;
    const finish = (o: Outcome) => {
      if (!settled) {
        settled = true;
        resolve(o);
      }
    };
    hooks.onStart?.(() => {
      Atomics.store(stop, 0, 1);
      void thread.terminate();
      finish({ kind: "handed-back" });
    });
    const timer = setInterval(() => {
      flush().catch((e) => {
        clearInterval(timer);
        void thread.terminate();
        if (!settled) {
          settled = true;
          reject(e);
        }
      });
    }, PROGRESS_EVERY_MS);
    thread.on("message", (m: ThreadMessage) => {
      if (m.type === "progress") latest = { iteration: m.iteration, chi2: m.chi2 };
      else if (m.type === "done") finish(m.stopped ? { kind: "stopped" } : { kind: "done", ...m });
      else finish({ kind: "failed", message: m.message });
    });
    thread.on("error", (e) => finish({ kind: "failed", message: `The computation stopped: ${e.message}` }));
    thread.on("exit", (code) => {
      clearInterval(timer);
      finish(code === 0 ? { kind: "stopped" } : { kind: "failed", message: `The computation stopped (exit ${code}).` });
    });
  });
  await thread.terminate();
  await flush().catch(() => undefined);

  const running = and(eq(imagingJobs.id, jobId), eq(imagingJobs.state, "running"));
  if (outcome.kind === "stopped") return "cancelled";
  if (outcome.kind === "handed-back") {
    await db.update(imagingJobs).set({ state: "queued", updatedAt: new Date() }).where(running);
    return "handed-back";
  }
  const end = new Date();
  const last = latest as Progress | null;
  const progress = last ? { iteration: last.iteration, chi2: Number.isFinite(last.chi2) ? last.chi2 : null } : {};
  const rows =
    outcome.kind === "done"
      ? await db
          .update(imagingJobs)
          .set({
            state: "done",
            result: outcome.result as Record<string, unknown>,
            oifits: Buffer.from(outcome.oifits),
            error: null,
            finishedAt: end,
            updatedAt: end,
            ...progress,
          })
          .where(running)
          .returning({ id: imagingJobs.id })
      : await db
          .update(imagingJobs)
          .set({ state: "failed", error: outcome.message, finishedAt: end, updatedAt: end, ...progress })
          .where(running)
          .returning({ id: imagingJobs.id });
  if (rows.length === 0) return "cancelled";
  return outcome.kind;
}

/** Fails the row of a preview pg-boss gave up on. */
export async function failLost(db: Database, jobId: number) {
  const end = new Date();
  await db
    .update(imagingJobs)
    .set({
      state: "failed",
      error: `The workers that took this preview stopped before it was done (${RETRY_LIMIT + 1} attempts). Start it again; if it keeps failing, tell the observatory.`,
      finishedAt: end,
      updatedAt: end,
    })
    .where(and(eq(imagingJobs.id, jobId), inArray(imagingJobs.state, ["queued", "running"])));
}

export interface ImagingWorker {
  /** Stops taking jobs; the previews running now are stopped and handed back to the queue at once. */
  stop(): Promise<void>;
}

/** Starts taking previews off the queue of the database `db` points at (`url`). */
export async function startImagingWorker(
  db: Database,
  { url = env().DATABASE_URL, concurrency = env().IMAGING_WORKER_CONCURRENCY } = {},
): Promise<ImagingWorker> {
  const boss: PgBoss = await imagingQueue("worker", url);
  const running = new Map<string, () => void>();
  const handlers = new Set<Promise<unknown>>();
  const workIds: string[] = [];
  for (let i = 0; i < concurrency; i++) {
    workIds.push(
      await boss.work<{ jobId: number }>(IMAGING_QUEUE, { batchSize: 1, pollingIntervalSeconds: 1 }, async ([job]) => {
        const run = runImagingJob(db, job.data.jobId, { onStart: (stop) => running.set(job.id, stop) });
        handlers.add(run);
        try {
          // Handed back by a stopping worker: failing the job makes pg-boss give it to another one.
          if ((await run) === "handed-back") throw new Error("the worker stopped; the preview goes back to the queue");
        } finally {
          running.delete(job.id);
          handlers.delete(run);
        }
      }),
    );
  }
  // A preview whose every attempt lost its worker (or hit a database error) ends failed, not "running".
  workIds.push(
    await boss.work<{ jobId: number }>(
      IMAGING_LOST_QUEUE,
      { batchSize: 1, pollingIntervalSeconds: 2 },
      async ([job]) => {
        await failLost(db, job.data.jobId);
      },
    ),
  );
  return {
    async stop() {
      for (const id of workIds) await boss.offWork({ id }).catch(() => undefined);
      for (const stopRun of running.values()) stopRun();
      await Promise.allSettled([...handlers]);
      // Let pg-boss record the handed-back jobs as failed (to be retried) before it closes.
      await new Promise((r) => setTimeout(r, 300));
      await stopImagingQueue("worker", url).catch(() => undefined);
    },
  };
}
