"use client";

import { useEffect, useRef, useState, useSyncExternalStore } from "react";
import { useQueryClient } from "@tanstack/react-query";
import { queryKeys } from "@/lib/client/query-keys";
import type { AnyShape } from "@/lib/markup/types";
import { apiFetch } from "@/lib/client/api";
import { createEditor } from "./editor/editor";
import type { Editor, EditorState } from "./editor/types";
import { frameUndoFor, type FrameUndo } from "./frame-undo";
import { saveEntry } from "./persist-changes";
import { createSaveQueue, type SaveState } from "./save-queue";

export type { SaveState };

type DieSize = { readonly widthUm: number | null; readonly heightUm: number | null };

/**
 * Loads a die's markup, runs the editor on it and persists every committed change in order.
 * Changes show at once (optimistic); if the server refuses one, the markup is reloaded from
 * the server (rolling the refused change back) and the reason is shown.
 *
 * A die outline re-frames the die on the server (everything moves), so the editor is reloaded
 * afterwards; the reloaded editor is handed one undo step beyond its history that puts the
 * earlier frame back through `POST /api/dies/{dieId}/frame/restore`.
 */
export function useMarkupEditor(dieId: string, canEdit: boolean, userId: string | null, die: DieSize) {
  const qc = useQueryClient();
  const [editor, setEditor] = useState<Editor | null>(null);
  const [save, setSave] = useState<SaveState>({ status: "idle" });
  const [loadError, setLoadError] = useState<string | null>(null);
  const [generation, setGeneration] = useState(0);
  // One queue for the page's life, across reloads, so saves never overtake one another.
  const [queue] = useState(() => createSaveQueue(setSave));
  const dieRef = useRef(die);
  const frameUndo = useRef<FrameUndo | null>(null);
  useEffect(() => {
    dieRef.current = die;
  }, [die]);

  useEffect(() => {
    let cancelled = false;
    let unsubscribe = () => {};
    const reloadFrame = async () => {
      await Promise.all([
        qc.invalidateQueries({ queryKey: queryKeys.micrographs(dieId) }),
        qc.invalidateQueries({ queryKey: queryKeys.die(dieId) }),
        qc.invalidateQueries({ queryKey: queryKeys.pads(dieId) }),
      ]);
      setGeneration((g) => g + 1);
    };
    const restoreFrame = (undo: FrameUndo) => {
      void queue.add(async (): Promise<SaveState> => {
        try {
          await apiFetch(`/api/dies/${dieId}/frame/restore`, { method: "POST", body: undo });
          return { status: "saved" };
        } catch (e) {
          return { status: "failed", message: `${(e as Error).message} The markup was reloaded from the server.` };
        } finally {
          await reloadFrame();
        }
      });
    };
    apiFetch<AnyShape[]>(`/api/dies/${dieId}/markup`)
      .then((shapes) => {
        if (cancelled) return;
        const versions = new Map(shapes.map((s) => [s.id, s.version]));
        const undo = frameUndo.current;
        frameUndo.current = null;
        const ed = createEditor({
          shapes,
          canEdit,
          userId,
          die: dieRef.current,
          newId: () => crypto.randomUUID(),
          now: () => new Date().toISOString(),
          undoBeyondHistory: undo ? () => restoreFrame(undo) : undefined,
        });
        unsubscribe = ed.onCommit((entry) => {
          const reframe = frameUndoFor(entry, dieRef.current);
          void queue.add(async (): Promise<SaveState> => {
            try {
              await saveEntry(ed, dieId, entry, versions);
            } catch (e) {
              setGeneration((g) => g + 1);
              return { status: "failed", message: `${(e as Error).message} The markup was reloaded from the server.` };
            }
            void qc.invalidateQueries({ queryKey: queryKeys.pads(dieId) });
            // A die outline re-frames the die on the server (origin, size): reload what moved.
            if (reframe) {
              frameUndo.current = reframe;
              await reloadFrame();
            }
            return { status: "saved" };
          });
        });
        setEditor(ed);
      })
      .catch((e) => !cancelled && setLoadError((e as Error).message));
    return () => {
      cancelled = true;
      unsubscribe();
    };
  }, [dieId, canEdit, userId, generation, qc, queue]);

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
