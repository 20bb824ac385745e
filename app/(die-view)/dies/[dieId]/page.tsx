import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { DieBench } from "@/components/die-view/die-bench";
import { loadPage } from "@/server/http/page";
import { getDie } from "@/server/access/dies";
import { uuidSchema } from "@/lib/validation/common";

export const metadata: Metadata = { title: "Die" };

export default async function DiePage({ params, searchParams }: { params: Promise<{ dieId: string }>; searchParams: Promise<{ thread?: string | string[] }> }) {
  const { dieId } = await params;
  // Read on the server so the first render (open thread, Review tab) matches on both sides.
  const thread = (await searchParams).thread;
  const linkedThreadId = typeof thread === "string" && uuidSchema.safeParse(thread).success ? thread : null;
  if (!uuidSchema.safeParse(dieId).success) notFound();
  const { die, userId } = await loadPage(async ({ db, actor }) => ({ die: await getDie(db, actor, dieId), userId: actor.userId }));
  return <DieBench initial={die} userId={userId} linkedThreadId={linkedThreadId} />;
}
