CREATE TYPE "public"."assignment_status" AS ENUM('active', 'declined');--> statement-breakpoint
CREATE TYPE "public"."committee_decision" AS ENUM('accept', 'waitlist', 'decline');--> statement-breakpoint
CREATE TYPE "public"."review_confidence" AS ENUM('low', 'medium', 'high');--> statement-breakpoint
CREATE TYPE "public"."cycle_state" AS ENUM('draft', 'open', 'reviewing', 'deciding', 'closed');--> statement-breakpoint
CREATE TABLE "allocated_hours" (
	"proposal_id" integer NOT NULL,
	"configuration_id" integer NOT NULL,
	"hours" double precision NOT NULL,
	CONSTRAINT "allocated_hours_proposal_id_configuration_id_pk" PRIMARY KEY("proposal_id","configuration_id"),
	CONSTRAINT "allocated_hours_positive" CHECK ("allocated_hours"."hours" > 0)
);
--> statement-breakpoint
CREATE TABLE "committee_boards" (
	"cycle_id" integer PRIMARY KEY NOT NULL,
	"triage_after" integer,
	"disagreement_spread" double precision DEFAULT 1 NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "committee_members" (
	"cycle_id" integer NOT NULL,
	"user_id" integer NOT NULL,
	"added_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "committee_members_cycle_id_user_id_pk" PRIMARY KEY("cycle_id","user_id")
);
--> statement-breakpoint
CREATE TABLE "cycle_dark_time" (
	"cycle_id" integer NOT NULL,
	"site_id" integer NOT NULL,
	"fingerprint" text NOT NULL,
	"dark_time" jsonb NOT NULL,
	"computed_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "cycle_dark_time_cycle_id_site_id_pk" PRIMARY KEY("cycle_id","site_id")
);
--> statement-breakpoint
CREATE TABLE "proposal_decisions" (
	"proposal_id" integer PRIMARY KEY NOT NULL,
	"cycle_id" integer NOT NULL,
	"final_grade" double precision,
	"decision" "committee_decision",
	"message" text DEFAULT '' NOT NULL,
	"decided_by_id" integer,
	"released_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "review_assignments" (
	"id" serial PRIMARY KEY NOT NULL,
	"cycle_id" integer NOT NULL,
	"proposal_id" integer NOT NULL,
	"reviewer_id" integer NOT NULL,
	"status" "assignment_status" DEFAULT 'active' NOT NULL,
	"decline_reason" text,
	"declined_at" timestamp with time zone,
	"assigned_by_id" integer,
	"assigned_at" timestamp with time zone DEFAULT now() NOT NULL,
	"reminded_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "review_conflicts" (
	"id" serial PRIMARY KEY NOT NULL,
	"proposal_id" integer NOT NULL,
	"reviewer_id" integer NOT NULL,
	"reason" text NOT NULL,
	"declared_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "reviews" (
	"id" serial PRIMARY KEY NOT NULL,
	"assignment_id" integer NOT NULL,
	"score" double precision,
	"comment_to_pi" text DEFAULT '' NOT NULL,
	"comment_to_committee" text DEFAULT '' NOT NULL,
	"confidence" "review_confidence",
	"submitted_at" timestamp with time zone,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "cycles" ADD COLUMN "state" "cycle_state" DEFAULT 'open' NOT NULL;--> statement-breakpoint
ALTER TABLE "cycles" ADD COLUMN "review_deadline" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "cycles" ADD COLUMN "decision_date" date;--> statement-breakpoint
ALTER TABLE "cycles" ADD COLUMN "score_best" integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE "cycles" ADD COLUMN "score_worst" integer DEFAULT 5 NOT NULL;--> statement-breakpoint
ALTER TABLE "allocated_hours" ADD CONSTRAINT "allocated_hours_proposal_id_proposals_id_fk" FOREIGN KEY ("proposal_id") REFERENCES "public"."proposals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "allocated_hours" ADD CONSTRAINT "allocated_hours_configuration_id_configurations_id_fk" FOREIGN KEY ("configuration_id") REFERENCES "public"."configurations"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "committee_boards" ADD CONSTRAINT "committee_boards_cycle_id_cycles_id_fk" FOREIGN KEY ("cycle_id") REFERENCES "public"."cycles"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "committee_members" ADD CONSTRAINT "committee_members_cycle_id_cycles_id_fk" FOREIGN KEY ("cycle_id") REFERENCES "public"."cycles"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "committee_members" ADD CONSTRAINT "committee_members_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cycle_dark_time" ADD CONSTRAINT "cycle_dark_time_cycle_id_cycles_id_fk" FOREIGN KEY ("cycle_id") REFERENCES "public"."cycles"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cycle_dark_time" ADD CONSTRAINT "cycle_dark_time_site_id_sites_id_fk" FOREIGN KEY ("site_id") REFERENCES "public"."sites"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposal_decisions" ADD CONSTRAINT "proposal_decisions_proposal_id_proposals_id_fk" FOREIGN KEY ("proposal_id") REFERENCES "public"."proposals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposal_decisions" ADD CONSTRAINT "proposal_decisions_cycle_id_cycles_id_fk" FOREIGN KEY ("cycle_id") REFERENCES "public"."cycles"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposal_decisions" ADD CONSTRAINT "proposal_decisions_decided_by_id_users_id_fk" FOREIGN KEY ("decided_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_assignments" ADD CONSTRAINT "review_assignments_cycle_id_cycles_id_fk" FOREIGN KEY ("cycle_id") REFERENCES "public"."cycles"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_assignments" ADD CONSTRAINT "review_assignments_proposal_id_proposals_id_fk" FOREIGN KEY ("proposal_id") REFERENCES "public"."proposals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_assignments" ADD CONSTRAINT "review_assignments_reviewer_id_users_id_fk" FOREIGN KEY ("reviewer_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_assignments" ADD CONSTRAINT "review_assignments_assigned_by_id_users_id_fk" FOREIGN KEY ("assigned_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_conflicts" ADD CONSTRAINT "review_conflicts_proposal_id_proposals_id_fk" FOREIGN KEY ("proposal_id") REFERENCES "public"."proposals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_conflicts" ADD CONSTRAINT "review_conflicts_reviewer_id_users_id_fk" FOREIGN KEY ("reviewer_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reviews" ADD CONSTRAINT "reviews_assignment_id_review_assignments_id_fk" FOREIGN KEY ("assignment_id") REFERENCES "public"."review_assignments"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "committee_members_user_idx" ON "committee_members" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "proposal_decisions_cycle_idx" ON "proposal_decisions" USING btree ("cycle_id");--> statement-breakpoint
CREATE UNIQUE INDEX "review_assignments_key" ON "review_assignments" USING btree ("proposal_id","reviewer_id");--> statement-breakpoint
CREATE INDEX "review_assignments_cycle_idx" ON "review_assignments" USING btree ("cycle_id");--> statement-breakpoint
CREATE INDEX "review_assignments_reviewer_idx" ON "review_assignments" USING btree ("reviewer_id");--> statement-breakpoint
CREATE UNIQUE INDEX "review_conflicts_key" ON "review_conflicts" USING btree ("proposal_id","reviewer_id");--> statement-breakpoint
CREATE UNIQUE INDEX "reviews_assignment_key" ON "reviews" USING btree ("assignment_id");--> statement-breakpoint
ALTER TABLE "cycles" ADD CONSTRAINT "cycles_score_scale_check" CHECK ("cycles"."score_best" <> "cycles"."score_worst");