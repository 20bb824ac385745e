import type { UseFormRegister } from "react-hook-form";
import { MARKUP_KINDS } from "@/lib/markup/types";
import { KIND_STYLE } from "@/lib/markup/palette";
import type { ExportFormValues, RegionMode } from "./export-request";

type Register = UseFormRegister<ExportFormValues>;

export const FIELD_CLASS = "w-full rounded border border-ink-700 bg-ink-900 px-2 py-1 text-sm text-ink-100";

const REGION_LABEL: Record<RegionMode, string> = { view: "Current view", die: "Whole die", typed: "Rectangle (µm)" };

/** An empty number field is sent as 0, so the schema names what is wrong with it. */
const asNumber = { setValueAs: (v: unknown) => (v === "" || v === null || v === undefined ? 0 : Number(v)) };

/** Which part of the die: the viewer's current view, the whole die, or a rectangle typed in µm. */
export function RegionFields({ register, mode }: { register: Register; mode: RegionMode }) {
  return (
    <>
      <fieldset className="text-xs">
        <legend>Region</legend>
        {(["view", "die", "typed"] as const).map((r) => (
          <label key={r} className="mr-3">
            <input type="radio" value={r} {...register("mode")} /> {REGION_LABEL[r]}
          </label>
        ))}
      </fieldset>
      {mode === "typed" && (
        <div className="grid grid-cols-4 gap-1 text-xs">
          {(["x", "y", "width", "height"] as const).map((k) => (
            <label key={k}>
              {k}
              <input aria-label={`Region ${k} (µm)`} className={FIELD_CLASS} type="number" {...register(`region.${k}`, asNumber)} />
            </label>
          ))}
        </div>
      )}
    </>
  );
}

/** The output size, by width in pixels or by µm per pixel. */
export function SizeFields({ register, sizeBy }: { register: Register; sizeBy: ExportFormValues["sizeBy"] }) {
  return (
    <div className="flex items-end gap-2 text-xs">
      <label>
        <input type="radio" value="width" {...register("sizeBy")} /> Width (px)
        <input
          aria-label="Output width (px)"
          className={FIELD_CLASS}
          type="number"
          min={16}
          max={16384}
          disabled={sizeBy !== "width"}
          {...register("widthPx", asNumber)}
        />
      </label>
      <label>
        <input type="radio" value="scale" {...register("sizeBy")} /> Scale (µm/px)
        <input
          aria-label="Output scale (µm per pixel)"
          className={FIELD_CLASS}
          type="number"
          step="any"
          disabled={sizeBy !== "scale"}
          {...register("umPerPx", asNumber)}
        />
      </label>
    </div>
  );
}

/** Which kinds of markup are drawn, and whether labels and remark markers are. */
export function MarkupFields({ register }: { register: Register }) {
  return (
    <>
      <fieldset className="flex flex-wrap gap-x-3 text-xs">
        <legend>Markup shown</legend>
        {MARKUP_KINDS.map((k) => (
          <label key={k}>
            <input type="checkbox" value={k} {...register("kinds")} /> <span style={{ color: KIND_STYLE[k].colour }}>■</span> {KIND_STYLE[k].label}
          </label>
        ))}
      </fieldset>
      <div className="flex gap-3 text-xs">
        <label>
          <input type="checkbox" {...register("labels")} /> Labels
        </label>
        <label>
          <input type="checkbox" {...register("threads")} /> Remarks
        </label>
      </div>
    </>
  );
}
