import type { Metadata } from "next";
import { CaseView } from "@/components/workspace/case-view";
import { loadPage } from "@/server/http/page";
import { getCase } from "@/server/access/cases";
import { uuidSchema } from "@/lib/validation/common";
import { notFound } from "next/navigation";

export const metadata: Metadata = { title: "Case" };

export default async function CasePage({ params }: { params: Promise<{ caseId: string }> }) {
  const { caseId } = await params;
  if (!uuidSchema.safeParse(caseId).success) notFound();
  const initial = await loadPage(({ db, actor }) => getCase(db, actor, caseId));
  return <CaseView initial={initial} />;
}
