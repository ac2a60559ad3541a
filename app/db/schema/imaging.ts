/**
 * Imaging previews: one row per background job that simulates what a coverage would measure and
 * reconstructs an image from it (app/services/imaging/, run by the worker process on pg-boss). The row
 * is the job as people see it: what it was made from, the request, its state and progress, the result,
 * the OIFITS 2 file of the simulated data, or the error.
 */
import { sql } from "drizzle-orm";
import { customType, doublePrecision, index, integer, jsonb, pgEnum, pgTable, text } from "drizzle-orm/pg-core";
import { instant, optionalRefTo, refTo, serialId } from "./columns";
import { cycles, proposalTargets } from "./proposals";
import { users } from "./users";

const bytea = customType<{ data: Buffer; driverData: Buffer }>({ dataType: () => "bytea" });

export const IMAGING_STATES = ["queued", "running", "done", "failed", "cancelled"] as const;
export type ImagingState = (typeof IMAGING_STATES)[number];
export const imagingStateEnum = pgEnum("imaging_job_state", IMAGING_STATES);

/** Where a preview's coverage and model came from. */
export const IMAGING_SOURCES = ["sketch", "proposalTarget"] as const;
export type ImagingSource = (typeof IMAGING_SOURCES)[number];

export const imagingJobs = pgTable(
  "imaging_jobs",
  {
    id: serialId(),
    ownerId: refTo(() => users.id),
    source: text("source").$type<ImagingSource>().notNull(),
    /** The proposal target it was made from (source "proposalTarget"). */
    proposalTargetId: optionalRefTo(() => proposalTargets.id, "cascade"),
    /** Set when the chair queued it with the previews of a whole cycle. */
    cycleBatchId: optionalRefTo(() => cycles.id, "cascade"),
    /** What the preview shows (the target's name), for lists. */
    label: text("label").notNull(),
    /** The validated simulate request and the image options (`ImagingJobRequest`, services/imaging/schemas.ts). */
    request: jsonb("request").$type<Record<string, unknown>>().notNull(),
    state: imagingStateEnum("state").notNull().default("queued"),
    /** Optimizer iterations so far and the reduced χ² at the last one. */
    iteration: integer("iteration").notNull().default(0),
    chi2: doublePrecision("chi2"),
    /** Iterations the run may take in all (the automatic weight's trial runs included), for the progress bar. */
    iterationBudget: integer("iteration_budget").notNull().default(0),
    /** The reconstruct response (images, χ² per observable, fidelity, verdict) and what the simulation made. */
    result: jsonb("result").$type<Record<string, unknown>>(),
    oifits: bytea("oifits"),
    error: text("error"),
    /** The pg-boss job that runs it, and how many times a worker has started it. */
    queueJobId: text("queue_job_id"),
    attempts: integer("attempts").notNull().default(0),
    createdAt: instant("created_at").notNull().defaultNow(),
    startedAt: instant("started_at"),
    finishedAt: instant("finished_at"),
    updatedAt: instant("updated_at").notNull().defaultNow(),
  },
  (t) => [
    index("imaging_jobs_owner_idx").on(t.ownerId, t.createdAt),
    index("imaging_jobs_target_idx").on(t.proposalTargetId),
    index("imaging_jobs_batch_idx").on(t.cycleBatchId),
    index("imaging_jobs_active_idx").on(t.ownerId).where(sql`${t.state} in ('queued', 'running')`),
  ],
);
