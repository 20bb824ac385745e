import { describe, it, expect } from "vitest";
import { hashInvitationToken, invitationState, newInvitationToken, INVITATION_TTL_MS } from "./invitation-token";

describe("hashInvitationToken", () => {
  it("is SHA-256 in hex", () => {
    // FIPS 180-2, Appendix B.1: SHA-256("abc").
    expect(hashInvitationToken("abc")).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  });

  it("makes 256-bit URL-safe tokens that differ each time", () => {
    const a = newInvitationToken();
    expect(a).toMatch(/^[A-Za-z0-9_-]{43}$/);
    expect(newInvitationToken()).not.toBe(a);
  });
});

describe("invitationState", () => {
  const now = new Date("2025-03-01T12:00:00Z");
  it("expires seven days after it was made", () => {
    expect(INVITATION_TTL_MS).toBe(7 * 86_400_000);
    const made = new Date(now.getTime() - INVITATION_TTL_MS);
    expect(invitationState({ acceptedAt: null, revokedAt: null, expiresAt: new Date(made.getTime() + INVITATION_TTL_MS) }, now)).toBe("expired");
    expect(invitationState({ acceptedAt: null, revokedAt: null, expiresAt: new Date(now.getTime() + 1) }, now)).toBe("pending");
  });

  it("reports accepted before revoked", () => {
    expect(invitationState({ acceptedAt: now, revokedAt: now, expiresAt: now }, now)).toBe("accepted");
    expect(invitationState({ acceptedAt: null, revokedAt: now, expiresAt: new Date(now.getTime() + 1) }, now)).toBe("revoked");
    expect(invitationState({ acceptedAt: null, declinedAt: now, revokedAt: null, expiresAt: new Date(now.getTime() + 1) }, now)).toBe("declined");
  });
});
