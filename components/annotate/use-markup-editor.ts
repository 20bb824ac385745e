"use client";

import { useEffect, useRef, useState, useSyncExternalStore } from "react";
import { useQueryClient } from "@tanstack/react-query";
import type { AnyShape } from "@/lib/markup/types";
import { apiFetch } from "@/lib/client/api";
import { createEditor } from "./editor/editor";
import type { Editor, EditorState } from "./editor/types";
import { persistEntry } from "./persist-changes";

export type SaveState = { status: "idle" | "saving" | "saved" | "failed"; message?: string };

/**
 * Loads a die's markup, runs the editor on it and persists every committed change in order.
 * Changes show at once (optimistic); if the server refuses one, the markup is reloaded from
 * the server (rolling the refused change back) and the reason is shown.
 */
export function useMarkupEditor(dieId: string, canEdit: boolean, userId: string | null) {
  const qc = useQueryClient();
  const [editor, setEditor] = useState<Editor | null>(null);
  const [save, setSave] = useState<SaveState>({ status: "idle" });
  const [loadError, setLoadError] = useState<string | null>(null);
  const [generation, setGeneration] = useState(0);
  const queue = useRef<Promise<void>>(Promise.resolve());

  useEffect(() => {
    let cancelled = false;
    let unsubscribe = () => {};
    apiFetch<AnyShape[]>(`/api/dies/${dieId}/markup`)
      .then((shapes) => {
        if (cancelled) return;
        const versions = new Map(shapes.map((s) => [s.id, s.version]));
        const ed = createEditor({ shapes, canEdit, userId, newId: () => crypto.randomUUID(), now: () => new Date().toISOString() });
        unsubscribe = ed.onCommit((entry) => {
          setSave({ status: "saving" });
          queue.current = queue.current.then(async () => {
            try {
              const { saved } = await persistEntry(dieId, entry, versions);
              for (const s of saved) ed.applyServerShape(s);
              setSave({ status: "saved" });
              void qc.invalidateQueries({ queryKey: ["pads", dieId] });
              // A die outline re-frames the die on the server (origin, size): reload what moved.
              if (entry.some((c) => (c.after ?? c.before)?.kind === "die_outline")) {
                await Promise.all([qc.invalidateQueries({ queryKey: ["micrographs", dieId] }), qc.invalidateQueries({ queryKey: ["die", dieId] })]);
                setGeneration((g) => g + 1);
              }
            } catch (e) {
              setSave({ status: "failed", message: `${(e as Error).message} The markup was reloaded from the server.` });
              setGeneration((g) => g + 1);
            }
          });
        });
        setEditor(ed);
      })
      .catch((e) => !cancelled && setLoadError((e as Error).message));
    return () => {
      cancelled = true;
      unsubscribe();
    };
  }, [dieId, canEdit, userId, generation, qc]);

  return { editor, save, loadError };
}

const EMPTY_SUBSCRIBE = () => () => {};

/** The editor's current snapshot for rendering (null before it is loaded). */
export function useEditorState(editor: Editor | null): EditorState | null {
  return useSyncExternalStore(
    editor ? editor.subscribe : EMPTY_SUBSCRIBE,
    () => editor?.getState() ?? null,
    () => null,
  );
}
