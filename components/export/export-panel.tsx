"use client";

import { useEffect, useState } from "react";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { apiFetch } from "@/lib/client/api";
import type { DieDto } from "@/lib/dto/dies";
import type { MicrographDto } from "@/lib/dto/micrographs";
import type { ExportDto } from "@/lib/dto/exports";
import type { ExportPreviewDto } from "@/lib/dto/export-preview";
import type { ViewerApi } from "@/components/viewer";
import { Button } from "@/components/ui/button";
import { MARKUP_KINDS, type MarkupKind } from "@/lib/markup/types";
import { KIND_STYLE } from "@/lib/markup/palette";
import { dieRegionOfImageCorners } from "@/lib/export/view-region";
import type { DieRegion } from "@/lib/export/render-plan";
import { ImportGeojson } from "./import-geojson";

type RegionMode = "view" | "die" | "typed";

function currentViewRegion(api: ViewerApi | null, m: MicrographDto | undefined): DieRegion | null {
  if (!api || !m?.transform) return null;
  const el = api.viewer.element;
  const [w, h] = [el.clientWidth, el.clientHeight];
  const corners = [api.screenToImage(0, 0), api.screenToImage(w, 0), api.screenToImage(w, h), api.screenToImage(0, h)];
  return dieRegionOfImageCorners(m.transform, corners);
}

const round = (r: DieRegion) => ({ x: +r.x.toFixed(2), y: +r.y.toFixed(2), width: +r.width.toFixed(2), height: +r.height.toFixed(2) });

/** The Export tab: annotated PNG form with progress, recent exports, table downloads, GeoJSON import. */
export function ExportPanel({ die, micrographs, api, shownId }: { die: DieDto; micrographs: MicrographDto[]; api: ViewerApi | null; shownId?: string }) {
  const qc = useQueryClient();
  const usable = micrographs.filter((m) => m.transform && m.status !== "failed");
  const [picked, setMicrographId] = useState("");
  // The list may arrive after the first render: until the user picks, follow the viewer's micrograph.
  const micrographId = usable.some((m) => m.id === picked) ? picked : shownId && usable.some((m) => m.id === shownId) ? shownId : (usable[0]?.id ?? "");
  const [mode, setMode] = useState<RegionMode>("die");
  const [typed, setTyped] = useState<DieRegion>({ x: 0, y: 0, width: die.widthUm ?? 1000, height: die.heightUm ?? 1000 });
  const [sizeBy, setSizeBy] = useState<"width" | "scale">("width");
  const [widthPx, setWidthPx] = useState(2048);
  const [umPerPx, setUmPerPx] = useState(1);
  const [kinds, setKinds] = useState<Set<MarkupKind>>(new Set(MARKUP_KINDS));
  const [labels, setLabels] = useState(true);
  const [threads, setThreads] = useState(false);
  const [activeId, setActiveId] = useState<string | null>(null);
  const [error, setError] = useState("");
  const micrograph = usable.find((m) => m.id === micrographId);

  const list = useQuery({
    queryKey: ["exports", die.id],
    queryFn: () => apiFetch<ExportDto[]>(`/api/dies/${die.id}/exports`),
    refetchInterval: (q) => (q.state.data?.some((e) => e.status === "queued" || e.status === "running") ? 700 : false),
  });
  const active = list.data?.find((e) => e.id === activeId);

  /** The request body the form describes right now (the current view is read when asked). */
  const requestBody = () => {
    const region = mode === "view" ? currentViewRegion(api, micrograph) : mode === "typed" ? typed : null;
    if (mode === "view" && !region) throw new Error("Open the micrograph in the viewer to export the current view.");
    return {
      micrographId,
      ...(region ? { region: round(region) } : {}),
      ...(sizeBy === "width" ? { widthPx } : { umPerPx }),
      kinds: [...kinds],
      labels,
      threads,
    };
  };
  // Redrawn when any field changes; the current view is re-read by "Refresh preview".
  const [viewRead, setViewRead] = useState(0);
  const formKey = JSON.stringify([micrographId, mode, typed, sizeBy, widthPx, umPerPx, [...kinds], labels, threads, viewRead]);

  const start = useMutation({
    mutationFn: () => apiFetch<ExportDto>(`/api/dies/${die.id}/exports`, { method: "POST", body: requestBody() }),
    onSuccess: (e) => {
      setError("");
      setActiveId(e.id);
      void qc.invalidateQueries({ queryKey: ["exports", die.id] });
    },
    onError: (e) => setError(e.message),
  });

  const num = (v: string) => (v === "" ? 0 : Number(v));
  const field = "w-full rounded border border-ink-700 bg-ink-900 px-2 py-1 text-sm text-ink-100";
  return (
    <div className="space-y-5 text-sm text-ink-200">
      <section aria-label="Annotated image" className="space-y-2">
        <h3 className="text-xs font-semibold uppercase tracking-wide text-ink-400">Annotated image (PNG)</h3>
        {usable.length === 0 ? (
          <p className="text-xs text-ink-400">No micrograph is in the die frame yet: set a scale or align one first.</p>
        ) : (
          <form
            className="space-y-2"
            onSubmit={(e) => {
              e.preventDefault();
              start.mutate();
            }}
          >
            <label className="block text-xs">
              Micrograph
              <select className={field} value={micrographId} onChange={(e) => setMicrographId(e.target.value)}>
                {usable.map((m) => (
                  <option key={m.id} value={m.id}>
                    {m.label}
                  </option>
                ))}
              </select>
            </label>
            <fieldset className="text-xs">
              <legend>Region</legend>
              {(["view", "die", "typed"] as const).map((r) => (
                <label key={r} className="mr-3">
                  <input type="radio" name="region" checked={mode === r} onChange={() => setMode(r)} />{" "}
                  {r === "view" ? "Current view" : r === "die" ? "Whole die" : "Rectangle (µm)"}
                </label>
              ))}
            </fieldset>
            {mode === "typed" && (
              <div className="grid grid-cols-4 gap-1 text-xs">
                {(["x", "y", "width", "height"] as const).map((k) => (
                  <label key={k}>
                    {k}
                    <input
                      aria-label={`Region ${k} (µm)`}
                      className={field}
                      type="number"
                      value={typed[k]}
                      onChange={(e) => setTyped({ ...typed, [k]: num(e.target.value) })}
                    />
                  </label>
                ))}
              </div>
            )}
            <div className="flex items-end gap-2 text-xs">
              <label>
                <input type="radio" name="size" checked={sizeBy === "width"} onChange={() => setSizeBy("width")} /> Width (px)
                <input
                  aria-label="Output width (px)"
                  className={field}
                  type="number"
                  min={16}
                  max={16384}
                  value={widthPx}
                  disabled={sizeBy !== "width"}
                  onChange={(e) => setWidthPx(num(e.target.value))}
                />
              </label>
              <label>
                <input type="radio" name="size" checked={sizeBy === "scale"} onChange={() => setSizeBy("scale")} /> Scale (µm/px)
                <input
                  aria-label="Output scale (µm per pixel)"
                  className={field}
                  type="number"
                  step="any"
                  value={umPerPx}
                  disabled={sizeBy !== "scale"}
                  onChange={(e) => setUmPerPx(num(e.target.value))}
                />
              </label>
            </div>
            <fieldset className="flex flex-wrap gap-x-3 text-xs">
              <legend>Markup shown</legend>
              {MARKUP_KINDS.map((k) => (
                <label key={k}>
                  <input
                    type="checkbox"
                    checked={kinds.has(k)}
                    onChange={(e) => setKinds((s) => (e.target.checked ? new Set([...s, k]) : new Set([...s].filter((x) => x !== k))))}
                  />{" "}
                  <span style={{ color: KIND_STYLE[k].colour }}>■</span> {KIND_STYLE[k].label}
                </label>
              ))}
            </fieldset>
            <div className="flex gap-3 text-xs">
              <label>
                <input type="checkbox" checked={labels} onChange={(e) => setLabels(e.target.checked)} /> Labels
              </label>
              <label>
                <input type="checkbox" checked={threads} onChange={(e) => setThreads(e.target.checked)} /> Review threads
              </label>
            </div>
            <ExportPreview dieId={die.id} formKey={formKey} body={requestBody} onRefresh={() => setViewRead((n) => n + 1)} />
            <Button type="submit" variant="primary" disabled={start.isPending}>
              Render PNG
            </Button>
            <p role="status" aria-live="polite" className="text-xs text-red-300">
              {error}
            </p>
          </form>
        )}
        {active && <ExportStatus e={active} />}
      </section>
      <section aria-label="Downloads" className="space-y-1 text-xs">
        <h3 className="font-semibold uppercase tracking-wide text-ink-400">Tables and report</h3>
        <a className="mr-3 underline" href={`/api/dies/${die.id}/pads.csv`}>
          Pad table (CSV)
        </a>
        <a className="mr-3 underline" href={`/api/dies/${die.id}/markup.csv`}>
          Markup table (CSV)
        </a>
        <a className="mr-3 underline" href={`/api/dies/${die.id}/markup.geojson`}>
          Markup (GeoJSON)
        </a>
        <a className="underline" href={`/api/dies/${die.id}/report.pdf`}>
          Die report (PDF)
        </a>
      </section>
      <RecentExports list={list.data ?? []} />
      {(die.yourRole === "owner" || die.yourRole === "analyst") && <ImportGeojson dieId={die.id} />}
    </div>
  );
}

/** The last value after it has stopped changing for `ms`. */
function useSettled<T>(value: T, ms: number): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setSettled(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return settled;
}

/** A small rendering of what "Render PNG" would produce, its final size, and any warning or refusal. */
function ExportPreview({ dieId, formKey, body, onRefresh }: { dieId: string; formKey: string; body: () => unknown; onRefresh: () => void }) {
  const key = useSettled(formKey, 400);
  const preview = useQuery({
    queryKey: ["export-preview", dieId, key],
    queryFn: () => apiFetch<ExportPreviewDto>(`/api/dies/${dieId}/exports/preview`, { method: "POST", body: body() }),
    retry: false,
    staleTime: Infinity,
    placeholderData: (previous) => previous,
  });
  const p = preview.data;
  return (
    <figure aria-label="Export preview" aria-busy={preview.isFetching} className="space-y-1 rounded border border-ink-800 bg-ink-950 p-2 text-xs">
      {p ? (
        // A data: URL rendered on request, not a static asset: next/image has nothing to optimise.
        // eslint-disable-next-line @next/next/no-img-element
        <img
          src={`data:image/png;base64,${p.png}`}
          alt="Preview of the annotated PNG"
          width={p.previewWidth}
          height={p.previewHeight}
          className={`h-auto w-full ${preview.isFetching ? "opacity-60" : ""}`}
        />
      ) : (
        <div className="flex h-32 items-center justify-center text-ink-500">{preview.isError ? "No preview" : "Rendering preview…"}</div>
      )}
      <figcaption className="flex items-center justify-between gap-2">
        <span data-testid="export-preview-size">
          {p ? `${p.width} × ${p.height} px at ${p.umPerPx.toPrecision(3)} µm/px` : ""}
          {preview.isFetching && p ? " · updating…" : ""}
        </span>
        <button type="button" className="underline" onClick={onRefresh}>
          Refresh preview
        </button>
      </figcaption>
      {preview.isError && (
        <p role="alert" className="text-red-300">
          {(preview.error as Error).message}
        </p>
      )}
      {!preview.isError &&
        p?.warnings.map((w) => (
          <p key={w} className="text-amber-300">
            {w}
          </p>
        ))}
    </figure>
  );
}

function ExportStatus({ e }: { e: ExportDto }) {
  return (
    <div className="space-y-1 text-xs" data-testid="export-status">
      <progress className="w-full" max={100} value={e.progress} aria-label="Rendering progress" />
      <p>
        {e.status === "done" && e.fileUrl ? (
          <a className="underline" href={e.fileUrl} download>
            Download {e.fileName}
          </a>
        ) : e.status === "failed" ? (
          <span className="text-red-300">{e.error}</span>
        ) : (
          `Rendering… ${e.progress} %`
        )}
      </p>
      {e.warnings.map((w) => (
        <p key={w} className="text-amber-300">
          {w}
        </p>
      ))}
    </div>
  );
}

function RecentExports({ list }: { list: ExportDto[] }) {
  if (list.length === 0) return null;
  return (
    <section aria-label="Recent exports" className="space-y-1 text-xs">
      <h3 className="font-semibold uppercase tracking-wide text-ink-400">Recent exports</h3>
      <ul className="space-y-1">
        {list.map((e) => (
          <li key={e.id}>
            {e.fileUrl ? (
              <a className="underline" href={e.fileUrl}>
                {e.fileName}
              </a>
            ) : (
              <span>{e.status}</span>
            )}{" "}
            · {e.result ? `${e.result.width} × ${e.result.height} px` : ""} · {e.createdByName ?? ""} · {e.createdAt.slice(0, 16).replace("T", " ")}
          </li>
        ))}
      </ul>
    </section>
  );
}
