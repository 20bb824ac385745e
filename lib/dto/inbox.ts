// Shapes of what the API answers; the server builds them, client components read them.

export type InboxKind = "mention" | "comment" | "review_submitted" | "review_decision";

export type InboxItemDto = { id: string; kind: InboxKind; dieId: string; threadId?: string; text: string; createdAt: string; readAt: string | null };
