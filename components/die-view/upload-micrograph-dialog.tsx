"use client";

import { useQueryClient } from "@tanstack/react-query";
import { queryKeys } from "@/lib/client/query-keys";
import { Dialog } from "@/components/ui/dialog";
import { UploadMicrograph } from "@/components/micrographs/upload-micrograph";
import { useDieWorkspace } from "./die-workspace-context";

/** Uploads a micrograph to the die; the new one is shown once the server has it. */
export function UploadMicrographDialog() {
  const qc = useQueryClient();
  const { die, uploadOpen, setUploadOpen, setShownId } = useDieWorkspace();
  return (
    <Dialog open={uploadOpen} onClose={() => setUploadOpen(false)} title="Upload a micrograph">
      <UploadMicrograph
        dieId={die.id}
        onCancel={() => setUploadOpen(false)}
        onUploaded={async (m) => {
          await qc.invalidateQueries({ queryKey: queryKeys.micrographs(die.id) });
          setShownId(m.id);
          setUploadOpen(false);
        }}
      />
    </Dialog>
  );
}
