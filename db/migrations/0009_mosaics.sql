CREATE TABLE "mosaics" (
	"micrograph_id" uuid PRIMARY KEY NOT NULL,
	"rows" integer NOT NULL,
	"cols" integer NOT NULL,
	"order" text NOT NULL,
	"overlap_percent" double precision NOT NULL,
	"flat_field" boolean NOT NULL,
	"frame_width" integer NOT NULL,
	"frame_height" integer NOT NULL,
	"frame_format" text NOT NULL,
	"stage" text DEFAULT 'checking' NOT NULL,
	"stage_progress" integer DEFAULT 0 NOT NULL,
	"frames" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"pairs" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"residual_rms_px" double precision,
	"residual_max_px" double precision,
	"warnings" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"restitching" boolean DEFAULT false NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "mosaics" ADD CONSTRAINT "mosaics_micrograph_id_micrographs_id_fk" FOREIGN KEY ("micrograph_id") REFERENCES "public"."micrographs"("id") ON DELETE cascade ON UPDATE no action;