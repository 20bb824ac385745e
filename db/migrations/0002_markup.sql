CREATE TYPE "public"."markup_kind" AS ENUM('pad', 'wire_bond', 'block', 'symmetry_axis', 'trace', 'ruler', 'note', 'die_outline');--> statement-breakpoint
CREATE TABLE "markup" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"die_id" uuid NOT NULL,
	"kind" "markup_kind" NOT NULL,
	"geometry" jsonb NOT NULL,
	"properties" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"seq" bigint GENERATED ALWAYS AS IDENTITY (sequence name "markup_seq_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 9223372036854775807 START WITH 1 CACHE 1),
	"created_by" uuid,
	"updated_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "markup" ADD CONSTRAINT "markup_die_id_dies_id_fk" FOREIGN KEY ("die_id") REFERENCES "public"."dies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "markup" ADD CONSTRAINT "markup_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "markup" ADD CONSTRAINT "markup_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "markup_die_seq_idx" ON "markup" USING btree ("die_id","seq");