import "server-only";
import { and, eq, gt, notInArray, sql } from "drizzle-orm";
import { KNOWN_ADDRESS_MS, SIGN_IN_WINDOW_MS, signInGate } from "@/lib/auth/sign-in-limit";
import { signInAttempts, users } from "@/db/schema";
import type { Actor, Db } from "./context";
import { endSessions } from "./sessions";
import { checkPassword, hashPassword } from "@/lib/auth/password";
import { BadRequestError, NotFoundError } from "@/lib/errors";

export type SignInResult =
  | { ok: true; user: { id: string; email: string; name: string; sessionVersion: number } }
  | { ok: false; reason: "invalid" }
  | { ok: false; reason: "locked"; retryInMinutes: number };

/** A user's name as shown to others, or null for an unknown id. */
export async function userDisplayName(db: Db, userId: string): Promise<string | null> {
  const [row] = await db.select({ name: users.name }).from(users).where(eq(users.id, userId));
  return row?.name ?? null;
}

/** Looks a user up by e-mail, case-insensitively. */
export async function findUserByEmail(db: Db, email: string) {
  const [row] = await db
    .select()
    .from(users)
    .where(sql`lower(${users.email}) = ${email.trim().toLowerCase()}`);
  return row ?? null;
}

const times = (rows: { at: Date }[]) => rows.map((r) => r.at.getTime());

/**
 * Counts the failures that limit this attempt and, when it may go ahead, records it as a
 * failure — in one transaction holding advisory locks on the account and on the address, so
 * parallel attempts are counted one after another and each sees those before it.
 */
async function admitAttempt(db: Db, key: string, address: string, now: Date): Promise<{ attemptId: string } | { retryInMinutes: number }> {
  return db.transaction(async (tx) => {
    // Always account first, then address: one order, so two attempts never wait on each other.
    await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${`sign-in:account:${key}`}))`);
    await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${`sign-in:address:${address}`}))`);
    const since = new Date(now.getTime() - SIGN_IN_WINDOW_MS);
    const failed = and(eq(signInAttempts.succeeded, false), gt(signInAttempts.at, since));
    // Addresses this account signed in from lately: failures from them do not count as unknown.
    const known = await tx
      .selectDistinct({ address: signInAttempts.address })
      .from(signInAttempts)
      .where(and(eq(signInAttempts.email, key), eq(signInAttempts.succeeded, true), gt(signInAttempts.at, new Date(now.getTime() - KNOWN_ADDRESS_MS))));
    const knownList = known.map((k) => k.address);
    const at = { at: signInAttempts.at };
    const pair = await tx
      .select(at)
      .from(signInAttempts)
      .where(and(eq(signInAttempts.email, key), eq(signInAttempts.address, address), failed))
      .orderBy(signInAttempts.at);
    const unknownOnly = knownList.length ? notInArray(signInAttempts.address, knownList) : undefined;
    const accountUnknown = await tx
      .select(at)
      .from(signInAttempts)
      .where(and(eq(signInAttempts.email, key), unknownOnly, failed))
      .orderBy(signInAttempts.at);
    const fromAddress = await tx
      .select(at)
      .from(signInAttempts)
      .where(and(eq(signInAttempts.address, address), failed))
      .orderBy(signInAttempts.at);
    const gate = signInGate(
      { pair: times(pair), accountUnknown: times(accountUnknown), address: times(fromAddress), knownAddress: knownList.includes(address) },
      now.getTime(),
    );
    if (!gate.allowed) return { retryInMinutes: gate.retryInMinutes };
    const [row] = await tx.insert(signInAttempts).values({ email: key, address, succeeded: false, at: now }).returning({ id: signInAttempts.id });
    return { attemptId: row.id };
  });
}

/**
 * Checks an e-mail and password under the limits of lib/auth/sign-in-limit.ts (per account and
 * address, per account from unknown addresses, per address). An attempt is recorded as a
 * failure before its password is checked and marked succeeded afterwards, so a burst of
 * parallel guesses cannot all be checked before the first is counted. Every attempt is
 * recorded, for existing and unknown e-mails alike (no account probing).
 */
export async function authenticate(db: Db, email: string, password: string, address = "", now = new Date()): Promise<SignInResult> {
  const key = email.trim().toLowerCase();
  const admitted = await admitAttempt(db, key, address, now);
  if ("retryInMinutes" in admitted) return { ok: false, reason: "locked", retryInMinutes: admitted.retryInMinutes };
  const user = await findUserByEmail(db, key);
  // An unknown e-mail is compared against a dummy hash of the same cost, so the answer takes
  // as long as for a real account and its timing does not reveal which e-mails exist.
  const hash = user?.passwordHash ?? (await dummyHash());
  const matches = await checkPassword(password, hash);
  if (!user?.passwordHash || !matches) return { ok: false, reason: "invalid" };
  await db.update(signInAttempts).set({ succeeded: true }).where(eq(signInAttempts.id, admitted.attemptId));
  return { ok: true, user: { id: user.id, email: user.email, name: user.name, sessionVersion: user.sessionVersion } };
}

/**
 * Changes the caller's password after checking the current one (400 when it does not match,
 * nothing changed), and ends every session of the account in the same transaction.
 */
export async function changePassword(db: Db, actor: Actor, input: { currentPassword: string; newPassword: string }): Promise<void> {
  const [user] = await db.select().from(users).where(eq(users.id, actor.userId));
  if (!user?.passwordHash) throw new NotFoundError("Your account");
  if (!(await checkPassword(input.currentPassword, user.passwordHash)))
    throw new BadRequestError("Invalid body: currentPassword does not match your password; nothing was changed.");
  if (input.currentPassword === input.newPassword) throw new BadRequestError("Invalid body: newPassword must differ from the current one.");
  const passwordHash = await hashPassword(input.newPassword);
  await db.transaction(async (tx) => {
    await tx.update(users).set({ passwordHash }).where(eq(users.id, actor.userId));
    await endSessions(tx, actor.userId);
  });
}

let dummy: Promise<string> | null = null;
function dummyHash(): Promise<string> {
  dummy ??= hashPassword(`unknown-account-${Math.random()}`);
  return dummy;
}
