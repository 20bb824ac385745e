import "server-only";
import { and, desc, eq, sql, type SQL } from "drizzle-orm";
import { auditEvents, users } from "@/db/schema";
import { type Actor, type Db } from "./context";
import { loadDie } from "./dies";
import type { ActivityItem } from "@/lib/dto/activity";

function detailOf(action: string, before: unknown, after: unknown): string {
  const a = (after ?? before ?? {}) as Record<string, unknown>;
  if (action.startsWith("comment.") && typeof a.body === "string") return a.body.split("\n")[0].slice(0, 140);
  if (action.startsWith("markup.") && typeof a.kind === "string") return a.kind.replace("_", " ");
  if (action.startsWith("review.")) return typeof a.message === "string" ? a.message.slice(0, 140) : "";
  return "";
}

/** Cursor of an item: its time and id, so items sharing a timestamp are neither lost nor repeated. */
const cursorOf = (item: { at: string; id: string }) => `${item.at}~${item.id}`;

/**
 * The die's activity from the audit trail (markup, threads, comments, review), newest first,
 * `limit` at a time; `before` is the cursor of the last item of the previous page.
 */
export async function listActivity(
  db: Db,
  actor: Actor,
  dieId: string,
  page: { before?: string; limit: number },
): Promise<{ items: ActivityItem[]; nextBefore: string | null }> {
  await loadDie(db, actor, dieId, "read");
  // Times compared at millisecond precision, the precision a cursor carries.
  const atMs = sql`date_trunc('milliseconds', ${auditEvents.at})`;
  let where: SQL = eq(auditEvents.dieId, dieId);
  if (page.before) {
    const [iso, id] = page.before.split("~");
    where = and(where, sql`(${atMs} < ${iso}::timestamptz or (${atMs} = ${iso}::timestamptz and ${auditEvents.id} < ${id}::uuid))`)!;
  }
  const rows = await db
    .select({ e: auditEvents, actorName: users.name })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorId))
    .where(where)
    .orderBy(desc(atMs), desc(auditEvents.id))
    .limit(page.limit + 1);
  const items = rows.slice(0, page.limit).map(({ e, actorName }) => ({
    id: e.id,
    at: e.at.toISOString(),
    action: e.action,
    entityType: e.entityType,
    entityId: e.entityId,
    actorId: e.actorId,
    actorName,
    detail: detailOf(e.action, e.before, e.after),
  }));
  return { items, nextBefore: rows.length > page.limit ? cursorOf(items[items.length - 1]) : null };
}
