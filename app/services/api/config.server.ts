/**
 * The computation pool's part of the server's environment (spread into the app's one env schema in
 * app/env.server.ts; `.env.example` documents each variable) and the pool settings it gives.
 */
import { availableParallelism } from "node:os";
import * as v from "valibot";
import { envWholeNumber } from "~/lib/env-values";

export const COMPUTE_ENV_ENTRIES = {
  /** Worker threads computing coverage, triangles and ephemerides; "auto" = one per core. */
  COMPUTE_THREADS: v.optional(v.union([v.literal("auto"), envWholeNumber(1, 64)], 'must be "auto" or 1 to 64'), "auto"),
  /** Computations that may wait for a thread; one more is answered 503 with Retry-After. */
  COMPUTE_QUEUE: v.optional(envWholeNumber(0, 10_000), "64"),
  /** Computations one person may have running or waiting; one more is answered 429 with Retry-After. */
  COMPUTE_PER_PERSON: v.optional(envWholeNumber(1, 1000), "4"),
};

export interface PoolSettings {
  /** Worker threads. */
  threads: number;
  /** Computations that may wait for a free thread. */
  queue: number;
  /** Computations one person may have running or waiting. */
  perPerson: number;
  /** Added to the threads' nice value (lower priority than the event loop); Linux and macOS. */
  niceIncrement: number;
}

type ComputeEnv = v.InferOutput<v.ObjectSchema<typeof COMPUTE_ENV_ENTRIES, undefined>>;

/** The pool settings of a validated environment. */
export function poolSettingsFrom(e: ComputeEnv): PoolSettings {
  return {
    threads: e.COMPUTE_THREADS === "auto" ? Math.max(1, availableParallelism()) : e.COMPUTE_THREADS,
    queue: e.COMPUTE_QUEUE,
    perPerson: e.COMPUTE_PER_PERSON,
    niceIncrement: 10,
  };
}
