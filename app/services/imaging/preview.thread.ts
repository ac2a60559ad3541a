/**
 * A worker thread that runs one preview (./preview.ts) for the worker process (./worker.server.ts).
 * In: `workerData` = { request, writtenUtc, stop } with `stop` an Int32Array on shared memory that the
 * process sets to 1 to stop the reconstruction (cancelled). Out: "progress" messages (at most ten a
 * second), then one "done" (result and OIFITS bytes) or "failed" (the reason, for people).
 */
import { parentPort, workerData } from "node:worker_threads";
import { PreviewRefusal, runPreview } from "./preview";
import type { ImagingJobRequest } from "./schemas";

export type ThreadMessage =
  | { type: "progress"; iteration: number; chi2: number }
  | { type: "done"; result: unknown; oifits: Uint8Array; stopped: boolean }
  | { type: "failed"; message: string };

const { request, writtenUtc, stop } = workerData as {
  request: ImagingJobRequest;
  writtenUtc: string;
  stop: Int32Array;
};
const post = (m: ThreadMessage, transfer: ArrayBuffer[] = []) => parentPort?.postMessage(m, transfer);

let last = 0;
let stopped = false;
try {
  const { result, oifits } = runPreview(
    request,
    (iteration, chi2) => {
      const now = Date.now();
      if (now - last >= 100) {
        last = now;
        post({ type: "progress", iteration, chi2 });
      }
      stopped = Atomics.load(stop, 0) === 1;
      return stopped;
    },
    writtenUtc,
  );
  post({ type: "progress", iteration: result.iterations, chi2: result.chi2Fitted });
  post({ type: "done", result, oifits, stopped }, [oifits.buffer as ArrayBuffer]);
} catch (e) {
  const message =
    e instanceof PreviewRefusal || e instanceof RangeError
      ? e.message
      : `The computation failed: ${e instanceof Error ? e.message : String(e)}`;
  post({ type: "failed", message });
}
