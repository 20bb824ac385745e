"use client";

import { useState } from "react";
import { polylineLength, polygonArea, boundingBox } from "@/lib/geometry/measure";
import { PAD_STATES, type AnyShape, type PadProperties } from "@/lib/markup/types";
import { bondedPadIds, isPadStateByHand, shownPadState } from "@/lib/markup/pad-state";
import { dieFrameOf, isOutsideDie } from "@/lib/markup/outside-die";
import { formatUm } from "@/lib/units/format-um";
import type { Editor } from "./editor/types";
import { KIND_STYLE } from "./palette";
import { useUnsavedGuard } from "@/components/ui/use-unsaved-guard";
import { formatLength } from "./render/draw-interaction";
import { ProbingCaution } from "./probing-caution";

type FieldDef = { key: string; label: string; type?: "number" | "text" | "textarea" | "padState" | "side" };
const FIELDS: Record<AnyShape["kind"], FieldDef[]> = {
  pad: [
    { key: "label", label: "Label" },
    { key: "net", label: "Net" },
    { key: "state", label: "State", type: "padState" },
    { key: "side", label: "Side", type: "side" },
  ],
  wire_bond: [
    { key: "label", label: "Label" },
    { key: "diameterUm", label: "Wire diameter (µm)", type: "number" },
  ],
  block: [
    { key: "name", label: "Name" },
    { key: "function", label: "Function (e.g. input stage, bias, output stage)" },
  ],
  symmetry_axis: [{ key: "name", label: "Name" }],
  trace: [
    { key: "label", label: "Label" },
    { key: "widthUm", label: "Width (µm)", type: "number" },
    { key: "layerNote", label: "Layer note" },
  ],
  ruler: [{ key: "label", label: "Label" }],
  note: [{ key: "text", label: "Text", type: "textarea" }],
  die_outline: [{ key: "label", label: "Label" }],
};

function Field({ def, shape, editor, readOnly }: { def: FieldDef; shape: AnyShape; editor: Editor; readOnly: boolean }) {
  const stored = (shape.properties as Record<string, unknown>)[def.key];
  const shown = stored === undefined || stored === null ? "" : String(stored);
  const [value, setValue] = useState(shown);
  // Another shape selected, or the value changed elsewhere (undo, a reply from the server): start
  // again from it, adjusting state while rendering rather than in an effect.
  const [basis, setBasis] = useState({ shown, shapeId: shape.id });
  if (basis.shown !== shown || basis.shapeId !== shape.id) {
    setBasis({ shown, shapeId: shape.id });
    setValue(shown);
  }
  // Typed but not yet committed (commit happens on blur or Enter): ask before a reload drops it.
  useUnsavedGuard(!readOnly && value !== shown);
  const id = `shape-field-${def.key}`;
  const commit = (v: string) => {
    if (readOnly || v === String(stored ?? "")) return;
    if (def.type === "number") {
      const n = Number(v);
      if (!Number.isFinite(n) || n <= 0) return;
      editor.updateProperties(shape.id, { [def.key]: n });
    } else editor.updateProperties(shape.id, { [def.key]: v });
  };
  const common = "w-full rounded-md border border-ink-700 bg-ink-950 px-2 py-1 text-sm";
  let control: React.ReactNode;
  if (def.type === "padState") return <PadStateField shape={shape} editor={editor} readOnly={readOnly} />;
  if (def.type === "side") {
    const options = ["", "N", "E", "S", "W"] as const;
    control = (
      <select
        id={id}
        disabled={readOnly}
        value={value}
        onChange={(e) => {
          setValue(e.target.value);
          commit(e.target.value);
        }}
        className={common}
      >
        {options.map((o) => (
          <option key={o} value={o}>
            {o === "" ? "from the nearest edge" : o}
          </option>
        ))}
      </select>
    );
  } else if (def.type === "textarea") {
    control = (
      <textarea id={id} readOnly={readOnly} rows={3} value={value} onChange={(e) => setValue(e.target.value)} onBlur={() => commit(value)} className={common} />
    );
  } else {
    control = (
      <input
        id={id}
        readOnly={readOnly}
        inputMode={def.type === "number" ? "decimal" : undefined}
        value={value}
        onChange={(e) => setValue(e.target.value)}
        onBlur={() => commit(value)}
        onKeyDown={(e) => e.key === "Enter" && commit(value)}
        className={common}
      />
    );
  }
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-xs text-ink-300">
        {def.label}
      </label>
      {control}
    </div>
  );
}

/**
 * A pad's state: by default it follows the pad's wire bonds (bonded with one, unbonded without);
 * choosing a state sets it by hand. Probed is only ever chosen by hand.
 */
function PadStateField({ shape, editor, readOnly }: { shape: AnyShape; editor: Editor; readOnly: boolean }) {
  if (shape.kind !== "pad") return null;
  const p = shape.properties as PadProperties;
  const byHand = isPadStateByHand(p);
  const shown = shownPadState(shape, bondedPadIds(editor.getState().shapeList));
  const derived = bondedPadIds(editor.getState().shapeList).has(shape.id) ? "bonded" : "unbonded";
  const value = byHand ? p.state : "auto";
  const onChange = (v: string) => {
    if (readOnly || v === value) return;
    if (v === "auto") editor.updateProperties(shape.id, { stateByHand: false });
    else editor.updateProperties(shape.id, { state: v, stateByHand: true });
  };
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor="shape-field-state" className="text-xs text-ink-300">
        State
      </label>
      <select
        id="shape-field-state"
        disabled={readOnly}
        value={value}
        onChange={(e) => onChange(e.target.value)}
        className="w-full rounded-md border border-ink-700 bg-ink-950 px-2 py-1 text-sm"
      >
        <option value="auto">from its wire bonds ({derived})</option>
        {PAD_STATES.map((o) => (
          <option key={o} value={o}>
            {o} (set by hand)
          </option>
        ))}
      </select>
      <p className="text-[11px] text-ink-400" data-testid="inspector-pad-state">
        Shown as {shown}
        {byHand ? ", set by hand" : `: ${derived === "bonded" ? "a wire bond is attached" : "no wire bond is attached"}`}.
      </p>
      {shown === "probed" && <ProbingCaution />}
    </div>
  );
}

/** A warning for a shape that belongs on the die but lies off it; a pad can still be numbered. */
function OutsideDie({ shape, editor, canEdit, die }: { shape: AnyShape; editor: Editor; canEdit: boolean; die: DieSize | null }) {
  const frame = dieFrameOf(editor.getState().shapeList, die);
  if (!isOutsideDie(shape, frame)) return null;
  const included = shape.kind === "pad" && (shape.properties as PadProperties).numberOutside === true;
  return (
    <div role="alert" className="flex flex-col gap-1 rounded border border-kerf-500/60 bg-ink-950 px-2 py-1.5 text-xs text-kerf-300">
      <p>
        This {shape.kind === "pad" ? "pad" : "shape"} lies outside the die outline.
        {shape.kind === "pad" && !included ? " It is left out of the pad numbering." : ""}
      </p>
      {shape.kind === "pad" && (
        <label className="flex items-center gap-2 text-ink-200">
          <input
            type="checkbox"
            disabled={!canEdit}
            checked={included}
            onChange={(e) => editor.updateProperties(shape.id, { numberOutside: e.target.checked })}
            className="accent-kerf-500"
          />
          Include in the pad numbering
        </label>
      )}
    </div>
  );
}

type DieSize = { readonly widthUm: number | null; readonly heightUm: number | null };

function Measures({ shape, umPerPx }: { shape: AnyShape; umPerPx: number | null }) {
  const g = shape.geometry;
  const b = boundingBox(g);
  const um = (v: number) => formatUm(v, umPerPx);
  const rows: [string, string][] = [];
  if (g.type === "LineString") rows.push(["Length", formatLength(polylineLength(g.coordinates), umPerPx)]);
  if (g.type === "Polygon") {
    rows.push(["Size", `${um(b.maxX - b.minX)} × ${um(b.maxY - b.minY)} µm`]);
    rows.push(["Area", `${polygonArea(g).toFixed(0)} µm²`]);
  }
  rows.push(["Centre", `${um((b.minX + b.maxX) / 2)}, ${um((b.minY + b.maxY) / 2)} µm`]);
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-xs" data-testid="inspector-measures">
      {rows.map(([k, v]) => (
        <div key={k} className="contents">
          <dt className="text-ink-400">{k}</dt>
          <dd className="tabular-nums text-ink-100">{v}</dd>
        </div>
      ))}
    </dl>
  );
}

/** The selected shape's properties, edited in place (each change is one undo step). */
function PadOne({ editor, shape, canEdit }: { editor: Editor; shape: AnyShape; canEdit: boolean }) {
  const isOne = (shape.properties as { isPadOne?: boolean }).isPadOne === true;
  if (isOne) return <p className="text-xs text-kerf-300">This is pad 1: the pad table numbers counter-clockwise from here.</p>;
  if (!canEdit) return null;
  return (
    <button
      type="button"
      className="self-start rounded border border-ink-700 px-2 py-1 text-xs text-ink-200 hover:bg-ink-800"
      onClick={() => {
        // Only one pad can be pad 1: clear the old mark first.
        for (const s of editor.getState().shapeList) {
          if (s.kind === "pad" && (s.properties as { isPadOne?: boolean }).isPadOne) editor.updateProperties(s.id, { isPadOne: false });
        }
        editor.updateProperties(shape.id, { isPadOne: true });
      }}
    >
      Make this pad 1
    </button>
  );
}

export function Inspector({
  editor,
  selected,
  canEdit,
  die = null,
  umPerPx = null,
}: {
  editor: Editor;
  selected: AnyShape[];
  canEdit: boolean;
  die?: DieSize | null;
  umPerPx?: number | null;
}) {
  if (selected.length === 0) return <p className="text-sm text-ink-400">Select a shape to see and edit its properties.</p>;
  if (selected.length > 1) return <p className="text-sm text-ink-300">{selected.length} shapes selected. Drag to move them, Delete to remove them.</p>;
  const shape = selected[0];
  return (
    <section aria-label="Selected markup" className="flex flex-col gap-3">
      <h2 className="flex items-center gap-2 text-sm font-semibold">
        <span aria-hidden="true" className="h-2.5 w-2.5 rounded-full" style={{ background: KIND_STYLE[shape.kind].colour }} />
        {KIND_STYLE[shape.kind].label}
      </h2>
      {FIELDS[shape.kind].map((def) => (
        <Field key={`${shape.id}-${def.key}`} def={def} shape={shape} editor={editor} readOnly={!canEdit} />
      ))}
      {shape.kind === "pad" && <PadOne editor={editor} shape={shape} canEdit={canEdit} />}
      <OutsideDie shape={shape} editor={editor} canEdit={canEdit} die={die} />
      <Measures shape={shape} umPerPx={umPerPx} />
    </section>
  );
}
