/**
 * Reading imaging previews: one job with its state, progress and (when done) its result; the lists a
 * page polls (the viewer's own, a proposal's, a cycle's queue); the OIFITS file. Every read is scoped:
 * see ./access.server.ts.
 */
import { and, desc, eq, inArray, isNull, type SQL } from "drizzle-orm";
import type { Database } from "~/db/client.server";
import { type ImagingState, imagingJobs } from "~/db/schema/imaging";
import { proposalTargets } from "~/db/schema/proposals";
import type { Viewer } from "~/lib/guards.server";
import { proposalReading } from "./access.server";
import type { ImagingJobJson, ImagingJobRequest } from "./schemas";

type JobRow = typeof imagingJobs.$inferSelect;

/** The settings a job was started with, as the panel shows them. */
export function settingsOf(request: ImagingJobRequest) {
  const { noise, closurePhaseTriangles } = request.simulate;
  return {
    ...request.image,
    vis2Relative: noise.vis2Relative,
    closurePhaseDeg: noise.closurePhaseDeg,
    closurePhaseTriangles,
  };
}

/** The JSON of a job; `full` adds the result (images, χ², fidelity, verdict). */
export function jobJson(
  row: Omit<JobRow, "oifits">,
  { readOnly, full }: { readOnly: boolean; full: boolean },
): ImagingJobJson {
  const request = row.request as unknown as ImagingJobRequest;
  return {
    id: row.id,
    state: row.state,
    source: row.source,
    label: row.label,
    proposalTargetId: row.proposalTargetId,
    cycleBatchId: row.cycleBatchId,
    readOnly,
    settings: settingsOf(request),
    model: request.model,
    progress: { iteration: row.iteration, chi2: row.chi2, iterationBudget: row.iterationBudget },
    attempts: row.attempts,
    error: row.error,
    createdAt: row.createdAt.toISOString(),
    startedAt: row.startedAt?.toISOString() ?? null,
    finishedAt: row.finishedAt?.toISOString() ?? null,
    hasOifits: row.state === "done",
    result: full && row.state === "done" ? row.result : null,
  };
}

const withoutBytes = {
  id: imagingJobs.id,
  ownerId: imagingJobs.ownerId,
  source: imagingJobs.source,
  proposalTargetId: imagingJobs.proposalTargetId,
  cycleBatchId: imagingJobs.cycleBatchId,
  label: imagingJobs.label,
  request: imagingJobs.request,
  state: imagingJobs.state,
  iteration: imagingJobs.iteration,
  chi2: imagingJobs.chi2,
  iterationBudget: imagingJobs.iterationBudget,
  result: imagingJobs.result,
  error: imagingJobs.error,
  queueJobId: imagingJobs.queueJobId,
  attempts: imagingJobs.attempts,
  createdAt: imagingJobs.createdAt,
  startedAt: imagingJobs.startedAt,
  finishedAt: imagingJobs.finishedAt,
  updatedAt: imagingJobs.updatedAt,
};

/** How the viewer may read a job row: "owner", "reader" or null (not theirs: a 404). */
async function readingOf(db: Database, viewer: Viewer, row: { ownerId: number; proposalTargetId: number | null }) {
  if (row.ownerId === viewer.user.id) return "owner" as const;
  if (row.proposalTargetId === null) return null;
  const [t] = await db
    .select({ proposalId: proposalTargets.proposalId })
    .from(proposalTargets)
    .where(eq(proposalTargets.id, row.proposalTargetId));
  if (!t) return null;
  return (await proposalReading(db, viewer, t.proposalId)) ? ("reader" as const) : null;
}

/** One job for the viewer, with its result, or null when it is not theirs to read. */
export async function readJob(db: Database, { viewer, jobId }: { viewer: Viewer; jobId: number }) {
  const [row] = await db.select(withoutBytes).from(imagingJobs).where(eq(imagingJobs.id, jobId));
  if (!row) return null;
  const reading = await readingOf(db, viewer, row);
  if (!reading) return null;
  return jobJson(row, { readOnly: reading !== "owner", full: true });
}

/** The OIFITS bytes of a finished job the viewer may read (null otherwise), with its label. */
export async function readOifits(db: Database, { viewer, jobId }: { viewer: Viewer; jobId: number }) {
  const [row] = await db
    .select({
      ownerId: imagingJobs.ownerId,
      proposalTargetId: imagingJobs.proposalTargetId,
      state: imagingJobs.state,
      label: imagingJobs.label,
      oifits: imagingJobs.oifits,
    })
    .from(imagingJobs)
    .where(eq(imagingJobs.id, jobId));
  if (!row || !(await readingOf(db, viewer, row))) return null;
  return { state: row.state as ImagingState, label: row.label, oifits: row.oifits };
}

export type ListFilter =
  | { kind: "mine"; sketchOnly: boolean }
  | { kind: "proposal"; proposalId: number }
  | { kind: "cycle"; cycleId: number };

const LIST_LIMIT = 50;

/** A list of jobs without their results (newest first), or null when the viewer may not read it. */
export async function listJobs(db: Database, { viewer, filter }: { viewer: Viewer; filter: ListFilter }) {
  let where: SQL | undefined;
  if (filter.kind === "mine") {
    where = and(
      eq(imagingJobs.ownerId, viewer.user.id),
      filter.sketchOnly ? isNull(imagingJobs.proposalTargetId) : undefined,
    );
  } else if (filter.kind === "proposal") {
    if (!(await proposalReading(db, viewer, filter.proposalId))) return null;
    const targets = await db
      .select({ id: proposalTargets.id })
      .from(proposalTargets)
      .where(eq(proposalTargets.proposalId, filter.proposalId));
    if (targets.length === 0) return [];
    where = inArray(
      imagingJobs.proposalTargetId,
      targets.map((t) => t.id),
    );
  } else {
    if (!viewer.permissions.has("cycles:manage")) return null;
    where = eq(imagingJobs.cycleBatchId, filter.cycleId);
  }
  const rows = await db
    .select(withoutBytes)
    .from(imagingJobs)
    .where(where)
    .orderBy(desc(imagingJobs.id))
    .limit(LIST_LIMIT);
  return rows.map((r) => jobJson(r, { readOnly: r.ownerId !== viewer.user.id, full: false }));
}
