import "server-only";
import { and, desc, eq, sql } from "drizzle-orm";
import { dies, reviewEvents, threads, users } from "@/db/schema";
import { type Actor, type Db } from "./context";
import { loadDie } from "./dies";
import type { DieDto } from "@/lib/dto/dies";
import { recordAudit } from "./audit";
import { enqueueMail, teamPeople, wantingMail } from "./notify";
import { BadRequestError, ConflictError, ForbiddenError } from "@/lib/errors";
import { can } from "@/lib/auth/permissions";
import { nextReviewStatus, rightFor, transitionRefusal, type ReviewAction } from "@/lib/review/review-status";
import type { ReviewActionInput } from "@/lib/validation/review";
import { freezeRevision } from "./revisions";
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
    revision: e.revision,
    overrideOpenRemarks: e.overrideOpenRemarks,
    actorId: e.actorId,
    actorName,
    at: e.at.toISOString(),
  }));
}

/**
 * Moves a die through its check. Sending and withdrawing need the edit right (and only the
 * sender withdraws); signing off and returning need the decide right and are refused (403) to
 * the die's own analyst, whatever their role. A move the status does not allow answers 409, as
 * does a sign-off while remarks are open unless `overrideOpenRemarks` comes with a message.
 * Signing off freezes the revision. The status change is one UPDATE … WHERE review_status =
 * from, so of two racing decisions one wins.
 */
export async function reviewDie(db: Db, actor: Actor, dieId: string, input: ReviewActionInput, origin: string): Promise<DieDto> {
  await db.transaction(async (tx) => {
    const { row, teamId, role } = await loadDie(tx, actor, dieId, "read");
    const right = rightFor(input.action);
    if (!can(role, right)) {
      throw new ForbiddenError(
        right === "edit" ? `A ${role} cannot send dies to the checker in this team.` : `A ${role} cannot sign off dies or return them in this team.`,
      );
    }
    if (right === "decide" && row.analystId === actor.userId) {
      throw new ForbiddenError("You are this die's analyst, so someone else must sign it off or return it.");
    }
    const to = nextReviewStatus(row.reviewStatus, input.action);
    if (!to) throw new ConflictError(transitionRefusal(row.reviewStatus, input.action), { reviewStatus: row.reviewStatus });
    if (input.action === "withdraw") await assertSender(tx, actor, dieId);
    const override = input.action === "sign_off" ? await checkOpenRemarks(tx, dieId, input) : false;
    const [after] = await tx
      .update(dies)
      .set({ reviewStatus: to, updatedAt: new Date() })
      .where(and(eq(dies.id, dieId), eq(dies.reviewStatus, row.reviewStatus)))
      .returning();
    if (!after) throw new ConflictError("Someone else changed this die's check status first; reload to see it.");
    const [ev] = await tx
      .insert(reviewEvents)
      .values({
        dieId,
        actorId: actor.userId,
        action: input.action,
        fromStatus: row.reviewStatus,
        toStatus: to,
        message: input.message,
        revision: row.revision,
        overrideOpenRemarks: override,
      })
      .returning();
    if (input.action === "sign_off") {
      const [me] = await tx.select({ name: users.name }).from(users).where(eq(users.id, actor.userId));
      await freezeRevision(tx, after, { id: actor.userId, name: me?.name ?? "Someone" }, ev.at, override);
    }
    await recordAudit(tx, actor, {
      teamId,
      action: `review.${input.action}`,
      entityType: "die",
      entityId: dieId,
      dieId,
      before: { reviewStatus: row.reviewStatus },
      after: { reviewStatus: to, message: input.message, revision: row.revision, ...(override ? { overrideOpenRemarks: true } : {}) },
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

/** Only whoever sent the die to the checker takes it back. */
async function assertSender(tx: Db, actor: Actor, dieId: string): Promise<void> {
  const [sent] = await tx
    .select({ actorId: reviewEvents.actorId, name: users.name })
    .from(reviewEvents)
    .leftJoin(users, eq(users.id, reviewEvents.actorId))
    .where(and(eq(reviewEvents.dieId, dieId), eq(reviewEvents.action, "send")))
    .orderBy(desc(reviewEvents.at), desc(reviewEvents.id))
    .limit(1);
  if (sent && sent.actorId !== actor.userId)
    throw new ForbiddenError(`Only ${sent.name ?? "the member who sent it"}, who sent this die to the checker, can withdraw it.`);
}

/** Open remarks block a sign-off, unless the signer overrides them and says why. Returns whether overridden. */
async function checkOpenRemarks(tx: Db, dieId: string, input: ReviewActionInput): Promise<boolean> {
  const [{ n }] = await tx
    .select({ n: sql<number>`count(*)::int` })
    .from(threads)
    .where(and(eq(threads.dieId, dieId), eq(threads.status, "open")));
  if (n === 0) return false;
  const remarks = n === 1 ? "1 remark is" : `${n} remarks are`;
  if (!input.overrideOpenRemarks) {
    throw new ConflictError(`${remarks} still open: close ${n === 1 ? "it" : "them"} first, or sign off over them with a message saying why.`, {
      openRemarks: n,
    });
  }
  if (!input.message.trim()) throw new BadRequestError(`message: say why you sign off while ${remarks} still open.`);
  return true;
}

async function notifyReview(
  db: Db,
  actor: Actor,
  p: { teamId: string; dieId: string; dieName: string; analystId: string | null; action: ReviewAction; message: string; eventId: string; origin: string },
) {
  const people = await teamPeople(db, p.teamId);
  const me = people.find((m) => m.userId === actor.userId)?.name ?? "Someone";
  // Sending and withdrawing concern the checkers; a sign-off or return concerns the analyst.
  const submit = p.action === "send" || p.action === "withdraw";
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
