// Shapes of what the API answers; the server builds them, client components read them.
import type { TeamRole } from "@/lib/auth/permissions";

export type MeDto = {
  user: { id: string; email: string; name: string };
  teams: { id: string; name: string; role: TeamRole }[];
};

export type MemberDto = { userId: string; email: string; name: string; role: TeamRole; joinedAt: string };
