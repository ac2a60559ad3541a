/**
 * `npm run worker`: an imaging-preview worker process. Takes previews off the pg-boss queue in the
 * app's database (DATABASE_URL) and runs them (app/services/imaging/worker.server.ts). `npm start`
 * starts IMAGING_WORKERS of these beside the server; a site scales out by running more of them, on
 * this machine or others, against the same database. Ctrl-C or SIGTERM hands the previews it is
 * running back to the queue and stops.
 */
import { closeDatabase, database } from "~/db/client.server";
import { env } from "~/env.server";
import { startImagingWorker } from "~/services/imaging/worker.server";

const config = env();
const worker = await startImagingWorker(database(), {
  url: config.DATABASE_URL,
  concurrency: config.IMAGING_WORKER_CONCURRENCY,
});
console.log(
  `[imaging] worker ${process.pid} takes previews (${config.IMAGING_WORKER_CONCURRENCY} at a time) from the queue in ${new URL(config.DATABASE_URL).pathname.slice(1)}`,
);

let stopping = false;
async function stop() {
  if (stopping) return;
  stopping = true;
  const timer = setTimeout(() => process.exit(1), 10_000);
  await worker.stop();
  await closeDatabase();
  clearTimeout(timer);
  process.exit(0);
}
process.on("SIGINT", () => void stop());
process.on("SIGTERM", () => void stop());
