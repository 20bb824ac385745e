import "server-only";
import { and, eq, sql } from "drizzle-orm";
import { users } from "@/db/schema";
import type { Db } from "./context";

// Sessions are signed tokens that stay valid until they expire whatever the browser does, so a
// session ends on the server by raising the user's session version: every token carries the
// version it was issued with, and a token whose version is not the current one is refused
// wherever the session is read (the jwt callback in auth.ts).

/** The user's current session version, or null when the account is gone. */
export async function sessionVersionOf(db: Db, userId: string): Promise<number | null> {
  const [row] = await db.select({ v: users.sessionVersion }).from(users).where(eq(users.id, userId));
  return row?.v ?? null;
}

/**
 * Ends every session of a user issued so far. With `onlyIfVersion`, only when that is still
 * the current version: a replayed, already-ended token cannot end the newer sessions.
 */
export async function endSessions(db: Db, userId: string, onlyIfVersion?: number): Promise<boolean> {
  const rows = await db
    .update(users)
    .set({ sessionVersion: sql`${users.sessionVersion} + 1` })
    .where(and(eq(users.id, userId), onlyIfVersion === undefined ? undefined : eq(users.sessionVersion, onlyIfVersion)))
    .returning({ id: users.id });
  return rows.length > 0;
}
