import "server-only";
import { and, desc, eq, sql } from "drizzle-orm";
import { outbox, type OutboxRow } from "@/db/schema";
import { authorize, type Actor, type Db } from "./context";
import { MAX_SEND_ATTEMPTS, retryDelayMs } from "@/lib/review/backoff";
import type { OutboxItemDto } from "@/lib/dto/outbox";

/** Recent mail of a team with its delivery state, newest first (owner only: failures show here). */
export async function listTeamOutbox(db: Db, actor: Actor, teamId: string, limit = 100): Promise<OutboxItemDto[]> {
  await authorize(db, actor, teamId, "manage_team", "That team");
  const rows = await db.select().from(outbox).where(eq(outbox.teamId, teamId)).orderBy(desc(outbox.createdAt)).limit(limit);
  return rows.map((r) => ({
    id: r.id,
    kind: r.kind,
    toEmail: r.toEmail,
    subject: r.subject,
    status: r.status,
    attempts: r.attempts,
    lastError: r.lastError,
    nextAttemptAt: r.nextAttemptAt.toISOString(),
    sentAt: r.sentAt?.toISOString() ?? null,
    createdAt: r.createdAt.toISOString(),
  }));
}

/** A message still waiting to be sent, or null (sent, given up, or gone). */
export async function pendingMail(db: Db, id: string): Promise<OutboxRow | null> {
  const [row] = await db
    .select()
    .from(outbox)
    .where(and(eq(outbox.id, id), eq(outbox.status, "pending")));
  return row ?? null;
}

/** Marks a message sent. */
export async function markMailSent(db: Db, id: string): Promise<void> {
  await db
    .update(outbox)
    .set({ status: "sent", sentAt: new Date(), lastError: null, attempts: sql`${outbox.attempts} + 1` })
    .where(eq(outbox.id, id));
}

/**
 * Records a failed attempt: pending with the earliest time of the next (the queue's back-off
 * waits at least that long), failed for good after MAX_SEND_ATTEMPTS.
 */
export async function markMailFailed(db: Db, row: OutboxRow, error: string, baseDelayMs: number): Promise<void> {
  const attempts = row.attempts + 1;
  const last = attempts >= MAX_SEND_ATTEMPTS;
  await db
    .update(outbox)
    .set({
      attempts,
      lastError: error.slice(0, 500),
      status: last ? "failed" : "pending",
      nextAttemptAt: new Date(Date.now() + retryDelayMs(attempts, baseDelayMs)),
    })
    .where(eq(outbox.id, row.id));
}

/** A message whose attempts ran out without one of them recording it (its sender died each time). */
export async function markMailGivenUp(db: Db, id: string, error: string): Promise<void> {
  await db
    .update(outbox)
    .set({ status: "failed", lastError: error.slice(0, 500) })
    .where(and(eq(outbox.id, id), eq(outbox.status, "pending")));
}
