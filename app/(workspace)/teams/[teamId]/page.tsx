import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { MembersView } from "@/components/workspace/members-view";
import { loadPage } from "@/server/http/page";
import { getTeam } from "@/server/access/teams";
import { uuidSchema } from "@/lib/validation/common";

export const metadata: Metadata = { title: "Team" };

export default async function TeamPage({ params }: { params: Promise<{ teamId: string }> }) {
  const { teamId } = await params;
  if (!uuidSchema.safeParse(teamId).success) notFound();
  const { team, me } = await loadPage(async ({ db, actor }) => ({ team: await getTeam(db, actor, teamId), me: actor.userId }));
  return <MembersView team={team} myUserId={me} />;
}
