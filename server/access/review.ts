import "server-only";
import { and, desc, eq } from "drizzle-orm";
import { dies, reviewEvents, users } from "@/db/schema";
import { type Actor, type Db } from "./context";
import { loadDie } from "./dies";
import type { DieDto } from "@/lib/dto/dies";
import { recordAudit } from "./audit";
import { enqueueMail, teamPeople, wantingMail } from "./notify";
import { ConflictError, ForbiddenError } from "@/lib/errors";
import { can } from "@/lib/auth/permissions";
import { nextReviewStatus, rightFor, transitionRefusal, type ReviewAction } from "@/lib/review/review-status";
import { reviewMail } from "@/lib/review/mail-templates";
import { inboxText } from "@/lib/review/inbox-text";
import { addInboxItems } from "./inbox";
import type { ReviewEventDto } from "@/lib/dto/review";

/** The die's review history, newest first (any member). */
export async function listReviewEvents(db: Db, actor: Actor, dieId: string): Promise<ReviewEventDto[]> {
  await loadDie(db, actor, dieId, "read");
  const rows = await db
    .select({ e: reviewEvents, actorName: users.name })
    .from(reviewEvents)
    .leftJoin(users, eq(users.id, reviewEvents.actorId))
    .where(eq(reviewEvents.dieId, dieId))
    .orderBy(desc(reviewEvents.at), desc(reviewEvents.id));
  return rows.map(({ e, actorName }) => ({
    id: e.id,
    action: e.action,
    fromStatus: e.fromStatus,
    toStatus: e.toStatus,
    message: e.message,
    actorId: e.actorId,
    actorName,
    at: e.at.toISOString(),
  }));
}

/**
 * Moves a die through review. Submitting needs the edit right; approving or requesting
 * changes needs the decide right and is refused (403) to the die's own analyst, whatever
 * their role. A move the current status does not allow answers 409. The status change is one
 * UPDATE … WHERE review_status = from, so of two racing decisions one wins.
 */
export async function reviewDie(db: Db, actor: Actor, dieId: string, input: { action: ReviewAction; message: string }, origin: string): Promise<DieDto> {
  await db.transaction(async (tx) => {
    const { row, teamId, role } = await loadDie(tx, actor, dieId, "read");
    const right = rightFor(input.action);
    if (!can(role, right)) {
      throw new ForbiddenError(
        right === "edit" ? `A ${role} cannot submit a die for review in this team.` : `A ${role} cannot approve dies or request changes in this team.`,
      );
    }
    if (right === "decide" && row.analystId === actor.userId) {
      throw new ForbiddenError("You are this die's analyst, so someone else must approve it or request changes.");
    }
    const to = nextReviewStatus(row.reviewStatus, input.action);
    if (!to) throw new ConflictError(transitionRefusal(row.reviewStatus, input.action), { reviewStatus: row.reviewStatus });
    const [after] = await tx
      .update(dies)
      .set({ reviewStatus: to, updatedAt: new Date() })
      .where(and(eq(dies.id, dieId), eq(dies.reviewStatus, row.reviewStatus)))
      .returning();
    if (!after) throw new ConflictError("Someone else changed this die's review status first; reload to see it.");
    const [ev] = await tx
      .insert(reviewEvents)
      .values({ dieId, actorId: actor.userId, action: input.action, fromStatus: row.reviewStatus, toStatus: to, message: input.message })
      .returning();
    await recordAudit(tx, actor, {
      teamId,
      action: `review.${input.action}`,
      entityType: "die",
      entityId: dieId,
      dieId,
      before: { reviewStatus: row.reviewStatus },
      after: { reviewStatus: to, message: input.message },
    });
    await notifyReview(tx, actor, {
      teamId,
      dieId,
      dieName: row.name,
      analystId: row.analystId,
      action: input.action,
      message: input.message,
      eventId: ev.id,
      origin,
    });
  });
  return (await loadDie(db, actor, dieId, "read")).dto;
}

async function notifyReview(
  db: Db,
  actor: Actor,
  p: { teamId: string; dieId: string; dieName: string; analystId: string | null; action: ReviewAction; message: string; eventId: string; origin: string },
) {
  const people = await teamPeople(db, p.teamId);
  const me = people.find((m) => m.userId === actor.userId)?.name ?? "Someone";
  const submit = p.action === "submit";
  const recipients = submit
    ? people.filter((m) => can(m.role, "decide") && m.userId !== actor.userId && m.userId !== p.analystId)
    : people.filter((m) => m.userId === p.analystId && m.userId !== actor.userId);
  const kind = submit ? "review_submitted" : "review_decision";
  const content = reviewMail({ action: p.action, actor: me, dieName: p.dieName, message: p.message, link: `${p.origin}/dies/${p.dieId}` });
  // The inbox gets every item whatever the mail settings: those choose mail only.
  const text = inboxText({ kind: "review", action: p.action, author: me, dieName: p.dieName, message: p.message });
  await addInboxItems(
    db,
    recipients.map((m) => ({ userId: m.userId, teamId: p.teamId, kind, dieId: p.dieId, text, dedupeKey: `${kind}:${p.eventId}:${m.userId}` })),
  );
  for (const m of await wantingMail(db, recipients, kind)) {
    await enqueueMail(db, { teamId: p.teamId, kind, to: m.email, content, dedupeKey: `${kind}:${p.eventId}:${m.userId}` });
  }
}
