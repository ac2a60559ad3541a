CREATE TYPE "public"."imaging_job_state" AS ENUM('queued', 'running', 'done', 'failed', 'cancelled');--> statement-breakpoint
CREATE TABLE "imaging_jobs" (
	"id" serial PRIMARY KEY NOT NULL,
	"owner_id" integer NOT NULL,
	"source" text NOT NULL,
	"proposal_target_id" integer,
	"cycle_batch_id" integer,
	"label" text NOT NULL,
	"request" jsonb NOT NULL,
	"state" "imaging_job_state" DEFAULT 'queued' NOT NULL,
	"iteration" integer DEFAULT 0 NOT NULL,
	"chi2" double precision,
	"iteration_budget" integer DEFAULT 0 NOT NULL,
	"result" jsonb,
	"oifits" "bytea",
	"error" text,
	"queue_job_id" text,
	"attempts" integer DEFAULT 0 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"started_at" timestamp with time zone,
	"finished_at" timestamp with time zone,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "imaging_jobs" ADD CONSTRAINT "imaging_jobs_owner_id_users_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "imaging_jobs" ADD CONSTRAINT "imaging_jobs_proposal_target_id_proposal_targets_id_fk" FOREIGN KEY ("proposal_target_id") REFERENCES "public"."proposal_targets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "imaging_jobs" ADD CONSTRAINT "imaging_jobs_cycle_batch_id_cycles_id_fk" FOREIGN KEY ("cycle_batch_id") REFERENCES "public"."cycles"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "imaging_jobs_owner_idx" ON "imaging_jobs" USING btree ("owner_id","created_at");--> statement-breakpoint
CREATE INDEX "imaging_jobs_target_idx" ON "imaging_jobs" USING btree ("proposal_target_id");--> statement-breakpoint
CREATE INDEX "imaging_jobs_batch_idx" ON "imaging_jobs" USING btree ("cycle_batch_id");--> statement-breakpoint
CREATE INDEX "imaging_jobs_active_idx" ON "imaging_jobs" USING btree ("owner_id") WHERE "imaging_jobs"."state" in ('queued', 'running');