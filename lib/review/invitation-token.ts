import { createHash, randomBytes } from "node:crypto";

/** How long an invitation link stays valid. */
export const INVITATION_TTL_MS = 7 * 24 * 60 * 60 * 1000;

/** A new single-use token: 32 random bytes, URL-safe. Only its hash is stored. */
export function newInvitationToken(): string {
  return randomBytes(32).toString("base64url");
}

/** SHA-256 of the token (hex): the database never holds a token that would work as a link. */
export function hashInvitationToken(token: string): string {
  return createHash("sha256").update(token, "utf8").digest("hex");
}

export type InvitationState = "pending" | "accepted" | "declined" | "revoked" | "expired";

/** Where an invitation stands at `now`. */
export function invitationState(
  inv: { acceptedAt: Date | null; declinedAt?: Date | null; revokedAt: Date | null; expiresAt: Date },
  now: Date,
): InvitationState {
  if (inv.acceptedAt) return "accepted";
  if (inv.declinedAt) return "declined";
  if (inv.revokedAt) return "revoked";
  return inv.expiresAt.getTime() <= now.getTime() ? "expired" : "pending";
}
