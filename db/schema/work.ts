// Background work and the record of changes: jobs, exports, the audit trail.
import { index, integer, jsonb, pgEnum, pgTable, text, timestamp, uuid, bigint } from "drizzle-orm/pg-core";
import { EXPORT_KINDS, JOB_STATUSES } from "@/lib/dto/stored-values";
import { createdAt, updatedAt } from "./columns";
import { users, teams } from "./people";
import { dies, micrographs } from "./dies";

export const jobStatusEnum = pgEnum("job_status", JOB_STATUSES);

/**
 * Background work (tiling now, exports later). Workers claim a job with
 * `FOR UPDATE SKIP LOCKED` and keep a heartbeat, so several worker processes can share the
 * table and a job whose worker died is picked up again.
 */
export const jobs = pgTable(
  "jobs",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    kind: text("kind").notNull(),
    /** The row the job works on (a micrograph for tiling). */
    subjectId: uuid("subject_id").notNull(),
    status: jobStatusEnum("status").notNull().default("queued"),
    attempts: integer("attempts").notNull().default(0),
    lockedBy: text("locked_by"),
    heartbeatAt: timestamp("heartbeat_at", { withTimezone: true }),
    error: text("error"),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("jobs_status_created_idx").on(t.status, t.createdAt), index("jobs_subject_idx").on(t.subjectId)],
);

export const auditEvents = pgTable(
  "audit_events",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    teamId: uuid("team_id").references(() => teams.id, { onDelete: "cascade" }),
    actorId: uuid("actor_id").references(() => users.id, { onDelete: "set null" }),
    action: text("action").notNull(),
    entityType: text("entity_type").notNull(),
    entityId: uuid("entity_id"),
    /** The die the event concerns, when there is one: the die's activity feed reads by it. */
    dieId: uuid("die_id"),
    before: jsonb("before"),
    after: jsonb("after"),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("audit_entity_idx").on(t.entityType, t.entityId), index("audit_die_idx").on(t.dieId, t.at)],
);

export const exportKindEnum = pgEnum("export_kind", EXPORT_KINDS);

/** A hand-over file rendered in the background: status, progress and where the file is. */
export const exports = pgTable(
  "exports",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    dieId: uuid("die_id")
      .notNull()
      .references(() => dies.id, { onDelete: "cascade" }),
    micrographId: uuid("micrograph_id").references(() => micrographs.id, { onDelete: "set null" }),
    kind: exportKindEnum("kind").notNull(),
    status: jobStatusEnum("status").notNull().default("queued"),
    progress: integer("progress").notNull().default(0),
    params: jsonb("params").notNull(),
    fileName: text("file_name"),
    bytes: bigint("bytes", { mode: "number" }),
    error: text("error"),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    finishedAt: timestamp("finished_at", { withTimezone: true }),
  },
  (t) => [index("exports_die_idx").on(t.dieId, t.createdAt)],
);
