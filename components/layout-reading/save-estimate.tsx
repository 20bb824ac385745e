"use client";

import { useState } from "react";
import type { EstimateMeta } from "@/lib/estimates";
import type { AnyShape } from "@/lib/markup/types";
import { savedEstimatesOf, summariseSavedEstimate, toSavedEstimate, withSavedEstimate, type SavedEstimateKind } from "@/lib/layout-reading/saved-estimates";
import { Button } from "@/components/ui/button";
import type { Editor } from "@/components/annotate/editor/types";
import type { Outcome } from "./estimate-result";

type Inputs = Record<string, number | string | boolean | undefined>;

/**
 * "Save on shape": stores the estimate in the shape's properties.estimates through the editor,
 * so it is undoable, saved like any other edit, and shows in the markup table and exports.
 */
export function SaveEstimate<T extends EstimateMeta>({
  editor,
  shape,
  kind,
  inputs,
  outcome,
  canEdit,
}: {
  editor: Editor;
  shape: AnyShape;
  kind: SavedEstimateKind;
  inputs: Inputs;
  outcome: Outcome<T>;
  canEdit: boolean;
}) {
  const [note, setNote] = useState<string | null>(null);
  const saved = savedEstimatesOf(shape.properties)[kind];
  const summary = saved ? summariseSavedEstimate(saved) : null;
  const save = () => {
    if (!outcome.ok) return;
    const record = toSavedEstimate(kind, inputs, outcome.result as T & Record<string, unknown>, new Date().toISOString());
    editor.updateProperties(shape.id, { estimates: withSavedEstimate(shape.properties, kind, record) });
    setNote("Saved on the shape.");
  };
  return (
    <div className="flex items-center gap-2">
      {canEdit && (
        <Button onClick={save} disabled={!outcome.ok} aria-label={`Save ${kind} estimate on shape`}>
          Save on shape
        </Button>
      )}
      <span className="text-[11px] text-ink-400" role="status" data-testid={`saved-${kind}`}>
        {note ?? (summary ? `On the shape: ${summary}` : canEdit ? "Not saved on the shape yet." : "")}
      </span>
    </div>
  );
}
