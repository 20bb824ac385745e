// Shapes of what the API answers; the server builds them, client components read them.
import type { OutboxStatus } from "@/lib/dto/stored-values";

export type OutboxItemDto = {
  id: string;
  kind: string;
  toEmail: string;
  subject: string;
  status: OutboxStatus;
  attempts: number;
  lastError: string | null;
  nextAttemptAt: string;
  sentAt: string | null;
  createdAt: string;
};
