"use client";

import { useCallback, useEffect, useRef, useState } from "react";
import { apiFetch } from "@/lib/client/api";
import type { MicrographDto } from "@/lib/dto/micrographs";
import { frameProgress } from "./frame-order";

export type MosaicUploadState =
  | { phase: "idle" }
  | { phase: "sending"; frames: number[]; loaded: number; total: number }
  | { phase: "stitching"; micrograph: MicrographDto }
  | { phase: "done"; micrograph: MicrographDto };

/**
 * Sends a mosaic as one multipart request (fields, then the frames in capture order) with
 * XMLHttpRequest, whose upload events give the byte progress fetch() does not, split per
 * frame; then follows the micrograph through its stages until it is ready (or failed).
 */
export function useMosaicUpload(dieId: string) {
  const [state, setState] = useState<MosaicUploadState>({ phase: "idle" });
  const xhr = useRef<XMLHttpRequest | null>(null);
  const stopped = useRef(false);
  useEffect(
    () => () => {
      stopped.current = true;
      xhr.current?.abort();
    },
    [],
  );

  const follow = useCallback(async (id: string): Promise<MicrographDto> => {
    for (;;) {
      const m = await apiFetch<MicrographDto>(`/api/micrographs/${id}`);
      if (m.status === "failed") throw new Error(m.error ?? "Stitching failed.");
      if (m.status === "ready" && m.mosaic?.stage === "done") {
        setState({ phase: "done", micrograph: m });
        return m;
      }
      setState({ phase: "stitching", micrograph: m });
      if (stopped.current) return m;
      await new Promise((r) => setTimeout(r, 500));
    }
  }, []);

  const send = useCallback(
    async (files: File[], fields: Record<string, string>, onAccepted?: (id: string) => void): Promise<MicrographDto> => {
      const form = new FormData();
      for (const [k, v] of Object.entries(fields)) form.append(k, v);
      for (const f of files) form.append("file", f, f.name);
      const sizes = files.map((f) => f.size);
      setState({ phase: "sending", frames: sizes.map(() => 0), loaded: 0, total: 1 });
      const answer = await new Promise<{ id: string }>((resolve, reject) => {
        const req = new XMLHttpRequest();
        xhr.current = req;
        req.open("POST", `/api/dies/${dieId}/mosaics`);
        req.responseType = "json";
        req.upload.onprogress = (e) => {
          if (e.lengthComputable) setState({ phase: "sending", frames: frameProgress(sizes, e.loaded, e.total), loaded: e.loaded, total: e.total });
        };
        req.onload = () => {
          const body = (req.response ?? {}) as { id?: string; error?: string };
          if (req.status === 202 && body.id) resolve({ id: body.id });
          else reject(new Error(body.error ?? `The upload was refused (${req.status}).`));
        };
        req.onerror = () => reject(new Error("The connection was lost while sending the frames; send them again."));
        req.onabort = () => reject(new Error("The upload was cancelled."));
        req.send(form);
      }).finally(() => (xhr.current = null));
      onAccepted?.(answer.id);
      return follow(answer.id);
    },
    [dieId, follow],
  );

  const reset = useCallback(() => setState({ phase: "idle" }), []);
  const cancel = useCallback(() => xhr.current?.abort(), []);
  return { state, send, reset, cancel };
}
