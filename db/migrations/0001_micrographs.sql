CREATE TYPE "public"."job_status" AS ENUM('queued', 'running', 'done', 'failed');--> statement-breakpoint
CREATE TABLE "jobs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"kind" text NOT NULL,
	"subject_id" uuid NOT NULL,
	"status" "job_status" DEFAULT 'queued' NOT NULL,
	"attempts" integer DEFAULT 0 NOT NULL,
	"locked_by" text,
	"heartbeat_at" timestamp with time zone,
	"error" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "micrographs" ADD COLUMN "is_reference" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "micrographs" ADD COLUMN "calibration" jsonb;--> statement-breakpoint
ALTER TABLE "micrographs" ADD COLUMN "original_name" text;--> statement-breakpoint
ALTER TABLE "micrographs" ADD COLUMN "preview_width" integer;--> statement-breakpoint
ALTER TABLE "micrographs" ADD COLUMN "preview_height" integer;--> statement-breakpoint
CREATE INDEX "jobs_status_created_idx" ON "jobs" USING btree ("status","created_at");--> statement-breakpoint
CREATE INDEX "jobs_subject_idx" ON "jobs" USING btree ("subject_id");