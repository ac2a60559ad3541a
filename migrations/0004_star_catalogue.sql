CREATE TABLE "catalogue_editions" (
	"source" text PRIMARY KEY NOT NULL,
	"version" text NOT NULL,
	"stars" integer NOT NULL,
	"name_records" integer NOT NULL,
	"named_stars" integer NOT NULL,
	"loaded_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "catalogue_stars" (
	"hip" integer PRIMARY KEY NOT NULL,
	"hd" integer,
	"name" text NOT NULL,
	"designations" text[] DEFAULT '{}'::text[] NOT NULL,
	"ra_deg" double precision NOT NULL,
	"dec_deg" double precision NOT NULL,
	"v_mag" double precision NOT NULL,
	"bv" double precision,
	"variability" smallint DEFAULT 0 NOT NULL
);
--> statement-breakpoint
CREATE INDEX "catalogue_stars_hd_idx" ON "catalogue_stars" USING btree ("hd");