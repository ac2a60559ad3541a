CREATE TYPE "public"."night_block_kind" AS ENUM('calibrator', 'science');--> statement-breakpoint
CREATE TYPE "public"."night_block_outcome" AS ENUM('planned', 'executed', 'weather', 'technical');--> statement-breakpoint
CREATE TYPE "public"."night_plan_state" AS ENUM('draft', 'published', 'executed');--> statement-breakpoint
CREATE TABLE "night_configurations" (
	"night_date" date PRIMARY KEY NOT NULL,
	"cycle_id" integer NOT NULL,
	"configuration_id" integer NOT NULL,
	"set_by_id" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "night_plan_blocks" (
	"id" serial PRIMARY KEY NOT NULL,
	"plan_id" integer NOT NULL,
	"position" integer NOT NULL,
	"kind" "night_block_kind" NOT NULL,
	"target" text NOT NULL,
	"object" text NOT NULL,
	"proposal_id" integer,
	"proposal_target_id" integer,
	"start_utc" timestamp with time zone NOT NULL,
	"end_utc" timestamp with time zone NOT NULL,
	"outcome" "night_block_outcome" DEFAULT 'planned' NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"marked_at" timestamp with time zone,
	"marked_by_id" integer,
	CONSTRAINT "night_plan_blocks_time_check" CHECK ("night_plan_blocks"."end_utc" > "night_plan_blocks"."start_utc")
);
--> statement-breakpoint
CREATE TABLE "night_plans" (
	"id" serial PRIMARY KEY NOT NULL,
	"night_date" date NOT NULL,
	"cycle_id" integer NOT NULL,
	"configuration_id" integer NOT NULL,
	"state" "night_plan_state" DEFAULT 'draft' NOT NULL,
	"settings" jsonb NOT NULL,
	"report" jsonb DEFAULT '{"unplaced":[],"warnings":[]}'::jsonb NOT NULL,
	"created_by_id" integer,
	"published_at" timestamp with time zone,
	"published_by_id" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "night_plans_night_key" UNIQUE("night_date")
);
--> statement-breakpoint
ALTER TABLE "night_configurations" ADD CONSTRAINT "night_configurations_cycle_id_cycles_id_fk" FOREIGN KEY ("cycle_id") REFERENCES "public"."cycles"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "night_configurations" ADD CONSTRAINT "night_configurations_configuration_id_configurations_id_fk" FOREIGN KEY ("configuration_id") REFERENCES "public"."configurations"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "night_configurations" ADD CONSTRAINT "night_configurations_set_by_id_users_id_fk" FOREIGN KEY ("set_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "night_plan_blocks" ADD CONSTRAINT "night_plan_blocks_plan_id_night_plans_id_fk" FOREIGN KEY ("plan_id") REFERENCES "public"."night_plans"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "night_plan_blocks" ADD CONSTRAINT "night_plan_blocks_proposal_id_proposals_id_fk" FOREIGN KEY ("proposal_id") REFERENCES "public"."proposals"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "night_plan_blocks" ADD CONSTRAINT "night_plan_blocks_proposal_target_id_proposal_targets_id_fk" FOREIGN KEY ("proposal_target_id") REFERENCES "public"."proposal_targets"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "night_plan_blocks" ADD CONSTRAINT "night_plan_blocks_marked_by_id_users_id_fk" FOREIGN KEY ("marked_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "night_plans" ADD CONSTRAINT "night_plans_cycle_id_cycles_id_fk" FOREIGN KEY ("cycle_id") REFERENCES "public"."cycles"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "night_plans" ADD CONSTRAINT "night_plans_configuration_id_configurations_id_fk" FOREIGN KEY ("configuration_id") REFERENCES "public"."configurations"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "night_plans" ADD CONSTRAINT "night_plans_created_by_id_users_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "night_plans" ADD CONSTRAINT "night_plans_published_by_id_users_id_fk" FOREIGN KEY ("published_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "night_configurations_cycle_idx" ON "night_configurations" USING btree ("cycle_id","night_date");--> statement-breakpoint
CREATE INDEX "night_plan_blocks_plan_idx" ON "night_plan_blocks" USING btree ("plan_id","position");--> statement-breakpoint
CREATE INDEX "night_plan_blocks_target_idx" ON "night_plan_blocks" USING btree ("proposal_target_id");--> statement-breakpoint
CREATE INDEX "night_plan_blocks_proposal_idx" ON "night_plan_blocks" USING btree ("proposal_id");--> statement-breakpoint
CREATE INDEX "night_plans_cycle_idx" ON "night_plans" USING btree ("cycle_id");