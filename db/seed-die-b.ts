import "server-only";
import { eq } from "drizzle-orm";
import { auditEvents, comments, dies, markup, threads } from "./schema";
import type { Database } from "./client";
import { NV24R_LAYOUT } from "@/lib/demo-die/layout";
import { DIE_B_DATE_CODE, withDateCode } from "@/lib/demo-die/date-code";
import { layoutMarkup } from "@/lib/demo-die/layout-markup";
import { newShapeSchema } from "@/lib/validation/markup";

/** A transaction of the demo seed (or the database itself). */
type Tx = Database | Parameters<Parameters<Database["transaction"]>[0]>[0];

/** The second demo die: the same invented part from a later lot, read completely. */
export const DEMO_DIE_B = {
  name: "NV-24R die B",
  widthUm: 2400,
  heightUm: 1600,
  notes: `Second sample of the same part, date code ${DIE_B_DATE_CODE} on the die. Fully marked from the layout: pads, bonds, stages, axis, lines and rulers.`,
} as const;

/** The remark on die B: raised by the reviewer on pad G5, answered by the analyst and closed. */
const REMARK = {
  pad: "G5",
  question: "G5 carries a probe scrub but no wire, while the other grounds are bonded. Is it really left open in this lot, or was a bond lifted?",
  answer:
    "No wire was ever placed: the pad shows no ball and no bond remains, only the probe scrub near its inner edge. " +
    "Marked probed by hand; G4 and G6 ground the IF side.",
} as const;

export type DieBRefs = {
  readonly teamId: string;
  readonly caseId: string;
  readonly analystId: string;
  readonly reviewerId: string;
  /** Creation time of die A: die B and its rows come just after, so die A stays first in the case. */
  readonly after: Date;
};

const at = (base: Date, ms: number) => new Date(base.getTime() + ms);

/**
 * Seeds die B of the demo case in the caller's transaction: the die, its complete markup (each
 * shape checked by the API's own schema, one audit event each, as the analyst drew it) and one
 * resolved remark thread. Leaves its review status at the default; returns the die id, where
 * the review history (submission, sign-off) can be added on top.
 */
export async function seedDieB(tx: Tx, refs: DieBRefs): Promise<string> {
  const created = at(refs.after, 1);
  const [die] = await tx
    .insert(dies)
    .values({ ...DEMO_DIE_B, caseId: refs.caseId, analystId: refs.analystId, createdBy: refs.analystId, createdAt: created, updatedAt: created })
    .returning();
  const shapes = layoutMarkup(withDateCode(NV24R_LAYOUT, DIE_B_DATE_CODE)).map((s) => newShapeSchema.parse(s));
  const rows = await tx
    .insert(markup)
    .values(
      shapes.map((s) => ({
        id: s.id,
        dieId: die.id,
        kind: s.kind,
        geometry: s.geometry,
        properties: s.properties,
        createdBy: refs.analystId,
        updatedBy: refs.analystId,
        createdAt: created,
        updatedAt: created,
      })),
    )
    .returning();
  const event = (action: string, entityType: string, entityId: string, after: unknown, actorId: string, when: Date, before: unknown = null) => ({
    teamId: refs.teamId,
    actorId,
    action,
    entityType,
    entityId,
    dieId: die.id,
    before: JSON.parse(JSON.stringify(before)),
    after: JSON.parse(JSON.stringify(after)),
    at: when,
  });
  const pad = rows.find((r) => r.kind === "pad" && (r.properties as { label?: string }).label === REMARK.pad)!;
  const raised = at(refs.after, 2);
  const answered = at(refs.after, 3);
  const [opened] = await tx
    .insert(threads)
    .values({ dieId: die.id, shapeId: pad.id, anchor: pad.geometry, createdBy: refs.reviewerId, createdAt: raised, updatedAt: raised })
    .returning();
  const [question, answer] = await tx
    .insert(comments)
    .values([
      { threadId: opened.id, authorId: refs.reviewerId, body: REMARK.question, createdAt: raised },
      { threadId: opened.id, authorId: refs.analystId, body: REMARK.answer, createdAt: answered },
    ])
    .returning();
  const [resolved] = await tx
    .update(threads)
    .set({ status: "resolved", resolvedBy: refs.analystId, resolvedAt: answered, updatedAt: answered })
    .where(eq(threads.id, opened.id))
    .returning();
  await tx
    .insert(auditEvents)
    .values([
      event("die.created", "die", die.id, die, refs.analystId, created),
      ...rows.map((r) => event("markup.created", "markup", r.id, r, refs.analystId, created)),
      event("thread.created", "thread", opened.id, opened, refs.reviewerId, raised),
      event("comment.created", "comment", question.id, { ...question, mentions: [] }, refs.reviewerId, raised),
      event("comment.created", "comment", answer.id, { ...answer, mentions: [] }, refs.analystId, answered),
      event("thread.resolved", "thread", opened.id, resolved, refs.analystId, answered, opened),
    ]);
  return die.id;
}
