import type { Metadata } from "next";
import { CasesView } from "@/components/workspace/cases-view";
import { loadPage } from "@/server/http/page";
import { teamsWhereCanEdit } from "@/server/access/cases";

export const metadata: Metadata = { title: "Cases" };

export default async function CasesPage() {
  const editableTeams = await loadPage(({ db, actor }) => teamsWhereCanEdit(db, actor));
  return <CasesView editableTeams={editableTeams} />;
}
