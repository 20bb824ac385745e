import "server-only";
import { and, desc, eq, isNull, sql } from "drizzle-orm";
import { inboxItems, memberships } from "@/db/schema";
import type { Actor, Db } from "./context";
import { NotFoundError } from "@/lib/errors";
import type { InboxItemDto, InboxKind } from "@/lib/dto/inbox";

export type NewInboxItem = { userId: string; teamId: string; kind: InboxKind; dieId: string; threadId?: string; text: string; dedupeKey: string };

/** How many items the inbox lists (newest first). */
const INBOX_LIMIT = 200;

/**
 * Puts items in people's inboxes, in the caller's transaction, next to the mail of the same
 * event. The dedupe key names event and recipient, so an event is listed once per person.
 */
export async function addInboxItems(db: Db, items: readonly NewInboxItem[]): Promise<void> {
  if (items.length === 0) return;
  await db
    .insert(inboxItems)
    .values(items.map((i) => ({ ...i, threadId: i.threadId ?? null })))
    .onConflictDoNothing({ target: inboxItems.dedupeKey });
}

// Only items of teams the caller still belongs to: leaving a team takes its items along.
const mine = (actor: Actor) =>
  and(
    eq(inboxItems.userId, actor.userId),
    sql`exists (select 1 from ${memberships} where ${memberships.teamId} = ${inboxItems.teamId} and ${memberships.userId} = ${actor.userId})`,
  );

const toDto = (r: typeof inboxItems.$inferSelect): InboxItemDto => ({
  id: r.id,
  kind: r.kind as InboxKind,
  dieId: r.dieId,
  ...(r.threadId ? { threadId: r.threadId } : {}),
  text: r.text,
  createdAt: r.createdAt.toISOString(),
  readAt: r.readAt?.toISOString() ?? null,
});

/** The caller's inbox, newest first (their own items only). */
export async function listInbox(db: Db, actor: Actor): Promise<{ items: InboxItemDto[] }> {
  const rows = await db.select().from(inboxItems).where(mine(actor)).orderBy(desc(inboxItems.createdAt), desc(inboxItems.id)).limit(INBOX_LIMIT);
  return { items: rows.map(toDto) };
}

/** How many of the caller's items are unread (for the top bar). */
export async function unreadInboxCount(db: Db, actor: Actor): Promise<number> {
  const [row] = await db
    .select({ n: sql<number>`count(*)::int` })
    .from(inboxItems)
    .where(and(mine(actor), isNull(inboxItems.readAt)));
  return row.n;
}

/** Marks one of the caller's items read (again: keeps the first time); 404 for anyone else's. */
export async function markInboxItemRead(db: Db, actor: Actor, id: string): Promise<InboxItemDto> {
  const [row] = await db
    .update(inboxItems)
    .set({ readAt: sql`coalesce(${inboxItems.readAt}, now())` })
    .where(and(eq(inboxItems.id, id), mine(actor)))
    .returning();
  if (!row) throw new NotFoundError("That inbox item");
  return toDto(row);
}
