import type { Metadata } from "next";
import { DieWorkspace } from "@/components/die-view/die-workspace";
import { uuidSchema } from "@/lib/validation/common";
import { loadDie } from "./load-die";

export const metadata: Metadata = { title: "Die" };

export default async function DiePage({ params, searchParams }: { params: Promise<{ dieId: string }>; searchParams: Promise<{ thread?: string | string[] }> }) {
  const { dieId } = await params;
  // Read on the server so the first render (open thread, Review tab) matches on both sides.
  const thread = (await searchParams).thread;
  const linkedThreadId = typeof thread === "string" && uuidSchema.safeParse(thread).success ? thread : null;
  const { die, userId } = await loadDie(dieId);
  return <DieWorkspace initial={die} userId={userId} linkedThreadId={linkedThreadId} />;
}
