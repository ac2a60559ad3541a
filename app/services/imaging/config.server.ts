/**
 * The imaging preview's part of the server's environment (spread into the app's one env schema in
 * app/env.server.ts; `.env.example` documents each variable).
 */
import * as v from "valibot";
import { envWholeNumber } from "~/lib/env-values";

export const IMAGING_ENV_ENTRIES = {
  /** Worker processes `npm start` (scripts/serve.ts) starts beside the server; 0 when they run elsewhere. */
  IMAGING_WORKERS: v.optional(envWholeNumber(0, 16), "1"),
  /** Previews one worker process runs at once (each on a thread of its own). */
  IMAGING_WORKER_CONCURRENCY: v.optional(envWholeNumber(1, 16), "1"),
  /** Previews one person may have queued or running; one more is refused with 429. */
  IMAGING_JOBS_PER_PERSON: v.optional(envWholeNumber(1, 100), "3"),
  /** Seconds after which a started preview whose worker went away is handed to another worker. */
  IMAGING_JOB_EXPIRE_S: v.optional(envWholeNumber(2, 86_400), "900"),
  /** How often a worker looks for such previews (pg-boss maintenance), seconds. */
  IMAGING_MAINTENANCE_S: v.optional(envWholeNumber(1, 3600), "30"),
};
