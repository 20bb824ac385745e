CREATE TABLE "job_heartbeats" (
	"job_id" uuid PRIMARY KEY NOT NULL,
	"queue" text NOT NULL,
	"worker" text NOT NULL,
	"beat_at" timestamp with time zone DEFAULT now() NOT NULL
);
