import "server-only";
import { cache } from "react";
import { notFound } from "next/navigation";
import { loadPage } from "@/server/http/page";
import { getDie } from "@/server/access/dies";
import { uuidSchema } from "@/lib/validation/common";

/**
 * The die of the route and the caller, loaded once per request: the layout (header) and the
 * page (workspace) both ask, and React's `cache` hands the second the first one's answer.
 */
export const loadDie = cache(async (dieId: string) => {
  if (!uuidSchema.safeParse(dieId).success) notFound();
  return loadPage(async ({ db, actor }) => ({ die: await getDie(db, actor, dieId), userId: actor.userId }));
});
