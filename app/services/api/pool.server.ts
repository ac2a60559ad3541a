/**
 * The pool of worker threads that runs the computations of the JSON API off the event loop, so a
 * long computation never delays a page. Bounded: a fixed number of threads, a fixed number of
 * computations waiting for one (beyond: 503 with Retry-After), and a fixed number of computations per
 * person running or waiting (beyond: 429 with Retry-After). The threads run at a lower scheduling
 * priority than the event loop (a nice increment), so pages keep their share of the cores.
 *
 * The worker is ./compute.worker.ts: in a production build its compiled copy `compute-worker.js`
 * beside the server bundle, else the source itself through tsx's loader.
 */
import { existsSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import Piscina from "piscina";
import { env } from "~/env.server";
import type { ComputationName } from "./computations";
import type { ComputeTask, WorkerAnswer } from "./compute.worker";
import { type PoolSettings, poolSettingsFrom } from "./config.server";

export type { PoolSettings } from "./config.server";

/** What the pool did with a computation. */
export type PoolAnswer =
  | { kind: "done"; json: Uint8Array }
  /** The computation refused the request (a RangeError): the client's mistake. */
  | { kind: "refused"; message: string }
  /** Not run: every thread busy and the queue full, or the person's share used; try again later. */
  | { kind: "busy" | "too-many"; message: string; retryAfterS: number }
  /** The client went away before the answer was ready. */
  | { kind: "cancelled" };

/** Where the worker entry is: the built copy beside the bundle, else the source run through tsx. */
export function workerEntry(): { filename: string; execArgv: string[] } {
  const here = dirname(fileURLToPath(import.meta.url));
  for (const dir of [here, dirname(here)]) {
    const built = join(dir, "compute-worker.js");
    if (existsSync(built)) return { filename: built, execArgv: [] };
  }
  return { filename: join(here, "compute.worker.ts"), execArgv: ["--import", "tsx"] };
}

const clamp = (x: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, x));
const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

export class ComputePool {
  readonly settings: PoolSettings;
  readonly #piscina: Piscina<ComputeTask, WorkerAnswer>;
  #inFlight = 0;
  readonly #byPerson = new Map<number, number>();
  /** Running mean duration of a computation, ms (for Retry-After). */
  #meanMs = 500;

  constructor(settings: PoolSettings, entry = workerEntry()) {
    this.settings = settings;
    this.#piscina = new Piscina<ComputeTask, WorkerAnswer>({
      filename: entry.filename,
      execArgv: entry.execArgv,
      minThreads: settings.threads,
      maxThreads: settings.threads,
      // The pool's own count refuses first; this is the backstop.
      maxQueue: settings.queue + settings.threads,
      idleTimeout: 60_000,
      niceIncrement: settings.niceIncrement,
    });
  }

  /** Computations running or waiting, in all and for one person. */
  inFlight(personId?: number): number {
    return personId === undefined ? this.#inFlight : (this.#byPerson.get(personId) ?? 0);
  }

  /** Seconds after which a computation refused now would likely be taken. */
  #retryAfterS(waitingAhead: number): number {
    return clamp(Math.ceil((this.#meanMs * (waitingAhead + 1)) / this.settings.threads / 1000), 1, 60);
  }

  /** Runs a validated, within-budget request on a worker thread, if the pool and the person have room. */
  async run(name: ComputationName, value: unknown, personId: number, signal?: AbortSignal): Promise<PoolAnswer> {
    const { threads, queue, perPerson } = this.settings;
    const mine = this.#byPerson.get(personId) ?? 0;
    if (mine >= perPerson) {
      const retryAfterS = this.#retryAfterS(0);
      return {
        kind: "too-many",
        retryAfterS,
        message:
          `you already have ${plural(mine, "computation")} running or waiting (at most ${perPerson} per person); ` +
          `try again in ${retryAfterS} s, once one has finished`,
      };
    }
    if (this.#inFlight >= threads + queue) {
      const retryAfterS = this.#retryAfterS(this.#inFlight - threads);
      return {
        kind: "busy",
        retryAfterS,
        message:
          `the server is busy: ${plural(threads, "computation")} running and ${queue} waiting, the most it takes; ` +
          `try again in ${retryAfterS} s`,
      };
    }
    if (signal?.aborted) return { kind: "cancelled" };
    this.#inFlight++;
    this.#byPerson.set(personId, mine + 1);
    const started = performance.now();
    try {
      const answer = await this.#piscina.run({ name, value }, { signal });
      this.#meanMs = 0.8 * this.#meanMs + 0.2 * (performance.now() - started);
      return answer instanceof Uint8Array
        ? { kind: "done", json: answer }
        : { kind: "refused", message: answer.refusal };
    } catch (e) {
      if (signal?.aborted) return { kind: "cancelled" };
      throw e;
    } finally {
      this.#inFlight--;
      const left = (this.#byPerson.get(personId) ?? 1) - 1;
      if (left > 0) this.#byPerson.set(personId, left);
      else this.#byPerson.delete(personId);
    }
  }

  /** Stops the threads; computations still running are abandoned. */
  close(): Promise<void> {
    return this.#piscina.destroy();
  }
}

let shared: ComputePool | null = null;

const computePoolSettings = () => poolSettingsFrom(env());

/** The app's pool, started on first use with the settings of the environment (config.server.ts). */
export function computePool(): ComputePool {
  shared ??= new ComputePool(computePoolSettings());
  return shared;
}

/**
 * Replaces the app's pool by one with other settings (tests: one thread, a short queue), closing
 * the previous one; `null` goes back to the environment's settings on next use.
 */
export async function configureComputePool(settings: Partial<PoolSettings> | null): Promise<ComputePool | null> {
  const previous = shared;
  shared = settings === null ? null : new ComputePool({ ...computePoolSettings(), ...settings });
  await previous?.close();
  return shared;
}

/** Stops the app's pool (server shutdown). */
export async function closeComputePool(): Promise<void> {
  const previous = shared;
  shared = null;
  await previous?.close();
}
