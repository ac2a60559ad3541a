/**
 * Entry of the worker threads of the computation pool (./pool.server.ts): one task is one validated
 * request of one computation. The answer's JSON bytes are moved, not copied, back to the main thread;
 * a refusal comes back as `{ refusal }`. Built on its own into build/server/compute-worker.js by
 * react-router.config.ts; loaded from this source through tsx's loader when the app runs from source
 * (tests, development).
 */
import { move } from "piscina";
import { type ComputationName, computeJson } from "./computations";

export interface ComputeTask {
  name: ComputationName;
  value: unknown;
}

export type WorkerAnswer = Uint8Array | { refusal: string };

export default function compute(task: ComputeTask): WorkerAnswer {
  const answer = computeJson(task.name, task.value);
  return answer.ok ? (move(answer.json) as Uint8Array) : { refusal: answer.refusal };
}
