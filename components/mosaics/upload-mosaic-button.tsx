"use client";

import { useState } from "react";
import { useQueryClient } from "@tanstack/react-query";
import { queryKeys } from "@/lib/client/query-keys";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { useDieWorkspace } from "@/components/die-view/die-workspace-context";
import { UploadMosaic } from "./upload-mosaic";

/** "Upload mosaic" beside the single upload: a grid of overlapping frames stitched on the server into one micrograph. */
export function UploadMosaicButton() {
  const qc = useQueryClient();
  const { die, setShownId } = useDieWorkspace();
  const [open, setOpen] = useState(false);
  return (
    <>
      <Button onClick={() => setOpen(true)}>Upload mosaic</Button>
      <Dialog open={open} onClose={() => setOpen(false)} title="Upload a mosaic" wide>
        <UploadMosaic
          dieId={die.id}
          onAccepted={() => void qc.invalidateQueries({ queryKey: queryKeys.micrographs(die.id) })}
          onCancel={() => {
            void qc.invalidateQueries({ queryKey: queryKeys.micrographs(die.id) });
            setOpen(false);
          }}
          onDone={async (m) => {
            await qc.invalidateQueries({ queryKey: queryKeys.micrographs(die.id) });
            setShownId(m.id);
            setOpen(false);
          }}
        />
      </Dialog>
    </>
  );
}
