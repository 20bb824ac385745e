import "server-only";
import { eq } from "drizzle-orm";
import { commentMentions, comments, type ThreadRow } from "../schema";
import { type Actor, type Db } from "./context";
import { recordAudit } from "./audit";
import { enqueueMail, teamPeople, wantingMail, type TeamPerson } from "./notify";
import { loadThread, getThread, type ThreadDto } from "./threads";
import { ForbiddenError, NotFoundError } from "@/lib/server/errors";
import { resolveMentions } from "@/lib/review/mentions";
import { commentMail } from "@/lib/review/mail-templates";
import { inboxText } from "@/lib/review/inbox-text";
import { addInboxItems } from "./inbox";

/** The deep link to one thread: the die bench opens zoomed to it. */
function threadLink(origin: string, dieId: string, threadId: string): string {
  return `${origin}/dies/${dieId}?thread=${threadId}`;
}

async function participants(db: Db, threadId: string, createdBy: string | null): Promise<Set<string>> {
  const rows = await db.select({ authorId: comments.authorId }).from(comments).where(eq(comments.threadId, threadId));
  return new Set([createdBy, ...rows.map((r) => r.authorId)].filter((x): x is string => !!x));
}

async function notifyComment(
  db: Db,
  actor: Actor,
  p: { thread: ThreadRow; teamId: string; dieName: string; body: string; origin: string; commentId: string; people: TeamPerson[]; mentioned: string[]; threadMembers: Set<string> },
) {
  const author = p.people.find((m) => m.userId === actor.userId)?.name ?? "Someone";
  const link = threadLink(p.origin, p.thread.dieId, p.thread.id);
  const mentioned = p.people.filter((m) => p.mentioned.includes(m.userId) && m.userId !== actor.userId);
  const others = p.people.filter((m) => p.threadMembers.has(m.userId) && m.userId !== actor.userId && !p.mentioned.includes(m.userId));
  // The inbox gets every item whatever the mail settings: those choose mail only.
  const item = (kind: "mention" | "comment", m: TeamPerson) => ({
    userId: m.userId,
    teamId: p.teamId,
    kind,
    dieId: p.thread.dieId,
    threadId: p.thread.id,
    text: inboxText({ kind, author, dieName: p.dieName, body: p.body }),
    dedupeKey: `${kind}:${p.commentId}:${m.userId}`,
  });
  await addInboxItems(db, [...mentioned.map((m) => item("mention", m)), ...others.map((m) => item("comment", m))]);
  for (const m of await wantingMail(db, mentioned, "mention")) {
    const content = commentMail({ kind: "mention", author, dieName: p.dieName, body: p.body, link });
    await enqueueMail(db, { teamId: p.teamId, kind: "mention", to: m.email, content, dedupeKey: `mention:${p.commentId}:${m.userId}` });
  }
  // Others in the thread hear of the comment, unless a mention already told them.
  for (const m of await wantingMail(db, others, "comment")) {
    const content = commentMail({ kind: "comment", author, dieName: p.dieName, body: p.body, link });
    await enqueueMail(db, { teamId: p.teamId, kind: "comment", to: m.email, content, dedupeKey: `comment:${p.commentId}:${m.userId}` });
  }
}

/**
 * Writes a comment with its mentions (members of the die's team only), its audit event and
 * its notification mails, all in the caller's transaction.
 */
export async function insertComment(db: Db, actor: Actor, p: { thread: ThreadRow; teamId: string; dieName: string; body: string; origin: string }): Promise<string> {
  const threadMembers = await participants(db, p.thread.id, p.thread.createdBy);
  const [c] = await db.insert(comments).values({ threadId: p.thread.id, authorId: actor.userId, body: p.body }).returning();
  const people = await teamPeople(db, p.teamId);
  const mentioned = resolveMentions(p.body, people);
  if (mentioned.length) await db.insert(commentMentions).values(mentioned.map((userId) => ({ commentId: c.id, userId })));
  await recordAudit(db, actor, { teamId: p.teamId, action: "comment.created", entityType: "comment", entityId: c.id, dieId: p.thread.dieId, after: { ...c, mentions: mentioned } });
  await notifyComment(db, actor, { ...p, commentId: c.id, people, mentioned, threadMembers });
  return c.id;
}

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
  if (c.authorId !== actor.userId) throw new ForbiddenError("You can only change or delete your own comments.");
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
    await recordAudit(tx, actor, { teamId: thread.die.teamId, action: "comment.edited", entityType: "comment", entityId: commentId, dieId: thread.row.dieId, before: c, after });
    // Dedupe keys are per comment and person, so only newly mentioned people get a mail.
    await notifyComment(tx, actor, { thread: thread.row, teamId: thread.die.teamId, dieName: thread.die.row.name, body, origin, commentId, people, mentioned, threadMembers: new Set() });
    return c.threadId;
  });
  return getThread(db, actor, threadId);
}

/** Deletes one's own comment; the thread stays. */
export async function deleteComment(db: Db, actor: Actor, commentId: string): Promise<void> {
  await db.transaction(async (tx) => {
    const { c, thread } = await loadOwnComment(tx, actor, commentId);
    await tx.delete(comments).where(eq(comments.id, commentId));
    await recordAudit(tx, actor, { teamId: thread.die.teamId, action: "comment.deleted", entityType: "comment", entityId: commentId, dieId: thread.row.dieId, before: c });
  });
}

