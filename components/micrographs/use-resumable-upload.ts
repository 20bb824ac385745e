"use client";

import { useCallback, useEffect, useRef, useState } from "react";
import { Upload, type DetailedError } from "tus-js-client";
import type { MicrographDto } from "@/lib/dto/micrographs";

/** Bytes per PATCH: a dropped connection costs at most this much again (the S3 part size too). */
const CHUNK_BYTES = 8 * 1024 ** 2;
/** Waits between attempts after a dropped connection; after the last one the upload stops. */
const RETRY_DELAYS = [0, 1000, 3000, 5000, 10_000, 20_000, 30_000, 60_000];

export type UploadState =
  | { phase: "idle" }
  | { phase: "sending"; loaded: number; total: number; resumed: boolean }
  | { phase: "reconnecting"; loaded: number; total: number; acceptedPercent: number }
  | { phase: "checking"; loaded: number; total: number };

/** The server's `{ error }` message, or a plain sentence for a dropped connection. */
function messageOf(e: Error | DetailedError): string {
  const body = "originalResponse" in e ? e.originalResponse?.getBody() : undefined;
  try {
    const parsed = body ? (JSON.parse(body) as { error?: string }) : null;
    if (parsed?.error) return parsed.error;
  } catch {
    /* not JSON */
  }
  return "The upload was interrupted: check the connection and try again. Choosing the same file again resumes it.";
}

const percent = (part: number, whole: number) => (whole ? Math.floor((100 * part) / whole) : 0);

/**
 * Sends a micrograph with the tus protocol (tus-js-client): 8 MiB PATCHes, automatic retries
 * after a dropped connection from the offset the server holds, and resumption of an earlier
 * attempt of the same file with the same capture data (the fingerprint is kept in localStorage).
 * Leaving the dialog pauses the upload; `cancel` abandons it on the server too.
 */
export function useResumableUpload(dieId: string) {
  const [state, setState] = useState<UploadState>({ phase: "idle" });
  const current = useRef<Upload | null>(null);

  // Closing the dialog pauses: the fingerprint stays, so the same file resumes next time.
  useEffect(() => () => void current.current?.abort(false), []);

  const send = useCallback(
    (file: File, fields: Record<string, string>) =>
      new Promise<MicrographDto>((resolve, reject) => {
        let accepted = 0;
        let resumed = false;
        const upload = new Upload(file, {
          endpoint: "/api/uploads",
          chunkSize: CHUNK_BYTES,
          retryDelays: RETRY_DELAYS,
          metadata: { dieId, filename: file.name, ...fields },
          // Same file, die and capture data → the same upload; anything else starts afresh.
          fingerprint: async (f) => ["kerfline", dieId, f.name, f.size, f.lastModified, JSON.stringify(fields)].join("|"),
          storeFingerprintForResuming: true,
          removeFingerprintOnSuccess: true,
          onProgress: (loaded, total) => setState(loaded >= total ? { phase: "checking", loaded, total } : { phase: "sending", loaded, total, resumed }),
          onChunkComplete: (_size, bytesAccepted) => (accepted = bytesAccepted),
          onShouldRetry: (err, _attempt) => {
            const status = err.originalResponse?.getStatus() ?? 0;
            // A refusal (4xx other than a lock or offset conflict) is the server's answer, not a lost connection.
            if (status >= 400 && status < 500 && status !== 409 && status !== 423) return false;
            setState({ phase: "reconnecting", loaded: accepted, total: file.size, acceptedPercent: percent(accepted, file.size) });
            return true;
          },
          onSuccess: ({ lastResponse }) => {
            current.current = null;
            try {
              resolve(JSON.parse(lastResponse.getBody()) as MicrographDto);
            } catch {
              reject(new Error("The server accepted the file but its answer could not be read; reload the page to see it."));
            }
          },
          onError: (e) => {
            current.current = null;
            setState({ phase: "idle" });
            reject(new Error(messageOf(e)));
          },
        });
        current.current = upload;
        void upload.findPreviousUploads().then((previous) => {
          resumed = previous.length > 0;
          if (previous[0]) upload.resumeFromPreviousUpload(previous[0]);
          setState({ phase: "sending", loaded: 0, total: file.size, resumed });
          upload.start();
        });
      }),
    [dieId],
  );

  /** Abandons the upload: stops sending and deletes what the server holds (tus termination). */
  const cancel = useCallback(async () => {
    const upload = current.current;
    current.current = null;
    setState({ phase: "idle" });
    if (upload) await upload.abort(true).catch(() => undefined);
  }, []);

  return { state, send, cancel };
}
