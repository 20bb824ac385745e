// Checking: threads and comments, review history, notifications (outbox, inbox, choices).
import { boolean, index, integer, jsonb, pgEnum, pgTable, primaryKey, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { OUTBOX_STATUSES, REVIEW_ACTIONS, THREAD_STATUSES } from "@/lib/dto/stored-values";
import type { Geometry } from "@/lib/geometry/types";
import type { InboxKind } from "@/lib/dto/inbox";
import type { NotificationKind } from "@/lib/validation/review";
import { createdAt, updatedAt } from "./columns";
import { users, teams } from "./people";
import { dies, reviewStatusEnum } from "./dies";

export const threadStatusEnum = pgEnum("thread_status", THREAD_STATUSES);

/**
 * A review thread on a shape or on a region drawn for it. The shape reference has no foreign
 * key: when the shape is deleted the thread stays, anchored where the shape was (`anchor`).
 */
export const threads = pgTable(
  "threads",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    dieId: uuid("die_id")
      .notNull()
      .references(() => dies.id, { onDelete: "cascade" }),
    shapeId: uuid("shape_id"),
    /** GeoJSON Point or Polygon in die µm: the region, or where the shape was last. */
    anchor: jsonb("anchor").$type<Geometry>().notNull(),
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
    threadId: uuid("thread_id")
      .notNull()
      .references(() => threads.id, { onDelete: "cascade" }),
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
    commentId: uuid("comment_id")
      .notNull()
      .references(() => comments.id, { onDelete: "cascade" }),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
  },
  (t) => [primaryKey({ columns: [t.commentId, t.userId] }), index("comment_mentions_user_idx").on(t.userId)],
);

export const reviewActionEnum = pgEnum("review_action", REVIEW_ACTIONS);

/** The die's check history: every move with its message and the revision it moved. */
export const reviewEvents = pgTable(
  "review_events",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    dieId: uuid("die_id")
      .notNull()
      .references(() => dies.id, { onDelete: "cascade" }),
    actorId: uuid("actor_id").references(() => users.id, { onDelete: "set null" }),
    action: reviewActionEnum("action").notNull(),
    fromStatus: reviewStatusEnum("from_status").notNull(),
    toStatus: reviewStatusEnum("to_status").notNull(),
    message: text("message").notNull().default(""),
    revision: integer("revision").notNull().default(1),
    /** A sign-off made while remarks were open: the message says why. */
    overrideOpenRemarks: boolean("override_open_remarks").notNull().default(false),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("review_events_die_idx").on(t.dieId, t.at)],
);

export const outboxStatusEnum = pgEnum("outbox_status", OUTBOX_STATUSES);

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
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    kind: text("kind").$type<NotificationKind>().notNull(),
    enabled: boolean("enabled").notNull(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.kind] })],
);

/**
 * A user's in-app inbox: one item per mention, comment or review event addressed to them,
 * written where the matching mail is queued (whatever their mail settings), read by that user only.
 */
export const inboxItems = pgTable(
  "inbox_items",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    teamId: uuid("team_id")
      .notNull()
      .references(() => teams.id, { onDelete: "cascade" }),
    kind: text("kind").$type<InboxKind>().notNull(),
    dieId: uuid("die_id")
      .notNull()
      .references(() => dies.id, { onDelete: "cascade" }),
    threadId: uuid("thread_id").references(() => threads.id, { onDelete: "cascade" }),
    text: text("text").notNull(),
    /** Names the event and the recipient, like the outbox's: one item per event and person. */
    dedupeKey: text("dedupe_key").notNull(),
    readAt: timestamp("read_at", { withTimezone: true }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("inbox_items_dedupe_idx").on(t.dedupeKey), index("inbox_items_user_idx").on(t.userId, t.createdAt)],
);
