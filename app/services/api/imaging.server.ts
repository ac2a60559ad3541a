/**
 * The imaging previews' JSON API (routes/api/imaging-*.ts): start (POST /api/imaging/jobs), list
 * (GET /api/imaging/jobs?proposalId=|cycleId=|source=sketch), one job (GET /api/imaging/jobs/:id),
 * cancel (POST /api/imaging/jobs/:id/cancel) and the OIFITS 2 file (GET /api/imaging/jobs/:id/oifits).
 * Errors are JSON `{error, field}`; a job the caller may not read is the same 404 as a missing one.
 */
import type { Database } from "~/db/client.server";
import type { Viewer } from "~/lib/guards.server";
import { jsonResponse, readJsonBody } from "~/lib/json.server";
import { toId } from "~/lib/not-found";
import { cancelPreview, startPreviews } from "~/services/imaging/commands.server";
import { type ListFilter, listJobs, readJob, readOifits } from "~/services/imaging/queries.server";

const NO_JOB = "No imaging preview of yours has this number.";
const noJob = () => jsonResponse({ error: NO_JOB, field: "id" }, 404);

export async function startResponse(db: Database, { viewer, request }: { viewer: Viewer; request: Request }) {
  const body = await readJsonBody(request, 1024 * 1024);
  if (!body.ok) return body.response;
  const answer = await startPreviews(db, { viewer, json: body.value });
  if (!answer.ok) {
    const headers: Record<string, string> = answer.status === 429 ? { "Retry-After": "30" } : {};
    return jsonResponse({ error: answer.message, field: answer.field }, answer.status, headers);
  }
  return jsonResponse({ jobs: answer.jobs.map((j) => ({ ...j, url: `/api/imaging/jobs/${j.id}` })) }, 202);
}

export async function listResponse(db: Database, { viewer, url }: { viewer: Viewer; url: URL }) {
  const q = url.searchParams;
  let filter: ListFilter;
  if (q.has("proposalId")) {
    const proposalId = toId(q.get("proposalId"));
    if (proposalId === null)
      return jsonResponse({ error: "proposalId: must be a proposal number", field: "proposalId" }, 400);
    filter = { kind: "proposal", proposalId };
  } else if (q.has("cycleId")) {
    const cycleId = toId(q.get("cycleId"));
    if (cycleId === null) return jsonResponse({ error: "cycleId: must be a cycle number", field: "cycleId" }, 400);
    filter = { kind: "cycle", cycleId };
  } else {
    const source = q.get("source");
    if (source !== null && source !== "sketch")
      return jsonResponse({ error: "source: must be sketch", field: "source" }, 400);
    filter = { kind: "mine", sketchOnly: source === "sketch" };
  }
  const jobs = await listJobs(db, { viewer, filter });
  if (!jobs) return jsonResponse({ error: "Nothing here for you to see.", field: null }, 404);
  return jsonResponse({ jobs });
}

/** What a job's URL names: who asks, and the `:id` as written. */
type JobAddress = { viewer: Viewer; idParam: string | undefined };

/** The id in the URL and what `read` finds under it; null when the id is malformed or nothing of the viewer's has it. */
async function lookUp<T>(
  idParam: string | undefined,
  read: (jobId: number) => Promise<T | null>,
): Promise<{ jobId: number; found: T } | null> {
  const jobId = toId(idParam);
  const found = jobId === null ? null : await read(jobId);
  return jobId === null || found === null ? null : { jobId, found };
}

export async function jobResponse(db: Database, { viewer, idParam }: JobAddress) {
  const job = await lookUp(idParam, (jobId) => readJob(db, { viewer, jobId }));
  return job ? jsonResponse(job.found) : noJob();
}

export async function cancelResponse(db: Database, { viewer, idParam }: JobAddress) {
  const job = (await lookUp(idParam, (jobId) => readJob(db, { viewer, jobId })))?.found;
  if (!job) return noJob();
  if (job.readOnly)
    return jsonResponse({ error: "Only the person who started a preview can cancel it.", field: null }, 403);
  if (!(await cancelPreview(db, { viewer, jobId: job.id }))) {
    return jsonResponse(
      { error: `This preview is ${job.state}: only a queued or running one can be cancelled.`, field: null },
      409,
    );
  }
  return jsonResponse(await readJob(db, { viewer, jobId: job.id }));
}

export async function oifitsResponse(db: Database, { viewer, idParam }: JobAddress) {
  const hit = await lookUp(idParam, (jobId) => readOifits(db, { viewer, jobId }));
  if (!hit) return noJob();
  const { jobId, found: file } = hit;
  if (file.state !== "done" || !file.oifits) {
    return jsonResponse(
      { error: `This preview is ${file.state}: its data are written when it is done.`, field: null },
      409,
    );
  }
  const name = file.label.replace(/[^\w.-]+/g, "_").replace(/^_+|_+$/g, "") || "preview";
  return new Response(new Uint8Array(file.oifits), {
    headers: {
      "Content-Type": "application/fits",
      "Content-Disposition": `attachment; filename="imaging-preview-${jobId}-${name}.fits"`,
      "Content-Length": String(file.oifits.byteLength),
      "Cache-Control": "no-store",
    },
  });
}
