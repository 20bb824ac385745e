"use client";

import { useState } from "react";
import { spiralInductance, type SpiralMethod, type SpiralShape } from "@/lib/estimates";
import type { Shape } from "@/lib/markup/types";
import { spiralOuterDiameterFromBlock } from "@/lib/layout-reading/shape-inputs";
import type { Editor } from "@/components/annotate/editor/types";
import { EstimateResult, runEstimate } from "./estimate-result";
import { NumberInput, parseNumber, SelectInput } from "./fields";
import { SaveEstimate } from "./save-estimate";

const SHAPES: readonly (readonly [SpiralShape, string])[] = [
  ["square", "square"],
  ["hexagonal", "hexagonal"],
  ["octagonal", "octagonal"],
  ["circular", "circular"],
];
const METHODS: readonly (readonly [SpiralMethod, string])[] = [
  ["current-sheet", "current sheet"],
  ["wheeler", "modified Wheeler"],
];

/** A block read as a planar spiral: outer diameter from the block's size, the winding typed. */
export function SpiralEstimate({ shape, editor, canEdit }: { shape: Shape<"block">; editor: Editor; canEdit: boolean }) {
  const [form, setForm] = useState<SpiralShape>("square");
  const [method, setMethod] = useState<SpiralMethod>("current-sheet");
  const [turns, setTurns] = useState("3");
  const [outer, setOuter] = useState(() => spiralOuterDiameterFromBlock(shape).toFixed(1));
  const [width, setWidth] = useState("10");
  const [spacing, setSpacing] = useState("5");
  const inputs = {
    shape: form,
    method,
    turns: parseNumber(turns),
    outerDiameterUm: parseNumber(outer),
    widthUm: parseNumber(width),
    spacingUm: parseNumber(spacing),
  };
  const outcome = runEstimate(() => spiralInductance(inputs));
  return (
    <section aria-label="Spiral inductance" className="flex flex-col gap-2">
      <h3 className="text-xs font-semibold uppercase tracking-wide text-ink-300">Block as a planar spiral</h3>
      <div className="grid grid-cols-2 gap-2">
        <SelectInput id="spiral-shape" label="Spiral shape" value={form} onChange={setForm} options={SHAPES} />
        <SelectInput id="spiral-method" label="Expression" value={method} onChange={setMethod} options={METHODS} />
        <NumberInput id="spiral-turns" label="Turns" value={turns} onChange={setTurns} />
        <NumberInput id="spiral-outer" label="Outer diameter" unit="µm" value={outer} onChange={setOuter} />
        <NumberInput id="spiral-width" label="Line width" unit="µm" value={width} onChange={setWidth} />
        <NumberInput id="spiral-spacing" label="Spacing" unit="µm" value={spacing} onChange={setSpacing} />
      </div>
      <p className="text-[11px] text-ink-400">The outer diameter starts at the shorter side of the block; count the turns on the micrograph.</p>
      <EstimateResult title="Planar spiral" outcome={outcome} testId="spiral" />
      <SaveEstimate editor={editor} shape={shape} kind="spiral" inputs={inputs} outcome={outcome} canEdit={canEdit} />
    </section>
  );
}
