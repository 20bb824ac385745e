import "server-only";
import { and, asc, eq, inArray } from "drizzle-orm";
import { commentMentions, comments, markup, threads, users, type ThreadRow } from "@/db/schema";
import { type Actor, type Db } from "./context";
import { loadDie, loadDieOf } from "./dies";
import { recordAudit } from "./audit";
import { insertComment } from "./comment-insert";
import { BadRequestError, ConflictError } from "@/lib/errors";
import { geometryCentre } from "@/lib/geometry/measure";
import { dieBounds, firstPositionOutside, describeBounds } from "@/lib/markup/die-bounds";
import type { Geometry } from "@/lib/geometry/types";
import type { TeamAction } from "@/lib/auth/permissions";
import type { NewThreadInput } from "@/lib/validation/review";
import type { CommentDto, ThreadDto } from "@/lib/dto/threads";

/** Loads a thread and checks the caller may do `action` on its die (404 outside the team). */
export async function loadThread(db: Db, actor: Actor, threadId: string, action: TeamAction) {
  const [row] = await db.select().from(threads).where(eq(threads.id, threadId));
  const { die } = await loadDieOf(db, actor, row, action, "That remark");
  return { row, die };
}

async function commentsOf(db: Db, threadIds: string[]): Promise<Map<string, CommentDto[]>> {
  const byThread = new Map<string, CommentDto[]>();
  if (threadIds.length === 0) return byThread;
  const rows = await db
    .select({ c: comments, authorName: users.name })
    .from(comments)
    .leftJoin(users, eq(users.id, comments.authorId))
    .where(inArray(comments.threadId, threadIds))
    .orderBy(asc(comments.createdAt), asc(comments.id));
  const ids = rows.map((r) => r.c.id);
  const mentions = ids.length ? await db.select().from(commentMentions).where(inArray(commentMentions.commentId, ids)) : [];
  for (const { c, authorName } of rows) {
    const list = byThread.get(c.threadId) ?? [];
    list.push({
      id: c.id,
      threadId: c.threadId,
      authorId: c.authorId,
      authorName,
      body: c.body,
      mentions: mentions.filter((m) => m.commentId === c.id).map((m) => m.userId),
      editedAt: c.editedAt?.toISOString() ?? null,
      createdAt: c.createdAt.toISOString(),
    });
    byThread.set(c.threadId, list);
  }
  return byThread;
}

/** Threads of a die with their comments, oldest first; orphaned ones are marked. */
export async function listThreads(db: Db, actor: Actor, dieId: string): Promise<ThreadDto[]> {
  await loadDie(db, actor, dieId, "read");
  const rows = await db.select().from(threads).where(eq(threads.dieId, dieId)).orderBy(asc(threads.createdAt), asc(threads.id));
  return threadDtos(db, rows);
}

/** The same DTOs for given rows (one query per table, whatever the number of threads). */
async function threadDtos(db: Db, rows: ThreadRow[]): Promise<ThreadDto[]> {
  const shapeIds = rows.flatMap((r) => (r.shapeId ? [r.shapeId] : []));
  const alive = new Set(shapeIds.length ? (await db.select({ id: markup.id }).from(markup).where(inArray(markup.id, shapeIds))).map((s) => s.id) : []);
  const userIds = [...new Set(rows.flatMap((r) => [r.resolvedBy, r.createdBy].filter((x): x is string => !!x)))];
  const names = new Map(
    userIds.length ? (await db.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, userIds))).map((u) => [u.id, u.name]) : [],
  );
  const byThread = await commentsOf(
    db,
    rows.map((r) => r.id),
  );
  return rows.map((r) => {
    const anchor = r.anchor as Geometry;
    const [x, y] = geometryCentre(anchor);
    return {
      id: r.id,
      dieId: r.dieId,
      shapeId: r.shapeId,
      anchor,
      pin: [x, y],
      orphaned: !!r.shapeId && !alive.has(r.shapeId),
      status: r.status,
      resolvedBy: r.resolvedBy ? { id: r.resolvedBy, name: names.get(r.resolvedBy) ?? "" } : null,
      resolvedAt: r.resolvedAt?.toISOString() ?? null,
      createdBy: r.createdBy,
      createdByName: r.createdBy ? (names.get(r.createdBy) ?? null) : null,
      createdAt: r.createdAt.toISOString(),
      comments: byThread.get(r.id) ?? [],
    };
  });
}

/** One thread as the caller may see it. */
export async function getThread(db: Db, actor: Actor, threadId: string): Promise<ThreadDto> {
  const { row } = await loadThread(db, actor, threadId, "read");
  return (await threadDtos(db, [row]))[0];
}

async function anchorFor(
  db: Db,
  dieId: string,
  input: NewThreadInput,
  bounds: ReturnType<typeof dieBounds>,
): Promise<{ shapeId: string | null; anchor: Geometry }> {
  if ("shapeId" in input) {
    const [shape] = await db
      .select()
      .from(markup)
      .where(and(eq(markup.id, input.shapeId.toLowerCase()), eq(markup.dieId, dieId)));
    if (!shape)
      throw new BadRequestError("Invalid body: shapeId: no shape with that id on this die.", [
        { path: "shapeId", message: "no shape with that id on this die" },
      ]);
    return { shapeId: shape.id, anchor: shape.geometry };
  }
  const outside = firstPositionOutside(input.region, bounds);
  if (outside) {
    const path = ["region", ...outside].join(".");
    throw new BadRequestError(`Invalid body: ${path}: lies outside the die and its margin (${describeBounds(bounds)})`, [
      { path, message: "lies outside the die" },
    ]);
  }
  return { shapeId: null, anchor: input.region };
}

/** Starts a thread on a shape or a region with its first comment (owner/analyst/reviewer). */
export async function createThread(db: Db, actor: Actor, dieId: string, input: NewThreadInput, origin: string): Promise<ThreadDto> {
  const id = await db.transaction(async (tx) => {
    const { row: die, teamId } = await loadDie(tx, actor, dieId, "comment");
    const { shapeId, anchor } = await anchorFor(tx, dieId, input, dieBounds(die));
    const [t] = await tx.insert(threads).values({ dieId, shapeId, anchor, createdBy: actor.userId }).returning();
    await recordAudit(tx, actor, { teamId, action: "thread.created", entityType: "thread", entityId: t.id, dieId, after: t });
    await insertComment(tx, actor, { thread: t, teamId, dieName: die.name, body: input.body, origin });
    return t.id;
  });
  return getThread(db, actor, id);
}

/** Resolves or reopens a thread, recording who and when (owner/analyst/reviewer). */
export async function setThreadStatus(db: Db, actor: Actor, threadId: string, status: "open" | "resolved"): Promise<ThreadDto> {
  await db.transaction(async (tx) => {
    const { row, die } = await loadThread(tx, actor, threadId, "comment");
    if (row.status === status) throw new ConflictError(status === "resolved" ? "This remark is already closed." : "This remark is already open.");
    const resolved = status === "resolved";
    const [after] = await tx
      .update(threads)
      .set({ status, resolvedBy: resolved ? actor.userId : null, resolvedAt: resolved ? new Date() : null, updatedAt: new Date() })
      .where(eq(threads.id, threadId))
      .returning();
    await recordAudit(tx, actor, {
      teamId: die.teamId,
      action: resolved ? "thread.resolved" : "thread.reopened",
      entityType: "thread",
      entityId: threadId,
      dieId: row.dieId,
      before: row,
      after,
    });
  });
  return getThread(db, actor, threadId);
}
