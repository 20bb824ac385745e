"use client";

import { useMemo, useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { queryKeys } from "@/lib/client/query-keys";
import type { DieDto } from "@/lib/dto/dies";
import type { PadTable } from "@/lib/pads/types";
import type { AnyShape } from "@/lib/markup/types";
import { shapeLabel } from "@/lib/markup/markup-table";
import { waferEstimate, YIELD_MODELS, type YieldModel } from "@/lib/estimates";
import { dieSize, padDensity, padStateCounts, savedEstimateRows } from "@/lib/layout-reading/die-summary";
import { summariseSavedEstimate, threeFigures } from "@/lib/layout-reading/saved-estimates";
import { apiFetch } from "@/lib/client/api";
import { formatUm } from "@/lib/units/format-um";
import { KIND_STYLE } from "@/components/annotate/palette";
import { runEstimate } from "./estimate-result";
import { NumberInput, parseNumber, SelectInput } from "./fields";

const WAFERS_MM = [150, 200, 300] as const;
const MODEL_NAMES: Record<YieldModel, string> = {
  poisson: "Poisson",
  murphy: "Murphy",
  "negative-binomial": "negative binomial (α)",
  "bose-einstein": "Bose–Einstein (N)",
};
const SOURCE_TEXT = {
  die_outline: "from the marked die outline",
  outline_box: "bounding box of the marked outline (not a rectangle)",
  recorded: "from the die's recorded size",
};

function Row({ label, value, testId }: { label: string; value: string; testId?: string }) {
  return (
    <div className="contents">
      <dt className="text-ink-300">{label}</dt>
      <dd className="text-right tabular-nums" data-testid={testId}>
        {value}
      </dd>
    </div>
  );
}

/** Gross and good dies per wafer for the die's size, for a typed defect density and yield model. */
function WaferEconomics({ widthUm, heightUm }: { widthUm: number; heightUm: number }) {
  const [density, setDensity] = useState("0.1");
  const [model, setModel] = useState<YieldModel>("negative-binomial");
  const [alpha, setAlpha] = useState("4");
  const outcomes = WAFERS_MM.map((d) =>
    runEstimate(() =>
      waferEstimate({
        waferDiameterMm: d,
        dieWidthMm: widthUm / 1000,
        dieHeightMm: heightUm / 1000,
        defectDensityPerCm2: parseNumber(density),
        model,
        alpha: parseNumber(alpha),
      }),
    ),
  );
  const first = outcomes[0];
  return (
    <section aria-label="Wafer economics" className="flex flex-col gap-2">
      <h3 className="text-xs font-semibold uppercase tracking-wide text-ink-300">Dies per wafer</h3>
      <div className="grid grid-cols-2 gap-2">
        <NumberInput id="wafer-density" label="Defect density" unit="/cm²" value={density} onChange={setDensity} />
        <SelectInput id="wafer-model" label="Yield model" value={model} onChange={setModel} options={YIELD_MODELS.map((m) => [m, MODEL_NAMES[m]] as const)} />
        {model === "negative-binomial" && <NumberInput id="wafer-alpha" label="Clustering α" value={alpha} onChange={setAlpha} />}
      </div>
      {!first.ok ? (
        <p role="alert" className="text-xs text-danger-400">
          {first.message}
        </p>
      ) : (
        <>
          <table className="w-full text-sm">
            <thead className="text-[11px] uppercase text-ink-400">
              <tr>
                <th className="text-left font-medium">Wafer</th>
                <th className="text-right font-medium">Gross dies</th>
                <th className="text-right font-medium">Yield</th>
                <th className="text-right font-medium">Good dies</th>
              </tr>
            </thead>
            <tbody className="tabular-nums">
              {outcomes.map((o, i) =>
                o.ok ? (
                  <tr key={WAFERS_MM[i]} data-testid={`wafer-${WAFERS_MM[i]}`}>
                    <td>{WAFERS_MM[i]} mm</td>
                    <td className="text-right">{o.result.grossDies}</td>
                    <td className="text-right">{(o.result.yield * 100).toFixed(1)} %</td>
                    <td className="text-right">{o.result.goodDies}</td>
                  </tr>
                ) : null,
              )}
            </tbody>
          </table>
          <p className="text-[11px] text-ink-400">
            {first.result.formula}. Source: {first.result.source}.
          </p>
        </>
      )}
    </section>
  );
}

/** The die in one panel: size, pads and their density and pitch, states, wafer economics, saved estimates. */
export function DieSummaryPanel({
  die,
  shapes,
  onPick,
  umPerPx = null,
}: {
  die: DieDto;
  shapes: readonly AnyShape[];
  onPick: (id: string) => void;
  umPerPx?: number | null;
}) {
  const pads = useQuery({
    queryKey: queryKeys.pads(die.id),
    queryFn: () => apiFetch<PadTable & { outlineSource: string }>(`/api/dies/${die.id}/pads`),
    retry: false,
  });
  const size = dieSize(shapes, die);
  const counts = padStateCounts(shapes);
  const estimates = useMemo(() => savedEstimateRows(shapes, shapeLabel), [shapes]);
  const density = size ? padDensity(counts.total, size.widthUm, size.heightUm) : null;
  const minPitch = pads.data?.summary.minPitchUm;
  return (
    <section aria-label="Die summary" className="flex flex-col gap-4">
      <dl className="grid grid-cols-[1fr_auto] gap-x-3 gap-y-1 text-sm">
        {size && density ? (
          <>
            <Row label="Die size" value={`${formatUm(size.widthUm, umPerPx)} × ${formatUm(size.heightUm, umPerPx)} µm`} testId="summary-size" />
            <Row label="Area" value={`${density.areaMm2.toFixed(3)} mm²`} testId="summary-area" />
          </>
        ) : (
          <Row label="Die size" value="unknown: draw the die outline or enter the die's size" />
        )}
        <Row label="Pads" value={String(counts.total)} testId="summary-pads" />
        {density && counts.total > 0 && (
          <>
            <Row label="Pads per mm of edge" value={density.padsPerMm.toFixed(2)} />
            <Row label="Pads per mm²" value={density.padsPerMm2.toFixed(2)} />
          </>
        )}
        <Row
          label="Smallest pad pitch"
          value={typeof minPitch === "number" ? `${formatUm(minPitch, umPerPx)} µm` : pads.isPending ? "…" : "—"}
          testId="summary-min-pitch"
        />
        <Row label="Bonded / probed / unbonded" value={`${counts.bonded} / ${counts.probed} / ${counts.unbonded}`} testId="summary-states" />
      </dl>
      {size && <p className="-mt-3 text-[11px] text-ink-400">Size {SOURCE_TEXT[size.source]}.</p>}
      {size && <WaferEconomics widthUm={size.widthUm} heightUm={size.heightUm} />}
      <section aria-label="Saved estimates" className="flex flex-col gap-1">
        <h3 className="text-xs font-semibold uppercase tracking-wide text-ink-300">Estimates saved on shapes</h3>
        {estimates.length === 0 ? (
          <p className="text-xs text-ink-400">None yet: save one from the Estimates tab.</p>
        ) : (
          <ul className="flex flex-col gap-1 text-sm">
            {estimates.map((e) => (
              <li key={`${e.shapeId}:${e.key}`} className="flex items-baseline justify-between gap-2">
                <button
                  type="button"
                  onClick={() => onPick(e.shapeId)}
                  className="truncate text-left hover:underline"
                  style={{ color: KIND_STYLE[e.shapeKind].colour }}
                >
                  {e.label || KIND_STYLE[e.shapeKind].label}
                </button>
                <span className="tabular-nums">{summariseSavedEstimate(e.estimate) ?? threeFigures(Number.NaN)}</span>
              </li>
            ))}
          </ul>
        )}
      </section>
    </section>
  );
}
