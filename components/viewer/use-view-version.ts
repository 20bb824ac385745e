"use client";

import { useCallback, useSyncExternalStore } from "react";
import type { ViewerApi } from "./viewer-api";

const versions = new WeakMap<ViewerApi, number>();

/**
 * A number that changes whenever the view moves, for components that redraw with the view.
 * useSyncExternalStore renders synchronously (before the browser paints), so marks drawn
 * from it stay on the image during an animation instead of trailing it by a frame.
 */
export function useViewVersion(api: ViewerApi | null): number {
  const subscribe = useCallback(
    (notify: () => void) => {
      if (!api) return () => {};
      return api.onViewChange(() => {
        versions.set(api, (versions.get(api) ?? 0) + 1);
        notify();
      });
    },
    [api],
  );
  const snapshot = useCallback(() => (api ? (versions.get(api) ?? 0) : -1), [api]);
  return useSyncExternalStore(subscribe, snapshot, () => -1);
}
