CREATE TYPE "public"."proposal_status" AS ENUM('draft', 'submitted', 'under_review', 'accepted', 'waitlisted', 'declined', 'scheduled', 'withdrawn');--> statement-breakpoint
CREATE TABLE "cycle_configurations" (
	"cycle_id" integer NOT NULL,
	"configuration_id" integer NOT NULL,
	"nights_available" double precision,
	CONSTRAINT "cycle_configurations_cycle_id_configuration_id_pk" PRIMARY KEY("cycle_id","configuration_id")
);
--> statement-breakpoint
CREATE TABLE "cycles" (
	"id" serial PRIMARY KEY NOT NULL,
	"name" text NOT NULL,
	"description" text DEFAULT '' NOT NULL,
	"observing_start" date NOT NULL,
	"observing_end" date NOT NULL,
	"submission_deadline" timestamp with time zone NOT NULL,
	"created_by_id" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "cycles_period_check" CHECK ("cycles"."observing_end" >= "cycles"."observing_start")
);
--> statement-breakpoint
CREATE TABLE "proposal_documents" (
	"proposal_id" integer PRIMARY KEY NOT NULL,
	"filename" text NOT NULL,
	"content_type" text NOT NULL,
	"size_bytes" integer NOT NULL,
	"sha256" text NOT NULL,
	"data" "bytea" NOT NULL,
	"uploaded_by_id" integer,
	"uploaded_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "proposal_hours" (
	"proposal_id" integer NOT NULL,
	"configuration_id" integer NOT NULL,
	"hours" double precision NOT NULL,
	CONSTRAINT "proposal_hours_proposal_id_configuration_id_pk" PRIMARY KEY("proposal_id","configuration_id"),
	CONSTRAINT "proposal_hours_positive" CHECK ("proposal_hours"."hours" > 0)
);
--> statement-breakpoint
CREATE TABLE "proposal_members" (
	"id" serial PRIMARY KEY NOT NULL,
	"proposal_id" integer NOT NULL,
	"email" text NOT NULL,
	"user_id" integer,
	"invited_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "proposal_targets" (
	"id" serial PRIMARY KEY NOT NULL,
	"proposal_id" integer NOT NULL,
	"position" integer DEFAULT 0 NOT NULL,
	"source_target_id" integer,
	"name" text NOT NULL,
	"ra_deg" double precision NOT NULL,
	"dec_deg" double precision NOT NULL,
	"model" jsonb NOT NULL,
	"magnitudes" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"min_elevation_deg" double precision,
	"time_windows" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"calibrators" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"notes" text DEFAULT '' NOT NULL
);
--> statement-breakpoint
CREATE TABLE "proposal_versions" (
	"id" serial PRIMARY KEY NOT NULL,
	"proposal_id" integer NOT NULL,
	"version" integer NOT NULL,
	"submitted_at" timestamp with time zone DEFAULT now() NOT NULL,
	"submitted_by_id" integer,
	"snapshot" jsonb NOT NULL,
	"document_sha256" text,
	"document_data" "bytea"
);
--> statement-breakpoint
CREATE TABLE "proposals" (
	"id" serial PRIMARY KEY NOT NULL,
	"cycle_id" integer NOT NULL,
	"pi_id" integer NOT NULL,
	"title" text DEFAULT '' NOT NULL,
	"abstract" text DEFAULT '' NOT NULL,
	"science_category" text DEFAULT '' NOT NULL,
	"instrument_id" integer,
	"band_id" integer,
	"status" "proposal_status" DEFAULT 'draft' NOT NULL,
	"submitted_at" timestamp with time zone,
	"current_version" integer DEFAULT 0 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "targets" (
	"id" serial PRIMARY KEY NOT NULL,
	"owner_id" integer NOT NULL,
	"name" text NOT NULL,
	"ra_deg" double precision NOT NULL,
	"dec_deg" double precision NOT NULL,
	"model" jsonb NOT NULL,
	"magnitudes" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "cycle_configurations" ADD CONSTRAINT "cycle_configurations_cycle_id_cycles_id_fk" FOREIGN KEY ("cycle_id") REFERENCES "public"."cycles"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cycle_configurations" ADD CONSTRAINT "cycle_configurations_configuration_id_configurations_id_fk" FOREIGN KEY ("configuration_id") REFERENCES "public"."configurations"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cycles" ADD CONSTRAINT "cycles_created_by_id_users_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposal_documents" ADD CONSTRAINT "proposal_documents_proposal_id_proposals_id_fk" FOREIGN KEY ("proposal_id") REFERENCES "public"."proposals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposal_documents" ADD CONSTRAINT "proposal_documents_uploaded_by_id_users_id_fk" FOREIGN KEY ("uploaded_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposal_hours" ADD CONSTRAINT "proposal_hours_proposal_id_proposals_id_fk" FOREIGN KEY ("proposal_id") REFERENCES "public"."proposals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposal_hours" ADD CONSTRAINT "proposal_hours_configuration_id_configurations_id_fk" FOREIGN KEY ("configuration_id") REFERENCES "public"."configurations"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposal_members" ADD CONSTRAINT "proposal_members_proposal_id_proposals_id_fk" FOREIGN KEY ("proposal_id") REFERENCES "public"."proposals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposal_members" ADD CONSTRAINT "proposal_members_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposal_targets" ADD CONSTRAINT "proposal_targets_proposal_id_proposals_id_fk" FOREIGN KEY ("proposal_id") REFERENCES "public"."proposals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposal_targets" ADD CONSTRAINT "proposal_targets_source_target_id_targets_id_fk" FOREIGN KEY ("source_target_id") REFERENCES "public"."targets"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposal_versions" ADD CONSTRAINT "proposal_versions_proposal_id_proposals_id_fk" FOREIGN KEY ("proposal_id") REFERENCES "public"."proposals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposal_versions" ADD CONSTRAINT "proposal_versions_submitted_by_id_users_id_fk" FOREIGN KEY ("submitted_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposals" ADD CONSTRAINT "proposals_cycle_id_cycles_id_fk" FOREIGN KEY ("cycle_id") REFERENCES "public"."cycles"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposals" ADD CONSTRAINT "proposals_pi_id_users_id_fk" FOREIGN KEY ("pi_id") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposals" ADD CONSTRAINT "proposals_instrument_id_instruments_id_fk" FOREIGN KEY ("instrument_id") REFERENCES "public"."instruments"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposals" ADD CONSTRAINT "proposals_band_id_bands_id_fk" FOREIGN KEY ("band_id") REFERENCES "public"."bands"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "targets" ADD CONSTRAINT "targets_owner_id_users_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "cycles_name_key" ON "cycles" USING btree ("name");--> statement-breakpoint
CREATE UNIQUE INDEX "proposal_members_email_key" ON "proposal_members" USING btree ("proposal_id",lower("email"));--> statement-breakpoint
CREATE INDEX "proposal_targets_proposal_idx" ON "proposal_targets" USING btree ("proposal_id");--> statement-breakpoint
CREATE UNIQUE INDEX "proposal_versions_key" ON "proposal_versions" USING btree ("proposal_id","version");--> statement-breakpoint
CREATE INDEX "proposals_cycle_idx" ON "proposals" USING btree ("cycle_id");--> statement-breakpoint
CREATE INDEX "proposals_pi_idx" ON "proposals" USING btree ("pi_id");--> statement-breakpoint
CREATE UNIQUE INDEX "targets_owner_name_key" ON "targets" USING btree ("owner_id",lower("name"));