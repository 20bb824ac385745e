CREATE TABLE "image_searches" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"die_id" uuid NOT NULL,
	"micrograph_id" uuid NOT NULL,
	"status" "job_status" DEFAULT 'queued' NOT NULL,
	"progress" integer DEFAULT 0 NOT NULL,
	"params" jsonb NOT NULL,
	"result" jsonb,
	"error" text,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"finished_at" timestamp with time zone
);
--> statement-breakpoint
ALTER TABLE "image_searches" ADD CONSTRAINT "image_searches_die_id_dies_id_fk" FOREIGN KEY ("die_id") REFERENCES "public"."dies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "image_searches" ADD CONSTRAINT "image_searches_micrograph_id_micrographs_id_fk" FOREIGN KEY ("micrograph_id") REFERENCES "public"."micrographs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "image_searches" ADD CONSTRAINT "image_searches_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "image_searches_micrograph_idx" ON "image_searches" USING btree ("micrograph_id","created_at");