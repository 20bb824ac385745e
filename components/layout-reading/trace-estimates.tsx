"use client";

import { useState } from "react";
import { cpwImpedance, microstripAnalysis, stripInductance, SUBSTRATE_PRESETS } from "@/lib/estimates";
import type { Shape } from "@/lib/markup/types";
import { traceInputs } from "@/lib/layout-reading/shape-inputs";
import type { Editor } from "@/components/annotate/editor/types";
import { EstimateResult, runEstimate } from "./estimate-result";
import { NumberInput, parseNumber, ReadOnlyValue, SelectInput } from "./fields";
import { SaveEstimate } from "./save-estimate";

const PRESETS = [...SUBSTRATE_PRESETS.map((p) => [p.id, `${p.name} (εr ${p.er})`] as const), ["custom", "typed value"] as const];

/** The substrate under a trace: a preset fills εr, which stays editable. */
function useSubstrate() {
  const [preset, setPreset] = useState<string>("sige-on-si");
  const [er, setEr] = useState(String(SUBSTRATE_PRESETS.find((p) => p.id === "sige-on-si")?.er ?? 11.9));
  const [height, setHeight] = useState("200");
  const choose = (id: string) => {
    setPreset(id);
    const p = SUBSTRATE_PRESETS.find((s) => s.id === id);
    if (p) setEr(String(p.er));
  };
  const typeEr = (v: string) => {
    setEr(v);
    setPreset("custom");
  };
  return { preset, choose, er, typeEr, height, setHeight };
}

/** A trace read three ways: an isolated bar's inductance, and as a microstrip or a CPW centre strip. */
export function TraceEstimates({ shape, editor, canEdit }: { shape: Shape<"trace">; editor: Editor; canEdit: boolean }) {
  const { lengthUm, widthUm } = traceInputs(shape);
  const [thickness, setThickness] = useState("3");
  const [gap, setGap] = useState(() => String(widthUm));
  const [backed, setBacked] = useState(false);
  const sub = useSubstrate();
  const t = parseNumber(thickness);
  const er = parseNumber(sub.er);
  const h = parseNumber(sub.height);
  const stripIn = { lengthUm, widthUm, thicknessUm: t };
  const msIn = { widthUm, heightUm: h, er, thicknessUm: t };
  const cpwIn = { widthUm, gapUm: parseNumber(gap), er, heightUm: h, backed };
  const strip = runEstimate(() => stripInductance(stripIn));
  const ms = runEstimate(() => microstripAnalysis(msIn));
  const cpw = runEstimate(() => cpwImpedance(cpwIn));
  return (
    <div className="flex flex-col gap-4">
      <div className="grid grid-cols-2 gap-2">
        <ReadOnlyValue label="Length (drawn)" value={`${lengthUm.toFixed(1)} µm`} />
        <ReadOnlyValue label="Width (Selection tab)" value={`${widthUm} µm`} />
        <NumberInput id="trace-thickness" label="Metal thickness" unit="µm" value={thickness} onChange={setThickness} />
        <SelectInput id="trace-substrate" label="Substrate" value={sub.preset} onChange={sub.choose} options={PRESETS} />
        <NumberInput id="trace-er" label="Relative permittivity εr" value={sub.er} onChange={sub.typeEr} />
        <NumberInput id="trace-height" label="Substrate height" unit="µm" value={sub.height} onChange={sub.setHeight} />
      </div>
      <section aria-label="Strip inductance" className="flex flex-col gap-2">
        <h3 className="text-xs font-semibold uppercase tracking-wide text-ink-300">Straight bar inductance</h3>
        <EstimateResult title="Isolated rectangular bar" outcome={strip} testId="strip" />
        <SaveEstimate editor={editor} shape={shape} kind="strip" inputs={stripIn} outcome={strip} canEdit={canEdit} />
      </section>
      <section aria-label="Microstrip impedance" className="flex flex-col gap-2">
        <h3 className="text-xs font-semibold uppercase tracking-wide text-ink-300">As a microstrip over a backside ground</h3>
        <EstimateResult title="Microstrip, quasi-static" outcome={ms} testId="microstrip" />
        <SaveEstimate editor={editor} shape={shape} kind="microstrip" inputs={msIn} outcome={ms} canEdit={canEdit} />
      </section>
      <section aria-label="Coplanar waveguide impedance" className="flex flex-col gap-2">
        <h3 className="text-xs font-semibold uppercase tracking-wide text-ink-300">As the centre strip of a CPW</h3>
        <div className="grid grid-cols-2 items-end gap-2">
          <NumberInput id="trace-gap" label="Gap to each ground" unit="µm" value={gap} onChange={setGap} />
          <label className="flex items-center gap-2 pb-1 text-xs text-ink-300">
            <input type="checkbox" checked={backed} onChange={(e) => setBacked(e.target.checked)} className="accent-kerf-500" /> Conductor-backed
          </label>
        </div>
        <EstimateResult title="Coplanar waveguide" outcome={cpw} testId="cpw" />
        <SaveEstimate editor={editor} shape={shape} kind="cpw" inputs={cpwIn} outcome={cpw} canEdit={canEdit} />
      </section>
    </div>
  );
}
