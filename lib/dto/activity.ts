// Shapes of what the API answers; the server builds them, client components read them.

export type ActivityItem = {
  id: string;
  at: string;
  action: string;
  entityType: string;
  entityId: string | null;
  actorId: string | null;
  actorName: string | null;
  /** What the entry is about, in words (lib/review/activity-words.ts): the shape, micrograph or remark, and what was written. */
  detail: string;
};
