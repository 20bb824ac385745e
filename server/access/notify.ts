import "server-only";
import { and, eq, inArray } from "drizzle-orm";
import { memberships, notificationPrefs, outbox, users } from "@/db/schema";
import { queueJob } from "./job-queue";
import type { Db } from "./context";
import type { TeamRole } from "@/lib/auth/permissions";
import type { MailContent } from "@/lib/review/mail-templates";
import type { NotificationKind } from "@/lib/validation/review";

export type TeamPerson = { userId: string; name: string; email: string; role: TeamRole };

/** Everyone in a team, with their role (mentions resolve only against this list). */
export async function teamPeople(db: Db, teamId: string): Promise<TeamPerson[]> {
  return db
    .select({ userId: users.id, name: users.name, email: users.email, role: memberships.role })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.teamId, teamId));
}

/** The people among `candidates` who have not turned notifications of `kind` off. */
export async function wantingMail(db: Db, candidates: readonly TeamPerson[], kind: NotificationKind): Promise<TeamPerson[]> {
  if (candidates.length === 0) return [];
  const off = await db
    .select({ userId: notificationPrefs.userId })
    .from(notificationPrefs)
    .where(
      and(
        inArray(
          notificationPrefs.userId,
          candidates.map((c) => c.userId),
        ),
        eq(notificationPrefs.kind, kind),
        eq(notificationPrefs.enabled, false),
      ),
    );
  const muted = new Set(off.map((o) => o.userId));
  return candidates.filter((c) => !muted.has(c.userId));
}

/**
 * Puts one message in the outbox, in the caller's transaction (so it exists exactly when the
 * change does). The dedupe key names the event and the recipient: the same event never mails
 * the same person twice, however often it is enqueued.
 */
export async function enqueueMail(db: Db, m: { teamId: string; kind: string; to: string; content: MailContent; dedupeKey: string }): Promise<void> {
  const [row] = await db
    .insert(outbox)
    .values({ teamId: m.teamId, kind: m.kind, toEmail: m.to, subject: m.content.subject, text: m.content.text, html: m.content.html, dedupeKey: m.dedupeKey })
    .onConflictDoNothing({ target: outbox.dedupeKey })
    .returning({ id: outbox.id });
  // One delivery job per message, in the same transaction: one row, one job, one sender.
  if (row) await queueJob(db, "mail", row.id);
}
