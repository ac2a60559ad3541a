/**
 * Starting and cancelling imaging previews. A start validates the request, builds the simulate request
 * from its source, counts the person's previews queued or running (at most IMAGING_JOBS_PER_PERSON;
 * the chair's queue of a whole cycle is counted apart: one at a time per cycle) under a lock per person,
 * writes the row and, after the commit, puts the job on the pg-boss queue.
 */
import { and, count, eq, inArray, isNull, sql } from "drizzle-orm";
import * as v from "valibot";
import type { Database } from "~/db/client.server";
import { imagingJobs } from "~/db/schema/imaging";
import { cycles } from "~/db/schema/proposals";
import { env } from "~/env.server";
import type { Viewer } from "~/lib/guards.server";
import { mayPreviewProposal } from "./access.server";
import { sendPreview, withdrawPreview } from "./queue.server";
import { type ImagingSettings, jobRequestOf, StartImagingSchema } from "./schemas";
import {
  type BuiltSource,
  imagingTargetsOfCycle,
  PreviewSourceError,
  proposalTargetSource,
  sketchSource,
} from "./sources.server";

export { PreviewSourceError } from "./sources.server";

const ACTIVE = ["queued", "running"] as const;

export type StartAnswer =
  | { ok: true; jobs: { id: number; label: string }[] }
  | { ok: false; status: number; message: string; field: string | null };

/** A refused start: the HTTP status, the reason, and the field to change (null for the request as a whole). */
const refusal = (status: number, message: string, field: string | null): StartAnswer => ({
  ok: false,
  status,
  message,
  field,
});

function issueText(issues: v.BaseIssue<unknown>[]) {
  const issue = issues[0];
  const path = issue.path?.map((p) => String(p.key)).join(".") ?? null;
  return { message: path ? `${path}: ${issue.message}` : issue.message, field: path };
}

type NewJob = BuiltSource & { proposalTargetId: number | null; cycleBatchId: number | null };

async function insertJobs(db: Database, viewer: Viewer, jobs: NewJob[], settings: ImagingSettings, batch: boolean) {
  const limit = env().IMAGING_JOBS_PER_PERSON;
  return db.transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(hashtext('imaging-jobs'), ${viewer.user.id})`);
    const mine = and(eq(imagingJobs.ownerId, viewer.user.id), inArray(imagingJobs.state, [...ACTIVE]));
    const [{ n }] = await tx
      .select({ n: count() })
      .from(imagingJobs)
      .where(
        and(mine, batch ? eq(imagingJobs.cycleBatchId, jobs[0].cycleBatchId ?? 0) : isNull(imagingJobs.cycleBatchId)),
      );
    if (batch && n > 0) {
      return { refused: "The previews of this cycle are still under way: wait until they have finished." } as const;
    }
    if (!batch && n + jobs.length > limit) {
      return {
        refused: `You have ${n} imaging previews queued or running; at most ${limit} at a time. Wait for one to finish or cancel one.`,
      } as const;
    }
    const rows = await tx
      .insert(imagingJobs)
      .values(
        jobs.map((j) => ({
          ownerId: viewer.user.id,
          source: j.proposalTargetId === null ? ("sketch" as const) : ("proposalTarget" as const),
          proposalTargetId: j.proposalTargetId,
          cycleBatchId: j.cycleBatchId,
          label: j.label,
          request: jobRequestOf(j.simulate, settings) as unknown as Record<string, unknown>,
          iterationBudget: settings.maxIterations,
        })),
      )
      .returning({ id: imagingJobs.id, label: imagingJobs.label });
    return { rows } as const;
  });
}

/** Puts written rows on the queue; a row the queue would not take is failed with the reason. */
async function enqueue(db: Database, rows: { id: number }[]) {
  for (const row of rows) {
    try {
      const queueJobId = await sendPreview(row.id);
      await db.update(imagingJobs).set({ queueJobId }).where(eq(imagingJobs.id, row.id));
    } catch (e) {
      await db
        .update(imagingJobs)
        .set({
          state: "failed",
          error: `The preview could not be queued: ${(e as Error).message}`,
          finishedAt: new Date(),
        })
        .where(eq(imagingJobs.id, row.id));
    }
  }
}

/** POST /api/imaging/jobs: validates and starts one preview (or, for the chair, every one of a cycle). */
export async function startPreviews(
  db: Database,
  { viewer, json }: { viewer: Viewer; json: unknown },
): Promise<StartAnswer> {
  const parsed = v.safeParse(StartImagingSchema, json);
  if (!parsed.success) return { ok: false, status: 400, ...issueText(parsed.issues) };
  const { source, settings } = parsed.output;
  let jobs: NewJob[];
  try {
    if (source.kind === "sketch") {
      jobs = [{ ...sketchSource(source.coverage, settings), proposalTargetId: null, cycleBatchId: null }];
    } else if (source.kind === "proposalTarget") {
      if (!(await mayPreviewProposal(db, viewer, source.proposalId))) {
        return refusal(404, "No proposal of yours has this number.", "source.proposalId");
      }
      const built = await proposalTargetSource(db, { ...source, settings });
      jobs = [{ ...built, proposalTargetId: source.targetId, cycleBatchId: null }];
    } else {
      if (!viewer.permissions.has("cycles:manage")) {
        return refusal(403, "Only the chair queues the previews of a whole cycle.", "source");
      }
      const [cycle] = await db.select({ id: cycles.id }).from(cycles).where(eq(cycles.id, source.cycleId));
      if (!cycle) return refusal(404, "No cycle has this number.", "source.cycleId");
      const targets = await imagingTargetsOfCycle(db, { cycleId: source.cycleId });
      if (targets.length === 0) {
        return refusal(409, "No submitted proposal of this cycle has an imaging target.", "source");
      }
      jobs = [];
      for (const t of targets) {
        try {
          const built = await proposalTargetSource(db, { ...t, settings });
          jobs.push({ ...built, proposalTargetId: t.targetId, cycleBatchId: source.cycleId });
        } catch (e) {
          if (!(e instanceof PreviewSourceError)) throw e;
        }
      }
      if (jobs.length === 0) {
        return refusal(409, "None of the cycle's imaging targets can be previewed.", "source");
      }
    }
  } catch (e) {
    if (e instanceof PreviewSourceError) return refusal(e.status, e.message, e.field);
    throw e;
  }
  const written = await insertJobs(db, viewer, jobs, settings, source.kind === "cycle");
  if ("refused" in written) return refusal(429, written.refused ?? "", null);
  await enqueue(db, written.rows);
  return { ok: true, jobs: written.rows };
}

/** Cancels the owner's preview when it is queued or running; answers the state it is left in. */
export async function cancelPreview(db: Database, { viewer, jobId }: { viewer: Viewer; jobId: number }) {
  const [row] = await db
    .update(imagingJobs)
    .set({ state: "cancelled", finishedAt: new Date(), updatedAt: new Date() })
    .where(
      and(eq(imagingJobs.id, jobId), eq(imagingJobs.ownerId, viewer.user.id), inArray(imagingJobs.state, [...ACTIVE])),
    )
    .returning({ queueJobId: imagingJobs.queueJobId });
  if (row?.queueJobId) await withdrawPreview(row.queueJobId);
  return row !== undefined;
}
