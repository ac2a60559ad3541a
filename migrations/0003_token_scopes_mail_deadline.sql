DROP INDEX "outbox_messages_due_idx";--> statement-breakpoint
ALTER TABLE "api_tokens" ADD COLUMN "scopes" text[] DEFAULT '{}'::text[] NOT NULL;--> statement-breakpoint
ALTER TABLE "api_tokens" ADD COLUMN "expires_at" timestamp with time zone DEFAULT now() + interval '90 days' NOT NULL;--> statement-breakpoint
ALTER TABLE "outbox_messages" ADD COLUMN "deliver_by" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "outbox_messages" ADD COLUMN "abandoned_at" timestamp with time zone;--> statement-breakpoint
CREATE INDEX "outbox_messages_due_idx" ON "outbox_messages" USING btree ("next_attempt_at","id") WHERE sent_at is null and abandoned_at is null;--> statement-breakpoint
-- Tokens made before scopes existed could do everything their owner could; the API they served runs computations
-- only, so that is what they keep, for 90 days from their creation (at least a week from now).
UPDATE "api_tokens" SET "scopes" = '{computations:read}', "expires_at" = greatest("created_at" + interval '90 days', now() + interval '7 days');
