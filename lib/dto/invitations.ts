// Shapes of what the API answers; the server builds them, client components read them.
import type { TeamRole } from "@/lib/auth/permissions";

export type InvitationDto = { id: string; email: string; role: TeamRole; invitedBy: string | null; expiresAt: string; createdAt: string };

export type MyInvitationDto = {
  id: string;
  teamId: string;
  teamName: string;
  role: TeamRole;
  invitedBy: { id: string; name: string } | null;
  expiresAt: string;
  createdAt: string;
};
