/**
 * The imaging previews' queue on pg-boss (its own schema `pgboss` in the app's database). The server
 * only sends jobs to it; worker processes (./worker.server.ts, `npm run worker`) take them. One pg-boss
 * instance per process and database, started on first use.
 *
 * A job is retried when its worker goes away: pg-boss expires a job that stays active longer than
 * IMAGING_JOB_EXPIRE_S (its maintenance runs in every worker, every IMAGING_MAINTENANCE_S) and hands it
 * to the next free worker, up to RETRY_LIMIT times.
 */
import PgBoss from "pg-boss";
import { env } from "~/env.server";

export const IMAGING_QUEUE = "imaging-preview";
/** Where pg-boss moves a preview whose every attempt ended without an answer (its row is then failed). */
export const IMAGING_LOST_QUEUE = "imaging-preview-lost";
export const RETRY_LIMIT = 3;

export type QueueRole = "sender" | "worker";

const globalKey = Symbol.for("fringe-docket.imaging-queue");
type Holder = { [globalKey]?: Map<string, Promise<PgBoss>> };

function instances(): Map<string, Promise<PgBoss>> {
  const holder = globalThis as Holder;
  holder[globalKey] ??= new Map();
  return holder[globalKey];
}

async function startBoss(url: string, role: QueueRole): Promise<PgBoss> {
  const config = env();
  const boss = new PgBoss({
    connectionString: url,
    max: 2,
    application_name: `fringe-docket-imaging-${role}`,
    // Only workers run the maintenance that hands a lost job to another worker.
    supervise: role === "worker",
    schedule: false,
    maintenanceIntervalSeconds: config.IMAGING_MAINTENANCE_S,
  });
  boss.on("error", (e) => console.warn(`[imaging] queue: ${e.message}`));
  await boss.start();
  await boss.createQueue(IMAGING_LOST_QUEUE, { name: IMAGING_LOST_QUEUE });
  await boss.createQueue(IMAGING_QUEUE, {
    name: IMAGING_QUEUE,
    deadLetter: IMAGING_LOST_QUEUE,
    retryLimit: RETRY_LIMIT,
    retryDelay: 1,
    expireInSeconds: config.IMAGING_JOB_EXPIRE_S,
  });
  return boss;
}

/** The process's pg-boss for `url` (the app's database by default), started once. */
export function imagingQueue(role: QueueRole = "sender", url = env().DATABASE_URL): Promise<PgBoss> {
  const key = `${role} ${url}`;
  const map = instances();
  let found = map.get(key);
  if (!found) {
    found = startBoss(url, role);
    found.catch(() => map.delete(key));
    map.set(key, found);
  }
  return found;
}

/** Puts a preview on the queue; returns pg-boss's job id. */
export async function sendPreview(jobId: number): Promise<string> {
  const boss = await imagingQueue("sender");
  const config = env();
  const id = await boss.send(
    IMAGING_QUEUE,
    { jobId },
    {
      retryLimit: RETRY_LIMIT,
      retryDelay: 1,
      expireInSeconds: config.IMAGING_JOB_EXPIRE_S,
      deadLetter: IMAGING_LOST_QUEUE,
    },
  );
  if (!id) throw new Error("the imaging queue did not take the job");
  return id;
}

/** Takes a queued preview off the queue (a running one stops through its row: ./worker.server.ts). */
export async function withdrawPreview(queueJobId: string): Promise<void> {
  const boss = await imagingQueue("sender");
  await boss.cancel(IMAGING_QUEUE, queueJobId).catch(() => undefined);
}

/** Stops one pg-boss instance of this process (a worker that stops); the next use starts a new one. */
export async function stopImagingQueue(role: QueueRole, url = env().DATABASE_URL): Promise<void> {
  const map = instances();
  const key = `${role} ${url}`;
  const found = map.get(key);
  map.delete(key);
  await (await found?.catch(() => null))?.stop({ graceful: false, wait: true });
}

/** Stops every pg-boss instance of this process (server shutdown, tests). */
export async function stopImagingQueues(): Promise<void> {
  const map = instances();
  const all = [...map.values()];
  map.clear();
  await Promise.all(all.map(async (p) => (await p.catch(() => null))?.stop({ graceful: false, wait: true })));
}
