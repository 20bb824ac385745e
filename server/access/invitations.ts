import "server-only";
import { and, desc, eq, gt, isNull, sql } from "drizzle-orm";
import { invitations, memberships, teams, users, type InvitationRow } from "@/db/schema";
import { authorize, type Actor, type Db } from "./context";
import { recordAudit } from "./audit";
import { enqueueMail } from "./notify";
import { findUserByEmail } from "./users";
import { hashPassword } from "@/lib/auth/password";
import { AppError, BadRequestError, ConflictError, NotFoundError } from "@/lib/errors";
import { hashInvitationToken, invitationState, newInvitationToken, type InvitationState } from "@/lib/review/invitation-token";
import { invitationMail } from "@/lib/review/mail-templates";
import { ROLE_LABELS, type TeamRole } from "@/lib/auth/permissions";
import { env } from "@/server/env";
import type { InvitationDto, MyInvitationDto } from "@/lib/dto/invitations";

const toDto = (r: InvitationRow): InvitationDto => ({
  id: r.id,
  email: r.email,
  role: r.role,
  invitedBy: r.invitedBy,
  expiresAt: r.expiresAt.toISOString(),
  createdAt: r.createdAt.toISOString(),
});

const pending = (now: Date) =>
  and(isNull(invitations.acceptedAt), isNull(invitations.declinedAt), isNull(invitations.revokedAt), gt(invitations.expiresAt, now));

/** Invites someone by e-mail with a role (owner only); the link goes out by mail only. */
export async function createInvitation(db: Db, actor: Actor, teamId: string, input: { email: string; role: TeamRole }, origin: string): Promise<InvitationDto> {
  return db.transaction(async (tx) => {
    await authorize(tx, actor, teamId, "manage_team", "That team");
    const existing = await findUserByEmail(tx, input.email);
    if (existing) {
      const [member] = await tx
        .select()
        .from(memberships)
        .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, existing.id)));
      if (member) throw new ConflictError(`${input.email} is already a member of this team.`);
    }
    const now = new Date();
    // A new invitation replaces an earlier pending one to the same address.
    await tx
      .update(invitations)
      .set({ revokedAt: now })
      .where(and(eq(invitations.teamId, teamId), sql`lower(${invitations.email}) = ${input.email}`, pending(now)));
    const token = newInvitationToken();
    const expiresAt = new Date(now.getTime() + env().KERFLINE_INVITATION_TTL_SECONDS * 1000);
    const [row] = await tx
      .insert(invitations)
      .values({ teamId, email: input.email, role: input.role, tokenHash: hashInvitationToken(token), invitedBy: actor.userId, expiresAt })
      .returning();
    const [team] = await tx.select({ name: teams.name }).from(teams).where(eq(teams.id, teamId));
    const [me] = await tx.select({ name: users.name }).from(users).where(eq(users.id, actor.userId));
    const content = invitationMail({
      inviter: me?.name ?? "A team owner",
      teamName: team.name,
      role: ROLE_LABELS[input.role].toLowerCase(),
      link: `${origin}/invitations/${token}`,
      expiresAt,
    });
    await enqueueMail(tx, { teamId, kind: "invitation", to: input.email, content, dedupeKey: `invitation:${row.id}` });
    await recordAudit(tx, actor, { teamId, action: "invitation.created", entityType: "invitation", entityId: row.id, after: toDto(row) });
    return toDto(row);
  });
}

/** Pending invitations of a team, newest first (owner only). */
export async function listInvitations(db: Db, actor: Actor, teamId: string): Promise<InvitationDto[]> {
  await authorize(db, actor, teamId, "manage_team", "That team");
  const rows = await db
    .select()
    .from(invitations)
    .where(and(eq(invitations.teamId, teamId), pending(new Date())))
    .orderBy(desc(invitations.createdAt));
  return rows.map(toDto);
}

/** Revokes a pending invitation (owner only); its link stops working at once. */
export async function revokeInvitation(db: Db, actor: Actor, teamId: string, invitationId: string): Promise<void> {
  await db.transaction(async (tx) => {
    await authorize(tx, actor, teamId, "manage_team", "That team");
    const [row] = await tx
      .update(invitations)
      .set({ revokedAt: new Date() })
      .where(and(eq(invitations.id, invitationId), eq(invitations.teamId, teamId), pending(new Date())))
      .returning();
    if (!row) throw new NotFoundError("That pending invitation");
    await recordAudit(tx, actor, { teamId, action: "invitation.revoked", entityType: "invitation", entityId: row.id, before: toDto(row) });
  });
}

export type InvitationView = {
  id: string;
  state: InvitationState;
  teamName: string;
  email: string;
  role: TeamRole;
  inviterName: string | null;
  accountExists: boolean;
};

/** What the invitation page shows for a token (no sign-in needed: the token is the proof). */
export async function viewInvitation(db: Db, token: string): Promise<InvitationView> {
  const [row] = await db
    .select({ inv: invitations, teamName: teams.name, inviterName: users.name })
    .from(invitations)
    .innerJoin(teams, eq(teams.id, invitations.teamId))
    .leftJoin(users, eq(users.id, invitations.invitedBy))
    .where(eq(invitations.tokenHash, hashInvitationToken(token)));
  if (!row) throw new NotFoundError("That invitation");
  return {
    id: row.inv.id,
    state: invitationState(row.inv, new Date()),
    teamName: row.teamName,
    email: row.inv.email,
    role: row.inv.role,
    inviterName: row.inviterName,
    accountExists: !!(await findUserByEmail(db, row.inv.email)),
  };
}

const GONE: Record<Exclude<InvitationState, "pending">, string> = {
  accepted: "This invitation link has already been used.",
  declined: "This invitation was declined.",
  revoked: "This invitation was revoked by the team's owner.",
  expired: "This invitation has expired; ask the team's owner for a new one.",
};

async function join(db: Db, inv: InvitationRow, userId: string) {
  await db.insert(memberships).values({ teamId: inv.teamId, userId, role: inv.role }).onConflictDoNothing();
  await recordAudit(
    db,
    { userId },
    { teamId: inv.teamId, action: "invitation.accepted", entityType: "invitation", entityId: inv.id, after: { userId, role: inv.role } },
  );
}

/**
 * Accepts an invitation once: a new person sets name and password; someone with an account
 * must be signed in as the invited address. Claiming is one UPDATE … WHERE not used, so two
 * uses of the same link cannot both succeed.
 */
export async function acceptInvitation(
  db: Db,
  caller: Actor | null,
  input: { token: string; name?: string; password?: string },
): Promise<{ teamId: string; email: string }> {
  return db.transaction(async (tx) => {
    const hash = hashInvitationToken(input.token);
    const [found] = await tx.select().from(invitations).where(eq(invitations.tokenHash, hash));
    if (!found) throw new NotFoundError("That invitation");
    const state = invitationState(found, new Date());
    if (state !== "pending") throw new AppError(410, GONE[state]);
    const existing = await findUserByEmail(tx, found.email);
    if (existing && caller?.userId !== existing.id)
      throw new ConflictError(`An account for ${found.email} already exists: sign in with it to accept or decline the invitation.`);
    if (!existing && (!input.name || !input.password)) throw new BadRequestError("Invalid body: name and password are required to create your account.");
    const userId =
      existing?.id ??
      (
        await tx
          .insert(users)
          .values({ email: found.email, name: input.name!, passwordHash: await hashPassword(input.password!) })
          .returning()
      )[0].id;
    const [claimed] = await tx
      .update(invitations)
      .set({ acceptedAt: new Date(), acceptedBy: userId })
      .where(and(eq(invitations.id, found.id), pending(new Date())))
      .returning();
    if (!claimed) throw new AppError(410, GONE.accepted);
    await join(tx, claimed, userId);
    return { teamId: claimed.teamId, email: claimed.email };
  });
}

const toAddress = (email: string) => sql`lower(${invitations.email}) = ${email.trim().toLowerCase()}`;

async function myAddress(db: Db, actor: Actor): Promise<string> {
  const [me] = await db.select({ email: users.email }).from(users).where(eq(users.id, actor.userId));
  if (!me) throw new NotFoundError("Your account");
  return me.email;
}

/**
 * Pending invitations to the caller's address, newest first, with team, role and inviter: an
 * existing user is asked, and joins nothing until they accept.
 */
export async function listMyInvitations(db: Db, actor: Actor): Promise<MyInvitationDto[]> {
  const email = await myAddress(db, actor);
  const rows = await db
    .select({ inv: invitations, teamName: teams.name, inviterName: users.name })
    .from(invitations)
    .innerJoin(teams, eq(teams.id, invitations.teamId))
    .leftJoin(users, eq(users.id, invitations.invitedBy))
    .where(and(toAddress(email), pending(new Date())))
    .orderBy(desc(invitations.createdAt));
  return rows.map(({ inv, teamName, inviterName }) => ({
    id: inv.id,
    teamId: inv.teamId,
    teamName,
    role: inv.role,
    invitedBy: inv.invitedBy && inviterName ? { id: inv.invitedBy, name: inviterName } : null,
    expiresAt: inv.expiresAt.toISOString(),
    createdAt: inv.createdAt.toISOString(),
  }));
}

/**
 * Answers one of the caller's own pending invitations. Accepting joins the team with the
 * invited role; declining closes the invitation (the owner may invite again). 404 for an
 * invitation to another address, 410 when it is no longer pending. One UPDATE … WHERE pending,
 * so two answers to the same invitation cannot both count.
 */
export async function answerMyInvitation(
  db: Db,
  actor: Actor,
  invitationId: string,
  answer: "accept" | "decline",
): Promise<{ teamId: string; joined: boolean }> {
  return db.transaction(async (tx) => {
    const email = await myAddress(tx, actor);
    const [found] = await tx
      .select()
      .from(invitations)
      .where(and(eq(invitations.id, invitationId), toAddress(email)));
    if (!found) throw new NotFoundError("That invitation");
    const state = invitationState(found, new Date());
    if (state !== "pending") throw new AppError(410, GONE[state]);
    const now = new Date();
    const set = answer === "accept" ? { acceptedAt: now, acceptedBy: actor.userId } : { declinedAt: now };
    const [claimed] = await tx
      .update(invitations)
      .set(set)
      .where(and(eq(invitations.id, found.id), pending(now)))
      .returning();
    if (!claimed) throw new AppError(410, "This invitation was answered already.");
    if (answer === "accept") {
      await join(tx, claimed, actor.userId);
    } else {
      await recordAudit(tx, actor, {
        teamId: claimed.teamId,
        action: "invitation.declined",
        entityType: "invitation",
        entityId: claimed.id,
        after: { userId: actor.userId },
      });
    }
    return { teamId: claimed.teamId, joined: answer === "accept" };
  });
}
