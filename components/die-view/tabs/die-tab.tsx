"use client";

import { useQueryClient } from "@tanstack/react-query";
import { apiFetch } from "@/lib/client/api";
import { queryKeys } from "@/lib/client/query-keys";
import { Button } from "@/components/ui/button";
import { MicrographList } from "@/components/micrographs/micrograph-list";
import { MicrographsManager } from "@/components/compare/micrographs-manager";
import { UploadMosaicButton } from "@/components/mosaics/upload-mosaic-button";
import { MosaicPanel } from "@/components/mosaics/mosaic-panel";
import { DieDetails } from "../die-details";
import { useDieWorkspace } from "../die-workspace-context";

/** The die's details and its micrographs: pick one to view, upload, retry a failed tiling, align and compare. */
export function DieTab() {
  const qc = useQueryClient();
  const { die, umPerPx, editable, micrographs, list, shown, pickMicrograph, setWork, setUploadOpen } = useDieWorkspace();
  return (
    <div className="flex flex-col gap-5">
      <DieDetails die={die} umPerPx={umPerPx} />
      <section aria-label="Micrographs" className="flex flex-col gap-2">
        <div className="flex flex-wrap items-center justify-between gap-2">
          <h2 className="text-sm font-semibold">Micrographs</h2>
          {editable && (
            <span className="flex gap-2 whitespace-nowrap">
              <UploadMosaicButton />
              <Button variant="primary" onClick={() => setUploadOpen(true)}>
                Upload micrograph
              </Button>
            </span>
          )}
        </div>
        {micrographs.isPending ? (
          <p className="text-sm text-ink-400">Loading…</p>
        ) : (
          <MicrographList
            items={list}
            selectedId={shown?.id ?? null}
            onSelect={pickMicrograph}
            onRetry={
              editable
                ? async (id) => {
                    await apiFetch(`/api/micrographs/${id}/retry`, { method: "POST" });
                    await qc.invalidateQueries({ queryKey: queryKeys.micrographs(die.id) });
                  }
                : undefined
            }
          />
        )}
      </section>
      {shown?.mosaic && <MosaicPanel micrograph={shown} editable={editable} />}
      <MicrographsManager dieId={die.id} items={list} editable={editable} onWork={setWork} />
    </div>
  );
}
