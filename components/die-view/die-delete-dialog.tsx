"use client";

import type { DieDto } from "@/lib/dto/dies";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { useDeleteDie } from "./use-die-mutations";

/** Asks before the die goes with its micrographs and markup; then the case page is shown. */
export function DieDeleteDialog({ die, open, onClose }: { die: DieDto; open: boolean; onClose: () => void }) {
  const remove = useDeleteDie(die);
  return (
    <ConfirmDialog
      open={open}
      title="Delete this die?"
      message={`“${die.name}” with its micrographs and markup will be deleted. This cannot be undone.`}
      confirmLabel="Delete die"
      onClose={onClose}
      onConfirm={async () => {
        await remove.mutateAsync();
      }}
    />
  );
}
