/**
 * The browser side of the imaging previews' API: SWR over GET /api/imaging/jobs/:id (polled every
 * second while the job is queued or running) and over a list, and the start and cancel calls.
 */
import useSWR from "swr";
import type { ImagingJobJson } from "~/services/imaging/schemas";

export type ImagingJob = ImagingJobJson;

export class ImagingApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly field: string | null,
  ) {
    super(message);
  }
}

async function call<T>(url: string, init?: RequestInit): Promise<T> {
  let res: Response;
  try {
    res = await fetch(url, { credentials: "same-origin", headers: { Accept: "application/json" }, ...init });
  } catch {
    throw new ImagingApiError(0, "The server could not be reached. Check the connection and try again.", null);
  }
  const body = (await res.json().catch(() => null)) as { error?: string; field?: string | null } | null;
  if (!res.ok) {
    const message =
      res.status === 401
        ? "Your session has ended: sign in again to continue."
        : (body?.error ?? `The server answered ${res.status}.`);
    throw new ImagingApiError(res.status, message, body?.field ?? null);
  }
  return body as T;
}

export const jobUrl = (id: number) => `/api/imaging/jobs/${id}`;
export const oifitsUrl = (id: number) => `/api/imaging/jobs/${id}/oifits`;
const active = (job: ImagingJob | undefined) => job?.state === "queued" || job?.state === "running";

/** One job, polled every second while it is queued or running. */
export function useImagingJob(id: number | null) {
  return useSWR<ImagingJob, ImagingApiError>(id === null ? null : jobUrl(id), (u: string) => call<ImagingJob>(u), {
    refreshInterval: (job) => (job === undefined || active(job) ? 1000 : 0),
    revalidateOnFocus: false,
  });
}

/** A list of jobs (without results), polled every two seconds while any is under way. */
export function useImagingJobs(url: string | null) {
  return useSWR<{ jobs: ImagingJob[] }, ImagingApiError>(url, (u: string) => call<{ jobs: ImagingJob[] }>(u), {
    refreshInterval: (list) => (list?.jobs.some(active) ? 2000 : 0),
    revalidateOnFocus: false,
  });
}

export function startImaging(body: unknown) {
  return call<{ jobs: { id: number; label: string }[] }>("/api/imaging/jobs", {
    method: "POST",
    headers: { "Content-Type": "application/json", Accept: "application/json" },
    body: JSON.stringify(body),
  });
}

export function cancelImaging(id: number) {
  return call<ImagingJob>(`${jobUrl(id)}/cancel`, { method: "POST" });
}

export const STATE_LABELS: Record<ImagingJob["state"], string> = {
  queued: "Waiting for a worker",
  running: "Reconstructing",
  done: "Done",
  failed: "Failed",
  cancelled: "Cancelled",
};
