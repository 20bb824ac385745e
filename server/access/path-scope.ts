import "server-only";
import { eq } from "drizzle-orm";
import { cases, comments, dies, markup, micrographs, threads } from "@/db/schema";
import { authorize, type Actor, type Db } from "./context";
import { NotFoundError } from "@/lib/errors";

/**
 * The first gate of every request that carries a body: the thing its path names must exist
 * in one of the caller's teams, checked before the body is read, so an outsider gets 404
 * whatever they send and learns nothing from validation messages. The data-access function
 * the handler calls then checks the specific right (403) as always.
 */

type Lookup = { what: string; team: (db: Db, id: string) => Promise<string | undefined> };

const viaDie = (db: Db) => db.select({ teamId: cases.teamId }).from(dies).innerJoin(cases, eq(cases.id, dies.caseId));

// Most specific first: a path names its own item last (/teams/{teamId}/members/{userId} is the team's).
const LOOKUPS: [param: string, lookup: Lookup][] = [
  [
    "commentId",
    {
      what: "That comment",
      team: async (db, id) =>
        (await viaDie(db).innerJoin(threads, eq(threads.dieId, dies.id)).innerJoin(comments, eq(comments.threadId, threads.id)).where(eq(comments.id, id)))[0]
          ?.teamId,
    },
  ],
  [
    "threadId",
    { what: "That remark", team: async (db, id) => (await viaDie(db).innerJoin(threads, eq(threads.dieId, dies.id)).where(eq(threads.id, id)))[0]?.teamId },
  ],
  [
    "markupId",
    { what: "That shape", team: async (db, id) => (await viaDie(db).innerJoin(markup, eq(markup.dieId, dies.id)).where(eq(markup.id, id)))[0]?.teamId },
  ],
  [
    "micrographId",
    {
      what: "That micrograph",
      team: async (db, id) => (await viaDie(db).innerJoin(micrographs, eq(micrographs.dieId, dies.id)).where(eq(micrographs.id, id)))[0]?.teamId,
    },
  ],
  ["dieId", { what: "That die", team: async (db, id) => (await viaDie(db).where(eq(dies.id, id)))[0]?.teamId }],
  ["caseId", { what: "That case", team: async (db, id) => (await db.select({ teamId: cases.teamId }).from(cases).where(eq(cases.id, id)))[0]?.teamId }],
  ["teamId", { what: "That team", team: async (_db, id) => id }],
];

/** 404 unless the caller is a member of the team owning what `params` names (no-op without such a param). */
export async function assertPathMember(db: Db, actor: Actor, params: Record<string, unknown>): Promise<void> {
  for (const [param, { what, team }] of LOOKUPS) {
    const id = params[param];
    if (typeof id !== "string") continue;
    const teamId = await team(db, id);
    if (!teamId) throw new NotFoundError(what);
    await authorize(db, actor, teamId, "read", what);
    return;
  }
}
