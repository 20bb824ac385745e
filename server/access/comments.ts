import "server-only";
import { eq } from "drizzle-orm";
import { commentMentions, comments } from "@/db/schema";
import { type Actor, type Db } from "./context";
import { recordAudit } from "./audit";
import { loadThread, getThread } from "./threads";
import type { ThreadDto } from "@/lib/dto/threads";
import { ForbiddenError, NotFoundError } from "@/lib/errors";
import { insertComment, notifyComment } from "./comment-insert";
import { teamPeople } from "./notify";
import { resolveMentions } from "@/lib/review/mentions";

/** Replies on a thread (owner/analyst/reviewer). */
export async function addComment(db: Db, actor: Actor, threadId: string, body: string, origin: string): Promise<ThreadDto> {
  await db.transaction(async (tx) => {
    const { row, die } = await loadThread(tx, actor, threadId, "comment");
    await insertComment(tx, actor, { thread: row, teamId: die.teamId, dieName: die.row.name, body, origin });
  });
  return getThread(db, actor, threadId);
}

async function loadOwnComment(db: Db, actor: Actor, commentId: string) {
  const [c] = await db.select().from(comments).where(eq(comments.id, commentId));
  if (!c) throw new NotFoundError("That comment");
  const thread = await loadThread(db, actor, c.threadId, "comment").catch((e) => {
    throw e instanceof NotFoundError ? new NotFoundError("That comment") : e;
  });
  if (c.authorId !== actor.userId) throw new ForbiddenError("You can only change or delete what you wrote yourself.");
  return { c, thread };
}

/** Changes the text of one's own comment; mentions are resolved again and new ones notified. */
export async function editComment(db: Db, actor: Actor, commentId: string, body: string, origin: string): Promise<ThreadDto> {
  const threadId = await db.transaction(async (tx) => {
    const { c, thread } = await loadOwnComment(tx, actor, commentId);
    const [after] = await tx.update(comments).set({ body, editedAt: new Date() }).where(eq(comments.id, commentId)).returning();
    const people = await teamPeople(tx, thread.die.teamId);
    const mentioned = resolveMentions(body, people);
    await tx.delete(commentMentions).where(eq(commentMentions.commentId, commentId));
    if (mentioned.length) await tx.insert(commentMentions).values(mentioned.map((userId) => ({ commentId, userId })));
    await recordAudit(tx, actor, {
      teamId: thread.die.teamId,
      action: "comment.edited",
      entityType: "comment",
      entityId: commentId,
      dieId: thread.row.dieId,
      before: c,
      after,
    });
    // Dedupe keys are per comment and person, so only newly mentioned people get a mail.
    await notifyComment(tx, actor, {
      thread: thread.row,
      teamId: thread.die.teamId,
      dieName: thread.die.row.name,
      body,
      origin,
      commentId,
      people,
      mentioned,
      threadMembers: new Set(),
    });
    return c.threadId;
  });
  return getThread(db, actor, threadId);
}

/** Deletes one's own comment; the thread stays. */
export async function deleteComment(db: Db, actor: Actor, commentId: string): Promise<void> {
  await db.transaction(async (tx) => {
    const { c, thread } = await loadOwnComment(tx, actor, commentId);
    await tx.delete(comments).where(eq(comments.id, commentId));
    await recordAudit(tx, actor, {
      teamId: thread.die.teamId,
      action: "comment.deleted",
      entityType: "comment",
      entityId: commentId,
      dieId: thread.row.dieId,
      before: c,
    });
  });
}
