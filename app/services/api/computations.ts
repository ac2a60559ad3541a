/**
 * The computations of the JSON API, by name: how a request is validated (400), what its cost budget
 * refuses (422), and the computation itself, serialized to the bytes of the JSON answer. Shared by the
 * worker threads (./compute.worker.ts) and the in-process path, so both answer byte for byte alike.
 * Imports the engine only: this module is loaded inside the worker threads.
 */
import {
  type BudgetFailure,
  computeCoverage,
  computeEphemeris,
  computePlan,
  coverageBudgetFailure,
  type ParseResult,
  parseCoverageRequest,
  parseEphemerisRequest,
  parsePlanRequest,
  parseRankRequest,
  parseTrianglesRequest,
  rankReviews,
  rankTriangles,
  trianglesBudgetFailure,
} from "~/engine";

export interface Computation<T> {
  parse: (json: unknown) => ParseResult<T>;
  budget: (value: T) => BudgetFailure | null;
  compute: (value: T) => unknown;
}

const define = <T>(c: Computation<T>): Computation<unknown> => c as Computation<unknown>;

export const COMPUTATIONS = {
  coverage: define({ parse: parseCoverageRequest, budget: coverageBudgetFailure, compute: computeCoverage }),
  triangles: define({ parse: parseTrianglesRequest, budget: trianglesBudgetFailure, compute: rankTriangles }),
  ephemeris: define({ parse: parseEphemerisRequest, budget: () => null, compute: computeEphemeris }),
  // The plan's size is capped by its schema (targets, calibrators, blocks, delay-line work).
  plan: define({ parse: parsePlanRequest, budget: () => null, compute: computePlan }),
  // Capped by its schema too (reviews, identifier lengths).
  rank: define({ parse: parseRankRequest, budget: () => null, compute: rankReviews }),
} as const;

export type ComputationName = keyof typeof COMPUTATIONS;

/** What a computation answers: the JSON bytes, or the reason it refused a validated request. */
export type ComputedAnswer = { ok: true; json: Uint8Array } | { ok: false; refusal: string };

const encoder = new TextEncoder();

/**
 * Runs a validated, within-budget request and serializes the answer to UTF-8 JSON. A RangeError of the
 * computation (an input the schema lets through but the computation cannot use) is a refusal; any
 * other error is a fault and is thrown.
 */
export function computeJson(name: ComputationName, value: unknown): ComputedAnswer {
  try {
    return { ok: true, json: encoder.encode(JSON.stringify(COMPUTATIONS[name].compute(value))) };
  } catch (e) {
    if (e instanceof RangeError) return { ok: false, refusal: e.message };
    throw e;
  }
}
