"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { DieDto } from "@/db/access/dies";
import { apiFetch } from "@/lib/client/api";
import { can } from "@/lib/auth/permissions";
import { Wordmark } from "@/components/ui/wordmark";
import { Button } from "@/components/ui/button";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { Dialog } from "@/components/ui/dialog";
import { ReviewBadge } from "@/components/ui/review-badge";
import { DieForm } from "@/components/workspace/die-form";
import { MicrographList } from "@/components/micrographs/micrograph-list";
import { UploadMicrograph } from "@/components/micrographs/upload-micrograph";
import { DieDetails } from "./die-details";
import { useMicrographs } from "./use-micrographs";
import { ViewerPane } from "./viewer-pane";

/** The die bench: a top bar with the die's identity, the work area, and a side panel. */
export function DieBench({ initial }: { initial: DieDto }) {
  const router = useRouter();
  const qc = useQueryClient();
  const [dialog, setDialog] = useState<null | "edit" | "delete" | "upload">(null);
  const [selectedId, setSelectedId] = useState<string | null>(null);
  const micrographs = useMicrographs(initial.id);
  const list = micrographs.data ?? [];
  // Show the chosen micrograph, else the reference one, else the first.
  const shown = list.find((m) => m.id === selectedId) ?? list.find((m) => m.isReference) ?? list[0] ?? null;
  const die = useQuery({ queryKey: ["die", initial.id], queryFn: () => apiFetch<DieDto>(`/api/dies/${initial.id}`), initialData: initial }).data;
  const editable = can(die.yourRole, "edit");
  const update = useMutation({
    mutationFn: (body: unknown) => apiFetch<DieDto>(`/api/dies/${die.id}`, { method: "PATCH", body }),
    onSuccess: (d) => qc.setQueryData(["die", die.id], d),
  });
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
          / <span className="text-ink-100">{die.name}</span>
        </nav>
        <ReviewBadge status={die.reviewStatus} />
        <div className="ml-auto flex gap-2">
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
      <div className="flex min-h-0 flex-1">
        <section aria-label="Work area" className="relative min-w-0 flex-1 bg-ink-950">
          <ViewerPane micrograph={shown} canEdit={editable} />
        </section>
        <aside aria-label="Die panel" className="flex w-80 shrink-0 flex-col gap-5 overflow-y-auto border-l border-ink-800 bg-ink-900 p-4">
          <DieDetails die={die} />
          <section aria-label="Micrographs" className="flex flex-col gap-2">
            <div className="flex items-center justify-between">
              <h2 className="text-sm font-semibold">Micrographs</h2>
              {editable && (
                <Button variant="primary" onClick={() => setDialog("upload")}>
                  Upload micrograph
                </Button>
              )}
            </div>
            {micrographs.isPending ? <p className="text-sm text-ink-400">Loading…</p> : <MicrographList items={micrographs.data ?? []} selectedId={shown?.id ?? null} onSelect={setSelectedId} />}
          </section>
        </aside>
      </div>
      <Dialog open={dialog === "upload"} onClose={() => setDialog(null)} title="Upload a micrograph">
        <UploadMicrograph
          dieId={die.id}
          onCancel={() => setDialog(null)}
          onUploaded={async (m) => {
            await qc.invalidateQueries({ queryKey: ["micrographs", die.id] });
            setSelectedId(m.id);
            setDialog(null);
          }}
        />
      </Dialog>
      <Dialog open={dialog === "edit"} onClose={() => setDialog(null)} title="Edit die">
        <DieForm
          initial={die}
          submitLabel="Save"
          onCancel={() => setDialog(null)}
          onSubmit={async (v) => {
            await update.mutateAsync(v);
            setDialog(null);
          }}
        />
      </Dialog>
      <ConfirmDialog
        open={dialog === "delete"}
        title="Delete this die?"
        message={`“${die.name}” with its micrographs and markup will be deleted. This cannot be undone.`}
        confirmLabel="Delete die"
        onClose={() => setDialog(null)}
        onConfirm={async () => {
          await apiFetch(`/api/dies/${die.id}`, { method: "DELETE" });
          await qc.invalidateQueries({ queryKey: ["dies", die.caseId] });
          await qc.invalidateQueries({ queryKey: ["cases"] });
          router.push(`/cases/${die.caseId}`);
        }}
      />
    </>
  );
}
