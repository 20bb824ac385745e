"use client";

import Link from "next/link";
import { useState } from "react";
import type { DieDto } from "@/lib/dto/dies";
import { can } from "@/lib/auth/permissions";
import { InboxLink } from "@/components/account/inbox-link";
import { Wordmark } from "@/components/ui/wordmark";
import { Button } from "@/components/ui/button";
import { ReviewBadge } from "@/components/ui/review-badge";
import { DieEditDialog } from "./die-edit-dialog";
import { DieDeleteDialog } from "./die-delete-dialog";
import { useDie } from "./use-die";

/**
 * The die view's top bar: the way home, the breadcrumb to the die's case, its review status, the
 * inbox, and editing or deleting the die for those who may. Rendered by the die route's layout;
 * it reads the cached die, so an edit shows here and in the workspace at once.
 */
export function DieHeader({ initial }: { initial: DieDto }) {
  const die = useDie(initial);
  const editable = can(die.yourRole, "edit");
  const [dialog, setDialog] = useState<null | "edit" | "delete">(null);
  return (
    <>
      <header className="flex items-center gap-4 border-b border-ink-800 bg-ink-900 px-4 py-2">
        <Link href="/cases" aria-label="Kerfline home">
          <Wordmark />
        </Link>
        <nav aria-label="Breadcrumb" className="text-sm text-ink-400">
          <Link href="/cases" className="hover:text-ink-200">
            Cases
          </Link>{" "}
          /{" "}
          <Link href={`/cases/${die.caseId}`} className="hover:text-ink-200">
            {die.caseTitle}
          </Link>{" "}
          / <h1 className="inline text-sm font-semibold text-ink-100">{die.name}</h1>
        </nav>
        <ReviewBadge status={die.reviewStatus} />
        <div className="ml-auto flex items-center gap-2 text-sm">
          <InboxLink initialUnread={0} />
          {editable && (
            <>
              <Button onClick={() => setDialog("edit")}>Edit die</Button>
              <Button variant="danger" onClick={() => setDialog("delete")}>
                Delete die
              </Button>
            </>
          )}
        </div>
      </header>
      <DieEditDialog die={die} open={dialog === "edit"} onClose={() => setDialog(null)} />
      <DieDeleteDialog die={die} open={dialog === "delete"} onClose={() => setDialog(null)} />
    </>
  );
}
