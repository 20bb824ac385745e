import type { Metadata } from "next";
import Link from "next/link";
import { connection } from "next/server";
import { notFound } from "next/navigation";
import { database } from "@/server/database";
import { viewInvitation } from "@/server/access/invitations";
import { NotFoundError } from "@/lib/errors";
import { currentActor } from "@/server/http/session";
import { ROLE_LABELS } from "@/lib/auth/permissions";
import { AcceptForm } from "./accept-form";
import { InvitationPrompt } from "@/components/account/invitation-prompts";

export const metadata: Metadata = { title: "Invitation" };

const GONE = {
  accepted: "This invitation link has already been used.",
  revoked: "This invitation was revoked by the team's owner.",
  expired: "This invitation has expired; ask the team's owner for a new one.",
  declined: "This invitation was declined.",
} as const;

/** The page an invitation mail links to: the token is the proof, no sign-in needed. */
export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  await connection();
  const { token } = await params;
  if (!/^[A-Za-z0-9_-]{20,200}$/.test(token)) notFound();
  const view = await viewInvitation(await database(), token).catch((e) => {
    if (e instanceof NotFoundError) notFound();
    throw e;
  });
  const actor = await currentActor();
  const heading = <h1 className="mb-3 text-lg font-semibold">Join {view.teamName}</h1>;
  if (view.state !== "pending") {
    return (
      <>
        {heading}
        <p className="text-sm text-ink-200">{GONE[view.state]}</p>
      </>
    );
  }
  const signedInAsInvitee = actor && actor.email.toLowerCase() === view.email.toLowerCase();
  return (
    <>
      {heading}
      <p className="mb-4 text-sm text-ink-300">
        {view.inviterName ?? "A team owner"} invited you as <strong>{ROLE_LABELS[view.role].toLowerCase()}</strong> with the address {view.email}.
      </p>
      {signedInAsInvitee ? (
        <InvitationPrompt invitation={{ id: view.id, teamName: view.teamName, role: view.role, inviterName: view.inviterName }} />
      ) : view.accountExists ? (
        <p className="text-sm text-ink-200">
          An account for this address exists.{" "}
          <Link href="/sign-in" className="text-kerf-300 underline">
            Sign in
          </Link>{" "}
          with it and you will be asked to join the team or decline.
        </p>
      ) : (
        <AcceptForm token={token} needsAccount />
      )}
    </>
  );
}
