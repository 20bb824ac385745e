"use client";

import { useCallback, useEffect, useMemo, useRef, useState } from "react";
import { imageBoxOfDieBox } from "@/lib/geometry/view-box";
import { boundingBox, type BoundingBox } from "@/lib/geometry/measure";
import type { Affine2x3 } from "@/lib/geometry/types";
import type { ViewerApi } from "@/components/viewer";
import type { EditorState } from "@/components/annotate/editor/types";
import { remarkMarkersDrawer } from "./remark-markers";
import { useThreads } from "./use-threads";

/** Animates the viewer to a die-µm box with room around it. */
function flyToDieBox(api: ViewerApi, transform: Affine2x3, b: BoundingBox) {
  const img = imageBoxOfDieBox(b, transform);
  const w = img.maxX - img.minX;
  const h = img.maxY - img.minY;
  const pad = Math.max(w, h, 40) * 2;
  api.flyToImageRect(img.minX - pad, img.minY - pad, w + 2 * pad, h + 2 * pad);
}

/**
 * Review state of the die bench: the threads, which one is open, its pins on the canvas, and
 * selecting a thread (flies to its anchor and selects its shape when the shape still exists).
 * `linkedThreadId` is the page address's `?thread=`, read by the server page and passed down:
 * reading `window.location` during render gave the client a first render different from the
 * server's HTML (a hydration error on every deep link).
 */
export function useReviewBench(
  dieId: string,
  linkedThreadId: string | null,
  state: EditorState | null,
  api: ViewerApi | null,
  transform: Affine2x3 | null,
  pick: (id: string) => void,
) {
  const threads = useThreads(dieId);
  const [selectedId, setSelectedId] = useState<string | null>(linkedThreadId);
  const list = useMemo(() => threads.threads.data ?? [], [threads.threads.data]);
  const drawer = useMemo(() => remarkMarkersDrawer(list, selectedId), [list, selectedId]);

  const linked = useRef(linkedThreadId);
  const show = useCallback(
    (id: string | null) => {
      setSelectedId(id);
      const t = list.find((x) => x.id === id);
      if (!t) return;
      if (t.shapeId && state?.shapes.has(t.shapeId)) pick(t.shapeId);
      else if (api && transform) flyToDieBox(api, transform, boundingBox(t.anchor));
    },
    [list, state, api, transform, pick],
  );

  // A choice of the user's own (back to the list, another thread) cancels the deep link's
  // pending jump, which would otherwise reopen the linked thread after the click.
  const select = useCallback(
    (id: string | null) => {
      linked.current = null;
      show(id);
    },
    [show],
  );

  // A deep link opens the die zoomed to its thread once the viewer, the markup and the threads are in.
  useEffect(() => {
    const id = linked.current;
    if (!id || !api || !transform || !state || !list.some((t) => t.id === id)) return;
    const viewer = api.viewer;
    let timer: ReturnType<typeof setTimeout> | undefined;
    // Fly only once the image is open: OpenSeadragon sets its home view when it opens the
    // first image, which would undo an earlier flight (seen on a busy machine, where opening
    // took longer than any fixed wait). Cleared if the user chooses first.
    const fly = () => {
      timer = setTimeout(() => {
        if (linked.current !== id) return;
        linked.current = null;
        show(id);
      }, 50);
    };
    if (viewer.world.getItemCount() > 0) fly();
    else viewer.addOnceHandler("open", fly);
    return () => {
      clearTimeout(timer);
      viewer.removeHandler("open", fly);
    };
  }, [api, transform, state, list, show]);

  return { threads, list, selectedId, select, drawer, linkedAtStart: linkedThreadId !== null };
}

export type ReviewBench = ReturnType<typeof useReviewBench>;
