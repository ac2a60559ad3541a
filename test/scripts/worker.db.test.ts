/**
 * `npm run worker` as a process of its own, and what happens when one is killed mid-job: the preview
 * it was running expires on the pg-boss queue, another worker process takes it, runs it again and
 * finishes it (two attempts, done). Short expiry and maintenance intervals for the test only.
 */
import { type ChildProcess, spawn } from "node:child_process";
import { fileURLToPath } from "node:url";
import { startSketchPreview, viewerWith } from "@test/imaging";
import { testDb } from "@test/routes";
import { eq, sql } from "drizzle-orm";
import { afterAll, describe, expect, it, vi } from "vitest";
import { imagingJobs } from "~/db/schema/imaging";
import { stopImagingQueues } from "~/services/imaging/queue.server";

// The expiry is set on each job when it is sent (here, by this process): short for the test.
vi.hoisted(() => {
  process.env.IMAGING_JOB_EXPIRE_S = "12";
});

const ROOT = fileURLToPath(new URL("../..", import.meta.url));
const EXPIRE_S = 12;
const db = testDb();
const started: ChildProcess[] = [];
const log: string[] = [];

/** Starts `scripts/worker.ts`; resolves once it takes previews (its signal handlers are in place). */
async function startWorker(): Promise<ChildProcess> {
  const child = spawn(process.execPath, ["--import", "tsx", "scripts/worker.ts"], {
    cwd: ROOT,
    env: {
      ...process.env,
      IMAGING_JOB_EXPIRE_S: String(EXPIRE_S),
      IMAGING_MAINTENANCE_S: "1",
      IMAGING_WORKER_CONCURRENCY: "1",
    },
    stdio: ["ignore", "pipe", "pipe"],
  });
  child.stdout?.on("data", (d) => log.push(String(d)));
  child.stderr?.on("data", (d) => log.push(String(d)));
  started.push(child);
  await until(
    "the worker to start",
    async () => (log.join("").includes(`worker ${child.pid} takes`) ? true : null),
    60_000,
  );
  return child;
}

async function until<T>(what: string, fn: () => Promise<T | null>, timeoutMs: number): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const v = await fn();
    if (v !== null) return v;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

const rowOf = async (id: number) => (await db.select().from(imagingJobs).where(eq(imagingJobs.id, id)))[0];

afterAll(async () => {
  for (const child of started) if (child.exitCode === null && child.signalCode === null) child.kill("SIGKILL");
  await stopImagingQueues();
});

describe("imaging worker processes", () => {
  it("a preview whose worker is killed mid-job is retried by another worker and finishes", async () => {
    const viewer = await viewerWith(db, "killed@example.test", ["proposer"]);
    const answer = await startSketchPreview(db, viewer, { gridSize: 64, maxIterations: 200 });
    if (!answer.ok) throw new Error(answer.message);
    const id = answer.jobs[0].id;

    const first = await startWorker();
    await until(
      "the first worker to start the preview",
      async () => ((await rowOf(id)).state === "running" ? true : null),
      60_000,
    );
    first.kill("SIGKILL");
    await new Promise((r) => first.once("exit", r));
    expect((await rowOf(id)).state).toBe("running");

    const second = await startWorker();
    const done = await until(
      "the second worker to finish it",
      async () => {
        const row = await rowOf(id);
        return row.state === "done" || row.state === "failed" ? row : null;
      },
      EXPIRE_S * 1000 + 90_000,
    ).catch(async (e) => {
      const jobs = await db.execute(sql`select state, retry_count, started_on, expire_in from pgboss.job`);
      throw new Error(`${(e as Error).message}\n${JSON.stringify(jobs)}\n${log.join("")}`);
    });
    expect(done.error).toBeNull();
    expect(done.state).toBe("done");
    expect(done.attempts).toBe(2);
    expect((done.result as { image: number[] }).image).toHaveLength(64 * 64);
    second.kill("SIGKILL");
    await new Promise((r) => second.once("exit", r));
  }, 180_000);

  it("a worker stopped with SIGTERM hands its preview back at once; the next worker finishes it", async () => {
    const first = await startWorker();
    const viewer = await viewerWith(db, "stopped@example.test", ["proposer"]);
    const answer = await startSketchPreview(db, viewer, { gridSize: 64, maxIterations: 200 });
    if (!answer.ok) throw new Error(answer.message);
    const id = answer.jobs[0].id;
    await until(
      "the first worker to start the preview",
      async () => ((await rowOf(id)).state === "running" ? true : null),
      60_000,
    );
    first.kill("SIGTERM");
    const code = await new Promise((r) => first.once("exit", r));
    expect(code).toBe(0);
    expect((await rowOf(id)).state).toBe("queued");
    const startedAt = Date.now();
    await startWorker();
    const done = await until(
      "the next worker to finish it",
      async () => {
        const row = await rowOf(id);
        return row.state === "done" ? row : null;
      },
      60_000,
    );
    expect(done.attempts).toBe(2);
    // Handed back, not expired: taken again well before the expiry.
    expect(Date.now() - startedAt).toBeLessThan(EXPIRE_S * 1000 + 30_000);
  }, 120_000);
});
