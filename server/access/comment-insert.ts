import "server-only";
import { eq } from "drizzle-orm";
import { commentMentions, comments, type ThreadRow } from "@/db/schema";
import { type Actor, type Db } from "./context";
import { recordAudit } from "./audit";
import { enqueueMail, teamPeople, wantingMail, type TeamPerson } from "./notify";
import { addInboxItems } from "./inbox";
import { resolveMentions } from "@/lib/review/mentions";
import { commentMail } from "@/lib/review/mail-templates";
import { inboxText } from "@/lib/review/inbox-text";

// Writing one comment with what follows from it: mentions, audit, inbox items and mail. Both
// a new thread's first comment and a reply go through here.

/** The deep link to one thread: the die bench opens zoomed to it. */
function threadLink(origin: string, dieId: string, threadId: string): string {
  return `${origin}/dies/${dieId}?thread=${threadId}`;
}

async function participants(db: Db, threadId: string, createdBy: string | null): Promise<Set<string>> {
  const rows = await db.select({ authorId: comments.authorId }).from(comments).where(eq(comments.threadId, threadId));
  return new Set([createdBy, ...rows.map((r) => r.authorId)].filter((x): x is string => !!x));
}

export async function notifyComment(
  db: Db,
  actor: Actor,
  p: {
    thread: ThreadRow;
    teamId: string;
    dieName: string;
    body: string;
    origin: string;
    commentId: string;
    people: TeamPerson[];
    mentioned: string[];
    threadMembers: Set<string>;
  },
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
export async function insertComment(
  db: Db,
  actor: Actor,
  p: { thread: ThreadRow; teamId: string; dieName: string; body: string; origin: string },
): Promise<string> {
  const threadMembers = await participants(db, p.thread.id, p.thread.createdBy);
  const [c] = await db.insert(comments).values({ threadId: p.thread.id, authorId: actor.userId, body: p.body }).returning();
  const people = await teamPeople(db, p.teamId);
  const mentioned = resolveMentions(p.body, people);
  if (mentioned.length) await db.insert(commentMentions).values(mentioned.map((userId) => ({ commentId: c.id, userId })));
  await recordAudit(db, actor, {
    teamId: p.teamId,
    action: "comment.created",
    entityType: "comment",
    entityId: c.id,
    dieId: p.thread.dieId,
    after: { ...c, mentions: mentioned },
  });
  await notifyComment(db, actor, { ...p, commentId: c.id, people, mentioned, threadMembers });
  return c.id;
}
