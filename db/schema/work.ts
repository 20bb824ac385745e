// Background work and the record of changes: job heartbeats, exports, image searches, the audit trail.
import { index, integer, jsonb, pgEnum, pgTable, text, timestamp, uuid, bigint } from "drizzle-orm/pg-core";
import { EXPORT_KINDS, JOB_STATUSES } from "@/lib/dto/stored-values";
import { createdAt } from "./columns";
import { users, teams } from "./people";
import { dies, micrographs } from "./dies";
import type { FindSimilarResult } from "@/lib/dto/find-similar";
import type { ImageSearchParams } from "@/lib/similar-shapes/params";

export const jobStatusEnum = pgEnum("job_status", JOB_STATUSES);

/**
 * The last sign of life of a running job, written every few seconds by the worker that holds
 * it. The job itself lives in pg-boss's tables; a job whose beat is older than a minute was
 * left by a worker that died, and the housekeeping job fails it through pg-boss so its retry
 * and back-off apply (pg-boss 10 knows only a fixed expiry, too short or too long for tiling).
 */
export const jobHeartbeats = pgTable("job_heartbeats", {
  /** The pg-boss job id. */
  jobId: uuid("job_id").primaryKey(),
  queue: text("queue").notNull(),
  /** host:pid of the worker process, for operators (and tests) asking who holds a job. */
  worker: text("worker").notNull(),
  beatAt: timestamp("beat_at", { withTimezone: true }).notNull().defaultNow(),
});

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

/**
 * A template search on one micrograph ("find similar"), run as a job: status and progress
 * while it runs, then the candidates it found. Kept as a row so the page can poll it and a
 * retried attempt starts from the same request.
 */
export const imageSearches = pgTable(
  "image_searches",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    dieId: uuid("die_id")
      .notNull()
      .references(() => dies.id, { onDelete: "cascade" }),
    micrographId: uuid("micrograph_id")
      .notNull()
      .references(() => micrographs.id, { onDelete: "cascade" }),
    status: jobStatusEnum("status").notNull().default("queued"),
    progress: integer("progress").notNull().default(0),
    /** The request as resolved: template box in image px, kind, options, template size in µm. */
    params: jsonb("params").$type<ImageSearchParams>().notNull(),
    /** The answer once done: candidates best first, pixels searched, time taken. */
    result: jsonb("result").$type<FindSimilarResult | null>(),
    error: text("error"),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    finishedAt: timestamp("finished_at", { withTimezone: true }),
  },
  (t) => [index("image_searches_micrograph_idx").on(t.micrographId, t.createdAt)],
);
