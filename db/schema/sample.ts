// The physical sample behind a case: how it arrived and was prepared, and who held it when.
import { bigint, index, jsonb, pgEnum, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { CUSTODY_ACTIONS } from "@/lib/dto/stored-values";
import type { PreparationStep } from "@/lib/dto/sample";
import { createdAt, updatedAt } from "./columns";
import { users } from "./people";
import { cases } from "./dies";

/** One row per case at most: the case's sample record, written whole by each save. */
export const caseSamples = pgTable("case_samples", {
  caseId: uuid("case_id")
    .primaryKey()
    .references(() => cases.id, { onDelete: "cascade" }),
  receivedAt: timestamp("received_at", { withTimezone: true }),
  receivedFrom: text("received_from").notNull().default(""),
  condition: text("condition").notNull().default(""),
  storageLocation: text("storage_location").notNull().default(""),
  /** The steps in the lab's order; validated by lib/validation/sample.ts before it lands here. */
  preparation: jsonb("preparation").$type<PreparationStep[]>().notNull().default([]),
  updatedBy: uuid("updated_by").references(() => users.id, { onDelete: "set null" }),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
});

export const custodyActionEnum = pgEnum("custody_action", CUSTODY_ACTIONS);

/** The chain of custody: rows are only ever inserted (no update or delete path exists). */
export const custodyEvents = pgTable(
  "custody_events",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    caseId: uuid("case_id")
      .notNull()
      .references(() => cases.id, { onDelete: "cascade" }),
    action: custodyActionEnum("action").notNull(),
    to: text("to").notNull().default(""),
    location: text("location").notNull().default(""),
    note: text("note").notNull().default(""),
    actorId: uuid("actor_id").references(() => users.id, { onDelete: "set null" }),
    /** The actor's name when the entry was made: the log still says who after an account goes. */
    actorName: text("actor_name").notNull(),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
    /** Insertion order, for entries of the same instant. */
    seq: bigint("seq", { mode: "number" }).generatedAlwaysAsIdentity(),
  },
  (t) => [index("custody_events_case_idx").on(t.caseId, t.at, t.seq)],
);
