// Shapes of what the API answers; the server builds them, client components read them.

export type ActivityItem = {
  id: string;
  at: string;
  action: string;
  entityType: string;
  entityId: string | null;
  actorId: string | null;
  actorName: string | null;
  /** A short plain-text detail (a comment's first line, a shape's kind, a review message). */
  detail: string;
};
