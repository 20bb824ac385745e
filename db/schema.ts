import { sql } from "drizzle-orm";
import {
  boolean,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uniqueIndex,
  uuid,
  bigint,
} from "drizzle-orm/pg-core";
import { MARKUP_KINDS } from "../lib/markup/types";
import type { Geometry } from "../lib/geometry/types";

export const roleEnum = pgEnum("role", ["owner", "analyst", "reviewer", "viewer"]);
export const reviewStatusEnum = pgEnum("review_status", ["draft", "in_review", "approved", "changes_requested"]);
export const illuminationEnum = pgEnum("illumination", ["bright_field", "dark_field", "dic", "polarized", "ir", "other"]);
export const micrographStatusEnum = pgEnum("micrograph_status", ["queued", "tiling", "ready", "failed"]);

const createdAt = () => timestamp("created_at", { withTimezone: true }).notNull().defaultNow();
const updatedAt = () => timestamp("updated_at", { withTimezone: true }).notNull().defaultNow();

export const users = pgTable(
  "users",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    /** Stored as typed; uniqueness is case-insensitive through the index below. */
    email: text("email").notNull(),
    name: text("name").notNull(),
    passwordHash: text("password_hash"),
    /** Stored in every session token; raising it ends every session issued before. */
    sessionVersion: integer("session_version").notNull().default(0),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("users_email_lower_idx").on(sql`lower(${t.email})`)],
);

export const teams = pgTable("teams", {
  id: uuid("id").primaryKey().defaultRandom(),
  name: text("name").notNull(),
  createdAt: createdAt(),
});

export const memberships = pgTable(
  "memberships",
  {
    teamId: uuid("team_id").notNull().references(() => teams.id, { onDelete: "cascade" }),
    userId: uuid("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    role: roleEnum("role").notNull(),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.teamId, t.userId] }), index("memberships_user_idx").on(t.userId)],
);

export const cases = pgTable(
  "cases",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    teamId: uuid("team_id").notNull().references(() => teams.id, { onDelete: "cascade" }),
    title: text("title").notNull(),
    partMarking: text("part_marking").notNull().default(""),
    package: text("package").notNull().default(""),
    sampleId: text("sample_id").notNull().default(""),
    notes: text("notes").notNull().default(""),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("cases_team_idx").on(t.teamId)],
);

export const dies = pgTable(
  "dies",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    caseId: uuid("case_id").notNull().references(() => cases.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    widthUm: doublePrecision("width_um"),
    heightUm: doublePrecision("height_um"),
    notes: text("notes").notNull().default(""),
    /** The engineer who reads the die; never its approver. */
    analystId: uuid("analyst_id").references(() => users.id, { onDelete: "set null" }),
    reviewStatus: reviewStatusEnum("review_status").notNull().default("draft"),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("dies_case_idx").on(t.caseId)],
);

export const micrographs = pgTable(
  "micrographs",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    dieId: uuid("die_id").notNull().references(() => dies.id, { onDelete: "cascade" }),
    label: text("label").notNull(),
    illumination: illuminationEnum("illumination").notNull().default("bright_field"),
    objectiveMag: doublePrecision("objective_mag"),
    numericalAperture: doublePrecision("numerical_aperture"),
    cameraPixelPitchUm: doublePrecision("camera_pixel_pitch_um"),
    adapterMag: doublePrecision("adapter_mag"),
    scaleUmPerPx: doublePrecision("scale_um_per_px"),
    width: integer("width"),
    height: integer("height"),
    /** 2x3 affine image px → die µm, `[[a, b, tx], [c, d, ty]]`; null until in the die frame. */
    transform: jsonb("transform").$type<[[number, number, number], [number, number, number]] | null>(),
    status: micrographStatusEnum("status").notNull().default("queued"),
    progress: integer("progress").notNull().default(0),
    error: text("error"),
    /** Server-chosen file name under originals/; never the client's path. */
    storedName: text("stored_name"),
    format: text("format"),
    bytes: bigint("bytes", { mode: "number" }),
    position: integer("position").notNull().default(0),
    /** The micrograph that defines the die frame (the first of a die, until changed). */
    isReference: boolean("is_reference").notNull().default(false),
    /** Two-point calibration, when the scale came from one: image px and the known length. */
    calibration: jsonb("calibration").$type<{ p1: [number, number]; p2: [number, number]; lengthUm: number } | null>(),
    /** The client's file name, sanitised, for display only. */
    originalName: text("original_name"),
    /** Control-point pairs of the last alignment: image px ↔ die µm. */
    controlPoints: jsonb("control_points").$type<{ imagePx: [number, number]; dieUm: [number, number] }[] | null>(),
    alignmentModel: text("alignment_model"),
    /** The user said the photo really is mirrored (some camera set-ups mirror). */
    mirrored: boolean("mirrored").notNull().default(false),
    residualsUm: jsonb("residuals_um").$type<number[] | null>(),
    alignmentRmsUm: doublePrecision("alignment_rms_um"),
    previewWidth: integer("preview_width"),
    previewHeight: integer("preview_height"),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("micrographs_die_idx").on(t.dieId)],
);

export const jobStatusEnum = pgEnum("job_status", ["queued", "running", "done", "failed"]);

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

export const markupKindEnum = pgEnum("markup_kind", MARKUP_KINDS);

/**
 * Markup of a die: GeoJSON-shaped geometry in the die frame (µm, origin lower-left, y up),
 * never in one micrograph's pixels. `version` starts at 1 and grows by one per change, so a
 * writer holding a stale copy is refused (optimistic concurrency) instead of overwriting.
 */
export const markup = pgTable(
  "markup",
  {
    /** Chosen by the client when it re-creates a shape (undo of a delete keeps the same id). */
    id: uuid("id").primaryKey().defaultRandom(),
    dieId: uuid("die_id").notNull().references(() => dies.id, { onDelete: "cascade" }),
    kind: markupKindEnum("kind").notNull(),
    geometry: jsonb("geometry").$type<Geometry>().notNull(),
    properties: jsonb("properties").$type<Record<string, unknown>>().notNull().default({}),
    version: integer("version").notNull().default(1),
    /** Insertion order: shapes of one batch share created_at, and lists keep the order they came in. */
    seq: bigint("seq", { mode: "number" }).generatedAlwaysAsIdentity(),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    updatedBy: uuid("updated_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("markup_die_seq_idx").on(t.dieId, t.seq)],
);

export const signInAttempts = pgTable(
  "sign_in_attempts",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    /** Lower-cased e-mail as typed, whether or not an account exists. */
    email: text("email").notNull(),
    /** The client address the attempt came from (see lib/server/client-address.ts). */
    address: text("address").notNull().default(""),
    /** Recorded as a failure before the password is checked; set true when it matched. */
    succeeded: boolean("succeeded").notNull(),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("sign_in_attempts_email_at_idx").on(t.email, t.at), index("sign_in_attempts_address_at_idx").on(t.address, t.at)],
);

export const threadStatusEnum = pgEnum("thread_status", ["open", "resolved"]);

/**
 * A review thread on a shape or on a region drawn for it. The shape reference has no foreign
 * key: when the shape is deleted the thread stays, anchored where the shape was (`anchor`).
 */
export const threads = pgTable(
  "threads",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    dieId: uuid("die_id").notNull().references(() => dies.id, { onDelete: "cascade" }),
    shapeId: uuid("shape_id"),
    /** GeoJSON Point or Polygon in die µm: the region, or where the shape was last. */
    anchor: jsonb("anchor").notNull(),
    status: threadStatusEnum("status").notNull().default("open"),
    resolvedBy: uuid("resolved_by").references(() => users.id, { onDelete: "set null" }),
    resolvedAt: timestamp("resolved_at", { withTimezone: true }),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("threads_die_idx").on(t.dieId), index("threads_shape_idx").on(t.shapeId)],
);

export const comments = pgTable(
  "comments",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    threadId: uuid("thread_id").notNull().references(() => threads.id, { onDelete: "cascade" }),
    authorId: uuid("author_id").references(() => users.id, { onDelete: "set null" }),
    /** Stored verbatim; rendered through a safe formatter, never as HTML. */
    body: text("body").notNull(),
    editedAt: timestamp("edited_at", { withTimezone: true }),
    createdAt: createdAt(),
  },
  (t) => [index("comments_thread_idx").on(t.threadId, t.createdAt)],
);

export const commentMentions = pgTable(
  "comment_mentions",
  {
    commentId: uuid("comment_id").notNull().references(() => comments.id, { onDelete: "cascade" }),
    userId: uuid("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
  },
  (t) => [primaryKey({ columns: [t.commentId, t.userId] }), index("comment_mentions_user_idx").on(t.userId)],
);

export const reviewActionEnum = pgEnum("review_action", ["submit", "approve", "request_changes"]);

/** The die's review history: every submit and decision with its message. */
export const reviewEvents = pgTable(
  "review_events",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    dieId: uuid("die_id").notNull().references(() => dies.id, { onDelete: "cascade" }),
    actorId: uuid("actor_id").references(() => users.id, { onDelete: "set null" }),
    action: reviewActionEnum("action").notNull(),
    fromStatus: reviewStatusEnum("from_status").notNull(),
    toStatus: reviewStatusEnum("to_status").notNull(),
    message: text("message").notNull().default(""),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("review_events_die_idx").on(t.dieId, t.at)],
);

/** An invitation to join a team; only a hash of the single-use token is stored. */
export const invitations = pgTable(
  "invitations",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    teamId: uuid("team_id").notNull().references(() => teams.id, { onDelete: "cascade" }),
    email: text("email").notNull(),
    role: roleEnum("role").notNull(),
    tokenHash: text("token_hash").notNull(),
    invitedBy: uuid("invited_by").references(() => users.id, { onDelete: "set null" }),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    acceptedAt: timestamp("accepted_at", { withTimezone: true }),
    acceptedBy: uuid("accepted_by").references(() => users.id, { onDelete: "set null" }),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
    /** An existing user said no to it (they are asked; nobody joins a team silently). */
    declinedAt: timestamp("declined_at", { withTimezone: true }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("invitations_token_idx").on(t.tokenHash), index("invitations_team_idx").on(t.teamId)],
);

export const outboxStatusEnum = pgEnum("outbox_status", ["pending", "sent", "failed"]);

/**
 * Mail waits here until sent: a comment is saved even when the mail server is down, and the
 * sender retries with back-off. `dedupeKey` keeps one message per event and recipient.
 */
export const outbox = pgTable(
  "outbox",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    teamId: uuid("team_id").references(() => teams.id, { onDelete: "cascade" }),
    kind: text("kind").notNull(),
    toEmail: text("to_email").notNull(),
    subject: text("subject").notNull(),
    text: text("text").notNull(),
    html: text("html").notNull(),
    dedupeKey: text("dedupe_key").notNull(),
    status: outboxStatusEnum("status").notNull().default("pending"),
    attempts: integer("attempts").notNull().default(0),
    nextAttemptAt: timestamp("next_attempt_at", { withTimezone: true }).notNull().defaultNow(),
    lastError: text("last_error"),
    sentAt: timestamp("sent_at", { withTimezone: true }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("outbox_dedupe_idx").on(t.dedupeKey), index("outbox_due_idx").on(t.status, t.nextAttemptAt)],
);

/** Which notifications a user receives (absent row = the default, on). */
export const notificationPrefs = pgTable(
  "notification_prefs",
  {
    userId: uuid("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    kind: text("kind").notNull(),
    enabled: boolean("enabled").notNull(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.kind] })],
);

export const exportKindEnum = pgEnum("export_kind", ["annotated_png", "report_pdf"]);

/** A hand-over file rendered in the background: status, progress and where the file is. */
export const exports = pgTable(
  "exports",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    dieId: uuid("die_id").notNull().references(() => dies.id, { onDelete: "cascade" }),
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
 * A user's in-app inbox: one item per mention, comment or review event addressed to them,
 * written where the matching mail is queued (whatever their mail settings), read by that user only.
 */
export const inboxItems = pgTable(
  "inbox_items",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: uuid("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    teamId: uuid("team_id").notNull().references(() => teams.id, { onDelete: "cascade" }),
    kind: text("kind").notNull(),
    dieId: uuid("die_id").notNull().references(() => dies.id, { onDelete: "cascade" }),
    threadId: uuid("thread_id").references(() => threads.id, { onDelete: "cascade" }),
    text: text("text").notNull(),
    /** Names the event and the recipient, like the outbox's: one item per event and person. */
    dedupeKey: text("dedupe_key").notNull(),
    readAt: timestamp("read_at", { withTimezone: true }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("inbox_items_dedupe_idx").on(t.dedupeKey), index("inbox_items_user_idx").on(t.userId, t.createdAt)],
);

export type User = typeof users.$inferSelect;
export type Team = typeof teams.$inferSelect;
export type Membership = typeof memberships.$inferSelect;
export type Role = (typeof roleEnum.enumValues)[number];
export type CaseRow = typeof cases.$inferSelect;
export type DieRow = typeof dies.$inferSelect;
export type ReviewStatus = (typeof reviewStatusEnum.enumValues)[number];
export type MicrographRow = typeof micrographs.$inferSelect;
export type AuditEvent = typeof auditEvents.$inferSelect;
export type JobRow = typeof jobs.$inferSelect;
export type ThreadRow = typeof threads.$inferSelect;
export type CommentRow = typeof comments.$inferSelect;
export type ReviewEventRow = typeof reviewEvents.$inferSelect;
export type InvitationRow = typeof invitations.$inferSelect;
export type OutboxRow = typeof outbox.$inferSelect;
export type ExportRow = typeof exports.$inferSelect;
export type MarkupRow = typeof markup.$inferSelect;
export type InboxItemRow = typeof inboxItems.$inferSelect;
