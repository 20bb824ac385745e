// People: accounts, teams and who belongs to them, sign-in attempts, invitations.
import { sql } from "drizzle-orm";
import { boolean, index, integer, pgEnum, pgTable, primaryKey, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { ROLES } from "@/lib/dto/stored-values";
import { createdAt } from "./columns";

export const roleEnum = pgEnum("role", ROLES);

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
    teamId: uuid("team_id")
      .notNull()
      .references(() => teams.id, { onDelete: "cascade" }),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    role: roleEnum("role").notNull(),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.teamId, t.userId] }), index("memberships_user_idx").on(t.userId)],
);

export const signInAttempts = pgTable(
  "sign_in_attempts",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    /** Lower-cased e-mail as typed, whether or not an account exists. */
    email: text("email").notNull(),
    /** The client address the attempt came from (see server/http/client-address.ts). */
    address: text("address").notNull().default(""),
    /** Recorded as a failure before the password is checked; set true when it matched. */
    succeeded: boolean("succeeded").notNull(),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("sign_in_attempts_email_at_idx").on(t.email, t.at), index("sign_in_attempts_address_at_idx").on(t.address, t.at)],
);

/** An invitation to join a team; only a hash of the single-use token is stored. */
export const invitations = pgTable(
  "invitations",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    teamId: uuid("team_id")
      .notNull()
      .references(() => teams.id, { onDelete: "cascade" }),
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
