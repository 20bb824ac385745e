"use client";

import type { DieDto } from "@/lib/dto/dies";
import { Dialog } from "@/components/ui/dialog";
import { DieForm } from "@/components/workspace/die-form";
import { useUpdateDie } from "./use-die-mutations";

/** The die's name, size and notes in a form; closes once the server has taken the change. */
export function DieEditDialog({ die, open, onClose }: { die: DieDto; open: boolean; onClose: () => void }) {
  const update = useUpdateDie(die.id);
  return (
    <Dialog open={open} onClose={onClose} title="Edit die">
      <DieForm
        initial={die}
        submitLabel="Save"
        onCancel={onClose}
        onSubmit={async (v) => {
          await update.mutateAsync(v);
          onClose();
        }}
      />
    </Dialog>
  );
}
