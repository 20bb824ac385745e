// How the tables hang together, for Drizzle's relational queries (`db.query.dies.findFirst({
// with: { micrographs: true } })`): the ownership tree team → case → die → micrographs, markup,
// threads → comments → mentions, and who belongs to which team. The foreign keys themselves
// are in the table definitions; these declarations add no constraint.
import { relations } from "drizzle-orm";
import { memberships, teams, users } from "./people";
import { cases, dies, markup, micrographs } from "./dies";
import { commentMentions, comments, reviewEvents, threads } from "./review";
import { exports } from "./work";

export const teamRelations = relations(teams, ({ many }) => ({ memberships: many(memberships), cases: many(cases) }));

export const userRelations = relations(users, ({ many }) => ({ memberships: many(memberships) }));

export const membershipRelations = relations(memberships, ({ one }) => ({
  team: one(teams, { fields: [memberships.teamId], references: [teams.id] }),
  user: one(users, { fields: [memberships.userId], references: [users.id] }),
}));

export const caseRelations = relations(cases, ({ one, many }) => ({
  team: one(teams, { fields: [cases.teamId], references: [teams.id] }),
  dies: many(dies),
}));

export const dieRelations = relations(dies, ({ one, many }) => ({
  case: one(cases, { fields: [dies.caseId], references: [cases.id] }),
  micrographs: many(micrographs),
  markup: many(markup),
  threads: many(threads),
  reviewEvents: many(reviewEvents),
  exports: many(exports),
}));

export const micrographRelations = relations(micrographs, ({ one }) => ({ die: one(dies, { fields: [micrographs.dieId], references: [dies.id] }) }));

export const markupRelations = relations(markup, ({ one }) => ({ die: one(dies, { fields: [markup.dieId], references: [dies.id] }) }));

export const threadRelations = relations(threads, ({ one, many }) => ({
  die: one(dies, { fields: [threads.dieId], references: [dies.id] }),
  comments: many(comments),
}));

export const commentRelations = relations(comments, ({ one, many }) => ({
  thread: one(threads, { fields: [comments.threadId], references: [threads.id] }),
  mentions: many(commentMentions),
}));

export const mentionRelations = relations(commentMentions, ({ one }) => ({
  comment: one(comments, { fields: [commentMentions.commentId], references: [comments.id] }),
  user: one(users, { fields: [commentMentions.userId], references: [users.id] }),
}));

export const reviewEventRelations = relations(reviewEvents, ({ one }) => ({ die: one(dies, { fields: [reviewEvents.dieId], references: [dies.id] }) }));

export const exportRelations = relations(exports, ({ one }) => ({ die: one(dies, { fields: [exports.dieId], references: [dies.id] }) }));
