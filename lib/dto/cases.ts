// Shapes of what the API answers; the server builds them, client components read them.
import type { TeamRole } from "@/lib/auth/permissions";

export type CaseDto = {
  id: string;
  teamId: string;
  teamName: string;
  title: string;
  partMarking: string;
  package: string;
  sampleId: string;
  notes: string;
  dieCount: number;
  yourRole: TeamRole;
  createdBy: string | null;
  createdAt: string;
  updatedAt: string;
};
