import "server-only";
import { and, eq } from "drizzle-orm";
import { auditEvents, cases, dies, reviewEvents, users } from "@/db/schema";
import type { Database } from "@/db/client";
import { DEMO } from "@/db/seed";
import { freezeRevision } from "./access/revisions";

/**
 * Checks and signs off the demo's die B as revision 1: sent by Demo Analyst, signed off by
 * Demo Reviewer (its one remark is already closed), frozen like any sign-off. Runs after the
 * demo micrographs are placed, so the frozen die frame names die B's reference micrograph. Does
 * nothing once die B has any check history, so a restart never repeats it.
 */
export async function signOffDemoDieB(db: Database): Promise<boolean> {
  const [found] = await db
    .select({ die: dies, teamId: cases.teamId })
    .from(dies)
    .innerJoin(cases, eq(cases.id, dies.caseId))
    .where(and(eq(dies.name, DEMO.dieB.name), eq(cases.title, DEMO.case.title)));
  if (!found || found.die.reviewStatus !== "draft") return false;
  const [history] = await db.select({ id: reviewEvents.id }).from(reviewEvents).where(eq(reviewEvents.dieId, found.die.id)).limit(1);
  if (history) return false;
  const people = await db.select({ id: users.id, email: users.email, name: users.name }).from(users);
  const analyst = people.find((p) => p.email === DEMO.users[1].email)!;
  const reviewer = people.find((p) => p.email === DEMO.users[2].email)!;
  const sentAt = new Date();
  const signedAt = new Date(sentAt.getTime() + 1000);
  await db.transaction(async (tx) => {
    const [after] = await tx.update(dies).set({ reviewStatus: "signed_off", updatedAt: signedAt }).where(eq(dies.id, found.die.id)).returning();
    await tx.insert(reviewEvents).values([
      {
        dieId: after.id,
        actorId: analyst.id,
        action: "send",
        fromStatus: "draft",
        toStatus: "with_checker",
        message: "All 22 pads, bonds, stages, axis, meanders and rulers marked from the layout.",
        at: sentAt,
      },
      {
        dieId: after.id,
        actorId: reviewer.id,
        action: "sign_off",
        fromStatus: "with_checker",
        toStatus: "signed_off",
        message: "Checked against the bond diagram; the G5 remark is answered.",
        at: signedAt,
      },
    ]);
    for (const [who, action, at] of [
      [analyst.id, "review.send", sentAt],
      [reviewer.id, "review.sign_off", signedAt],
    ] as const) {
      await tx.insert(auditEvents).values({ teamId: found.teamId, actorId: who, action, entityType: "die", entityId: after.id, dieId: after.id, at });
    }
    await freezeRevision(tx, after, reviewer, signedAt, false);
  });
  return true;
}
