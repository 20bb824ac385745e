CREATE TABLE "die_revisions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"die_id" uuid NOT NULL,
	"number" integer NOT NULL,
	"markup_geojson" text NOT NULL,
	"sha256" text NOT NULL,
	"shape_count" integer NOT NULL,
	"pad_table" jsonb,
	"die_frame" jsonb NOT NULL,
	"signed_off_by" uuid,
	"signed_off_by_name" text NOT NULL,
	"signed_off_at" timestamp with time zone NOT NULL,
	"override_open_remarks" boolean DEFAULT false NOT NULL,
	CONSTRAINT "die_revisions_die_number_uq" UNIQUE("die_id","number")
);
--> statement-breakpoint
ALTER TABLE "review_events" ALTER COLUMN "action" SET DATA TYPE text;--> statement-breakpoint
-- Stored rows move to the new action names while the column is plain text.
UPDATE "review_events" SET "action" = CASE "action" WHEN 'submit' THEN 'send' WHEN 'approve' THEN 'sign_off' WHEN 'request_changes' THEN 'return' ELSE "action" END;--> statement-breakpoint
UPDATE "audit_events" SET "action" = CASE "action" WHEN 'review.submit' THEN 'review.send' WHEN 'review.approve' THEN 'review.sign_off' WHEN 'review.request_changes' THEN 'review.return' ELSE "action" END WHERE "action" LIKE 'review.%';--> statement-breakpoint
DROP TYPE "public"."review_action";--> statement-breakpoint
CREATE TYPE "public"."review_action" AS ENUM('send', 'withdraw', 'sign_off', 'return');--> statement-breakpoint
ALTER TABLE "review_events" ALTER COLUMN "action" SET DATA TYPE "public"."review_action" USING "action"::"public"."review_action";--> statement-breakpoint
ALTER TABLE "dies" ALTER COLUMN "review_status" SET DATA TYPE text;--> statement-breakpoint
ALTER TABLE "dies" ALTER COLUMN "review_status" SET DEFAULT 'draft'::text;--> statement-breakpoint
ALTER TABLE "review_events" ALTER COLUMN "from_status" SET DATA TYPE text;--> statement-breakpoint
ALTER TABLE "review_events" ALTER COLUMN "to_status" SET DATA TYPE text;--> statement-breakpoint
-- …and to the new status names (a signed-off die's revision is frozen at the next start).
UPDATE "dies" SET "review_status" = CASE "review_status" WHEN 'in_review' THEN 'with_checker' WHEN 'approved' THEN 'signed_off' WHEN 'changes_requested' THEN 'returned' ELSE "review_status" END;--> statement-breakpoint
UPDATE "review_events" SET "from_status" = CASE "from_status" WHEN 'in_review' THEN 'with_checker' WHEN 'approved' THEN 'signed_off' WHEN 'changes_requested' THEN 'returned' ELSE "from_status" END, "to_status" = CASE "to_status" WHEN 'in_review' THEN 'with_checker' WHEN 'approved' THEN 'signed_off' WHEN 'changes_requested' THEN 'returned' ELSE "to_status" END;--> statement-breakpoint
DROP TYPE "public"."review_status";--> statement-breakpoint
CREATE TYPE "public"."review_status" AS ENUM('draft', 'with_checker', 'signed_off', 'returned');--> statement-breakpoint
ALTER TABLE "dies" ALTER COLUMN "review_status" SET DEFAULT 'draft'::"public"."review_status";--> statement-breakpoint
ALTER TABLE "dies" ALTER COLUMN "review_status" SET DATA TYPE "public"."review_status" USING "review_status"::"public"."review_status";--> statement-breakpoint
ALTER TABLE "review_events" ALTER COLUMN "from_status" SET DATA TYPE "public"."review_status" USING "from_status"::"public"."review_status";--> statement-breakpoint
ALTER TABLE "review_events" ALTER COLUMN "to_status" SET DATA TYPE "public"."review_status" USING "to_status"::"public"."review_status";--> statement-breakpoint
ALTER TABLE "dies" ADD COLUMN "revision" integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE "review_events" ADD COLUMN "revision" integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE "review_events" ADD COLUMN "override_open_remarks" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "die_revisions" ADD CONSTRAINT "die_revisions_die_id_dies_id_fk" FOREIGN KEY ("die_id") REFERENCES "public"."dies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "die_revisions" ADD CONSTRAINT "die_revisions_signed_off_by_users_id_fk" FOREIGN KEY ("signed_off_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "die_revisions_die_idx" ON "die_revisions" USING btree ("die_id");