// Shapes of what the API answers; the server builds them, client components read them.
import type { ReviewStatus } from "@/lib/dto/stored-values";
import type { TeamRole } from "@/lib/auth/permissions";

export type DieDto = {
  id: string;
  caseId: string;
  caseTitle: string;
  teamId: string;
  name: string;
  widthUm: number | null;
  heightUm: number | null;
  notes: string;
  analystId: string | null;
  analystName: string | null;
  reviewStatus: ReviewStatus;
  /** The revision being drawn, checked or (when signed off) the last one frozen. */
  revision: number;
  yourRole: TeamRole;
  createdAt: string;
  updatedAt: string;
};
