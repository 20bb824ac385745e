import "server-only";
import bcrypt from "bcryptjs";
import { and, eq, gt, sql } from "drizzle-orm";
import { signInAttempts, users } from "../schema";
import type { Db } from "./context";

/** Sign-in refuses after this many failures for one e-mail inside the window. */
export const MAX_FAILED_SIGN_INS = 10;
export const SIGN_IN_WINDOW_MS = 15 * 60 * 1000;

export type SignInResult =
  | { ok: true; user: { id: string; email: string; name: string } }
  | { ok: false; reason: "invalid" }
  | { ok: false; reason: "locked"; retryInMinutes: number };

/** Looks a user up by e-mail, case-insensitively. */
export async function findUserByEmail(db: Db, email: string) {
  const [row] = await db.select().from(users).where(sql`lower(${users.email}) = ${email.trim().toLowerCase()}`);
  return row ?? null;
}

/**
 * Checks an e-mail and password. After MAX_FAILED_SIGN_INS failures in SIGN_IN_WINDOW_MS the
 * account refuses sign-in even with the right password until the oldest failure ages out.
 * Every attempt is recorded, for existing and unknown e-mails alike (no account probing).
 */
export async function authenticate(db: Db, email: string, password: string, now = new Date()): Promise<SignInResult> {
  const key = email.trim().toLowerCase();
  const since = new Date(now.getTime() - SIGN_IN_WINDOW_MS);
  const failures = await db
    .select({ at: signInAttempts.at })
    .from(signInAttempts)
    .where(and(eq(signInAttempts.email, key), eq(signInAttempts.succeeded, false), gt(signInAttempts.at, since)))
    .orderBy(signInAttempts.at);
  if (failures.length >= MAX_FAILED_SIGN_INS) {
    const unlockAt = failures[failures.length - MAX_FAILED_SIGN_INS].at.getTime() + SIGN_IN_WINDOW_MS;
    return { ok: false, reason: "locked", retryInMinutes: Math.max(1, Math.ceil((unlockAt - now.getTime()) / 60_000)) };
  }
  const user = await findUserByEmail(db, key);
  // An unknown e-mail is compared against a dummy hash of the same cost, so the answer takes
  // as long as for a real account and its timing does not reveal which e-mails exist.
  const hash = user?.passwordHash ?? (await dummyHash());
  const matches = await bcrypt.compare(password, hash);
  const ok = !!user?.passwordHash && matches;
  await db.insert(signInAttempts).values({ email: key, succeeded: ok, at: now });
  if (!ok || !user) return { ok: false, reason: "invalid" };
  return { ok: true, user: { id: user.id, email: user.email, name: user.name } };
}

let dummy: Promise<string> | null = null;
function dummyHash(): Promise<string> {
  dummy ??= hashPassword(`unknown-account-${Math.random()}`);
  return dummy;
}

/** bcrypt hash for a new password (cost 10: about 70 ms here). */
export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, 10);
}
