// The database schema, by area. drizzle-kit reads this folder; code imports "@/db/schema".
export * from "./people";
export * from "./dies";
export * from "./review";
export * from "./work";
export * from "./revisions";
export * from "./sample";
export * from "./relations";

import type { auditEvents, exports, imageSearches } from "./work";
import type { cases, dies, markup, micrographs, reviewStatusEnum } from "./dies";
import type { comments, inboxItems, outbox, reviewEvents, threads } from "./review";
import type { dieRevisions } from "./revisions";
import type { caseSamples, custodyEvents } from "./sample";
import type { invitations, memberships, roleEnum, teams, users } from "./people";

export type User = typeof users.$inferSelect;
export type Team = typeof teams.$inferSelect;
export type Membership = typeof memberships.$inferSelect;
export type Role = (typeof roleEnum.enumValues)[number];
export type CaseRow = typeof cases.$inferSelect;
export type DieRow = typeof dies.$inferSelect;
export type ReviewStatus = (typeof reviewStatusEnum.enumValues)[number];
export type MicrographRow = typeof micrographs.$inferSelect;
export type AuditEvent = typeof auditEvents.$inferSelect;
export type ThreadRow = typeof threads.$inferSelect;
export type CommentRow = typeof comments.$inferSelect;
export type ReviewEventRow = typeof reviewEvents.$inferSelect;
export type InvitationRow = typeof invitations.$inferSelect;
export type OutboxRow = typeof outbox.$inferSelect;
export type ExportRow = typeof exports.$inferSelect;
export type ImageSearchRow = typeof imageSearches.$inferSelect;
export type MarkupRow = typeof markup.$inferSelect;
export type InboxItemRow = typeof inboxItems.$inferSelect;
export type DieRevisionRow = typeof dieRevisions.$inferSelect;
export type CaseSampleRow = typeof caseSamples.$inferSelect;
export type CustodyEventRow = typeof custodyEvents.$inferSelect;
