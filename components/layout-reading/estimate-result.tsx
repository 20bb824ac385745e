"use client";

import type { EstimateMeta } from "@/lib/estimates";
import { EstimateInputError } from "@/lib/estimates";
import { threeFigures } from "@/lib/layout-reading/saved-estimates";

/** Plain names of the numbers the estimates return. */
const NAMES: Record<string, string> = {
  inductanceNh: "Inductance",
  selfInductanceNh: "Self inductance of one bond",
  mutualNh: "Mutual inductance of neighbours",
  inductiveSplitNh: "Inductance if current splits by inductance",
  z0Ohm: "Characteristic impedance Z0",
  effectivePermittivity: "Effective permittivity εe",
  widthOverHeight: "Width / height",
  innerDiameterUm: "Inner diameter",
  averageDiameterUm: "Average diameter",
  fillRatio: "Fill ratio ρ",
};

/** The outcome of running a formula on the typed inputs. */
export type Outcome<T extends EstimateMeta> = { ok: true; result: T } | { ok: false; parameter: string; message: string };

/** Runs an estimate; bad input becomes a message naming the parameter instead of a throw. */
export function runEstimate<T extends EstimateMeta>(compute: () => T): Outcome<T> {
  try {
    return { ok: true, result: compute() };
  } catch (e) {
    if (e instanceof EstimateInputError) return { ok: false, parameter: e.parameter, message: e.message };
    throw e;
  }
}

/** Numbers with units, the formula and its published source, and any validity warnings. */
export function EstimateResult<T extends EstimateMeta>({ title, outcome, testId }: { title: string; outcome: Outcome<T>; testId: string }) {
  if (!outcome.ok) {
    return (
      <p role="alert" data-testid={`${testId}-error`} className="text-xs text-danger-400">
        {outcome.message}
      </p>
    );
  }
  const r = outcome.result as T & Record<string, unknown>;
  const rows = Object.entries(r.units).filter(([k]) => typeof r[k] === "number" && Number.isFinite(r[k] as number));
  return (
    <div className="flex flex-col gap-1.5" data-testid={testId}>
      <dl className="grid grid-cols-[1fr_auto] gap-x-3 gap-y-0.5 text-sm">
        {rows.map(([k, unit]) => (
          <div key={k} className="contents">
            <dt className="text-ink-300">{NAMES[k] ?? k}</dt>
            <dd className="text-right tabular-nums text-ink-100" data-testid={`${testId}-${k}`} data-value={String(r[k])}>
              {threeFigures(r[k] as number)} {unit === "1" ? "" : unit}
            </dd>
          </div>
        ))}
      </dl>
      <p className="text-[11px] text-ink-400">
        <span className="text-ink-300">{title}.</span> {r.formula}
      </p>
      <p className="text-[11px] text-ink-400">Source: {r.source}</p>
      {r.warnings.length > 0 && (
        <ul className="list-disc pl-4 text-[11px] text-kerf-300" aria-label={`${title}: warnings`}>
          {r.warnings.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      )}
    </div>
  );
}
