import type { Metadata } from "next";
import { CasesView } from "@/components/workspace/cases-view";
import { loadPage } from "@/lib/server/page";
import { teamsWhereCanEdit } from "@/db/access/cases";

export const metadata: Metadata = { title: "Cases" };

export default async function CasesPage() {
  const editableTeams = await loadPage(({ db, actor }) => teamsWhereCanEdit(db, actor));
  return <CasesView editableTeams={editableTeams} />;
}
