"use client";

import type { AnyShape, Shape } from "@/lib/markup/types";
import { shapeLabel } from "@/lib/markup/markup-table";
import { estimateRoleOf } from "@/lib/layout-reading/shape-inputs";
import type { Editor } from "@/components/annotate/editor/types";
import { KIND_STYLE } from "@/components/annotate/palette";
import { BondWireEstimate } from "./bond-wire-estimate";
import { SpiralEstimate } from "./spiral-estimate";
import { TraceEstimates } from "./trace-estimates";

const ESTIMATE_CAUTION = "First-order estimates for reading a layout, not a substitute for electromagnetic simulation or measurement.";

/**
 * Estimates for the selected shape, recomputed in the browser with the same pure functions as
 * the API on every change of the shape or the typed inputs. Forms are keyed by shape id, so
 * choosing another shape starts from its own geometry.
 */
export function EstimatesPanel({ selected, editor, canEdit }: { selected: readonly AnyShape[]; editor: Editor; canEdit: boolean }) {
  const shape = selected.length === 1 ? selected[0] : null;
  const role = shape ? estimateRoleOf(shape) : null;
  return (
    <section aria-label="Estimates" className="flex flex-col gap-3">
      <p className="rounded border border-ink-700 bg-ink-950 px-2 py-1.5 text-[11px] text-ink-300">{ESTIMATE_CAUTION}</p>
      {!shape || !role ? (
        <p className="text-sm text-ink-400">
          {selected.length > 1 ? "Select one shape." : "Select a wire bond, a trace, or a block around a spiral inductor to see its estimates."}
        </p>
      ) : (
        <>
          <h2 className="text-sm font-semibold">
            <span style={{ color: KIND_STYLE[shape.kind].colour }}>{KIND_STYLE[shape.kind].label}</span> {shapeLabel(shape)}
          </h2>
          {role === "wire-bond" && <BondWireEstimate key={shape.id} shape={shape as Shape<"wire_bond">} editor={editor} canEdit={canEdit} />}
          {role === "trace" && <TraceEstimates key={shape.id} shape={shape as Shape<"trace">} editor={editor} canEdit={canEdit} />}
          {role === "spiral-block" && <SpiralEstimate key={shape.id} shape={shape as Shape<"block">} editor={editor} canEdit={canEdit} />}
        </>
      )}
    </section>
  );
}
