import "server-only";
import { and, asc, desc, eq, inArray, sql, type SQL } from "drizzle-orm";
import { auditEvents, comments, micrographs, threads, users } from "@/db/schema";
import { type Actor, type Db } from "./context";
import { loadDie } from "./dies";
import type { ActivityItem } from "@/lib/dto/activity";
import { activityDetail, type ActivityContext } from "@/lib/review/activity-words";

type AuditRow = typeof auditEvents.$inferSelect;
const field = (v: unknown, k: string): string | null => {
  const x = v && typeof v === "object" ? (v as Record<string, unknown>)[k] : null;
  return typeof x === "string" ? x : null;
};

/** The micrograph an event names: the one changed, or the new reference. */
const micrographOf = (e: AuditRow) =>
  e.action === "micrograph.reference_changed" ? field(e.after, "referenceId") : e.entityType === "micrograph" ? e.entityId : null;
/** The remark an event names: the thread itself, or a comment's thread. */
const threadOf = (e: AuditRow) => (e.entityType === "thread" ? e.entityId : e.entityType === "comment" ? field(e.after ?? e.before, "threadId") : null);

/**
 * What the page's entries need besides their audit rows: micrograph labels and illuminations
 * (aligning records only the transform), remark numbers (as the remark list counts them: by
 * creation on the die) and each remark's first message, so a comment reads as the remark or a reply.
 */
async function contextsOf(db: Db, dieId: string, events: readonly AuditRow[]): Promise<ActivityContext[]> {
  const mIds = [...new Set(events.map(micrographOf).filter((id): id is string => !!id))];
  const named = mIds.length
    ? await db
        .select({ id: micrographs.id, label: micrographs.label, illumination: micrographs.illumination })
        .from(micrographs)
        .where(inArray(micrographs.id, mIds))
    : [];
  const byMicrograph = new Map(named.map((m) => [m.id, m]));
  const tIds = [...new Set(events.map(threadOf).filter((id): id is string => !!id))];
  const numbers = new Map<string, number>();
  const firstComment = new Map<string, string>();
  if (tIds.length) {
    const all = await db.select({ id: threads.id }).from(threads).where(eq(threads.dieId, dieId)).orderBy(asc(threads.createdAt), asc(threads.id));
    all.forEach((t, i) => numbers.set(t.id, i + 1));
    const cs = await db
      .select({ id: comments.id, threadId: comments.threadId })
      .from(comments)
      .where(inArray(comments.threadId, tIds))
      .orderBy(asc(comments.createdAt), asc(comments.id));
    for (const c of cs) if (!firstComment.has(c.threadId)) firstComment.set(c.threadId, c.id);
  }
  return events.map((e) => {
    const m = micrographOf(e);
    const t = threadOf(e);
    // A deleted message is no longer among the comments, so its deletion reads as a reply's.
    const first = t ? firstComment.get(t) : undefined;
    return {
      micrograph: m ? (byMicrograph.get(m) ?? null) : null,
      remarkNumber: t ? (numbers.get(t) ?? null) : null,
      isRemarkText: e.entityType === "comment" && !!first && first === e.entityId,
    };
  });
}

/** Cursor of an item: its time and id, so items sharing a timestamp are neither lost nor repeated. */
const cursorOf = (item: { at: string; id: string }) => `${item.at}~${item.id}`;

/**
 * The die's activity from the audit trail (markup, micrographs, remarks and replies, checks), newest first,
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
  const shown = rows.slice(0, page.limit);
  const contexts = await contextsOf(
    db,
    dieId,
    shown.map((r) => r.e),
  );
  const items = shown.map(({ e, actorName }, i) => ({
    id: e.id,
    at: e.at.toISOString(),
    action: e.action,
    entityType: e.entityType,
    entityId: e.entityId,
    actorId: e.actorId,
    actorName,
    detail: activityDetail(e.action, e.before, e.after, contexts[i]),
  }));
  return { items, nextBefore: rows.length > page.limit ? cursorOf(items[items.length - 1]) : null };
}
