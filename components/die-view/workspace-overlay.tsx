"use client";

import type { Affine2x3 } from "@/lib/geometry/types";
import type { ViewerApi } from "@/components/viewer";
import { MarkupOverlay } from "@/components/annotate/markup-overlay";
import { SimilarLayer } from "@/components/annotate/find-similar/similar-layer";
import { DetectEdge } from "@/components/annotate/find-similar/detect-edge";
import { useDieWorkspace } from "./die-workspace-context";

/** The markup canvas on one viewer, with the workspace's editor, visibility, labels and extra drawers. */
export function WorkspaceOverlay({ api, imageToDie }: { api: ViewerApi; imageToDie: Affine2x3 }) {
  const { editor, state, markup, drawers, similar, shown, work } = useDieWorkspace();
  if (!editor || !state) return null;
  const singleId = work.kind === "view" ? (shown?.id ?? null) : null;
  return (
    <>
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
      <SimilarLayer api={api} imageToDie={imageToDie} similar={similar} micrographId={singleId} />
      {!similar.session && <DetectEdge editor={editor} state={state} micrographId={singleId} />}
    </>
  );
}
