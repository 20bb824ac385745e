"use client";

import type { Affine2x3 } from "@/lib/geometry/types";
import type { ViewerApi } from "@/components/viewer";
import { MarkupOverlay } from "@/components/annotate/markup-overlay";
import { useDieWorkspace } from "./die-workspace-context";

/** The markup canvas on one viewer, with the workspace's editor, visibility, labels and extra drawers. */
export function WorkspaceOverlay({ api, imageToDie }: { api: ViewerApi; imageToDie: Affine2x3 }) {
  const { editor, state, markup, drawers } = useDieWorkspace();
  if (!editor || !state) return null;
  return (
    <MarkupOverlay
      api={api}
      editor={editor}
      state={state}
      imageToDie={imageToDie}
      hiddenKinds={markup.hiddenKinds}
      labels={markup.labels}
      extraDrawers={drawers}
      isHidden={markup.isHidden}
    />
  );
}
