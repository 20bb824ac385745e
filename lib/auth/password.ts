import bcrypt from "bcryptjs";

/** bcrypt with cost 10 (OWASP Password Storage Cheat Sheet: at least 10 — common practice). */
export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, 10);
}

/** Whether a password matches a stored bcrypt hash. */
export function checkPassword(password: string, hash: string): Promise<boolean> {
  return bcrypt.compare(password, hash);
}
