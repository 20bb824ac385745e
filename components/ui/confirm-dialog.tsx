"use client";

import { useState } from "react";
import { Button } from "./button";
import { Dialog } from "./dialog";
import { FormMessage } from "./field";

/** Asks before a destructive action; shows the server's refusal if it fails. */
export function ConfirmDialog({
  open,
  title,
  message,
  confirmLabel,
  onConfirm,
  onClose,
}: {
  open: boolean;
  title: string;
  message: string;
  confirmLabel: string;
  onConfirm: () => Promise<void>;
  onClose: () => void;
}) {
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  return (
    <Dialog open={open} onClose={onClose} title={title}>
      <p className="mb-4 text-sm text-ink-200">{message}</p>
      <FormMessage message={error} />
      <div className="mt-2 flex justify-end gap-2">
        <Button onClick={onClose}>Cancel</Button>
        <Button
          variant="danger"
          disabled={busy}
          onClick={async () => {
            setBusy(true);
            setError(null);
            try {
              await onConfirm();
              onClose();
            } catch (e) {
              setError((e as Error).message);
            } finally {
              setBusy(false);
            }
          }}
        >
          {busy ? "Deleting…" : confirmLabel}
        </Button>
      </div>
    </Dialog>
  );
}
