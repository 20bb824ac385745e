"use client";

import { useState } from "react";
import { bondWireInductance } from "@/lib/estimates";
import type { Shape } from "@/lib/markup/types";
import { wireBondInputs } from "@/lib/layout-reading/shape-inputs";
import type { Editor } from "@/components/annotate/editor/types";
import { EstimateResult, runEstimate } from "./estimate-result";
import { NumberInput, parseNumber, ReadOnlyValue, SelectInput } from "./fields";
import { SaveEstimate } from "./save-estimate";

/** Bond-wire inductance of the selected wire bond: length and diameter from the shape, the rest typed. */
export function BondWireEstimate({ shape, editor, canEdit }: { shape: Shape<"wire_bond">; editor: Editor; canEdit: boolean }) {
  const [count, setCount] = useState("1");
  const [pitch, setPitch] = useState("100");
  const [regime, setRegime] = useState<"dc" | "hf">("dc");
  const { lengthUm, diameterUm } = wireBondInputs(shape);
  const n = parseNumber(count);
  const inputs = { lengthUm, diameterUm, count: n, pitchUm: n > 1 ? parseNumber(pitch) : undefined, regime };
  const outcome = runEstimate(() => bondWireInductance(inputs));
  return (
    <section aria-label="Bond-wire inductance" className="flex flex-col gap-2">
      <h3 className="text-xs font-semibold uppercase tracking-wide text-ink-300">Bond-wire inductance</h3>
      <div className="grid grid-cols-2 gap-2">
        <ReadOnlyValue label="Length (drawn)" value={`${lengthUm.toFixed(1)} µm`} testId="bond-length" />
        <ReadOnlyValue label="Wire diameter (Selection tab)" value={`${diameterUm} µm`} />
        <NumberInput id="bond-count" label="Bonds in parallel" value={count} onChange={setCount} />
        <NumberInput id="bond-pitch" label="Pitch" unit="µm" value={pitch} onChange={setPitch} disabled={!(n > 1)} />
        <SelectInput
          id="bond-regime"
          label="Current distribution"
          value={regime}
          onChange={setRegime}
          options={[
            ["dc", "uniform (low frequency)"],
            ["hf", "on the surface (high frequency)"],
          ]}
        />
      </div>
      <EstimateResult title="Round wire in free space" outcome={outcome} testId="bond-wire" />
      <SaveEstimate editor={editor} shape={shape} kind="bond-wire" inputs={inputs} outcome={outcome} canEdit={canEdit} />
    </section>
  );
}
