// What the local mailbox page lists: messages the embedded mail server stored.

export type MailboxEntry = {
  id: string;
  file: string;
  subject: string;
  from: string;
  to: string;
  date: string;
  teamId: string | null;
  messageId: string | null;
};

export type StoredMessage = MailboxEntry & { text: string; html: string | null };
