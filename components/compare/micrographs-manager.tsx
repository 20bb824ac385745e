"use client";

import { useState } from "react";
import { useQueryClient } from "@tanstack/react-query";
import { queryKeys } from "@/lib/client/query-keys";
import type { MicrographDto } from "@/lib/dto/micrographs";
import { apiFetch } from "@/lib/client/api";
import { Button } from "@/components/ui/button";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { COMPARE_MODE_LABELS, type CompareMode } from "./compare-view";
import type { WorkMode } from "./work-mode";

type Props = { dieId: string; items: MicrographDto[]; editable: boolean; onWork: (w: WorkMode) => void };

/**
 * Managing a die's micrographs beside the list: order, name, which one is the reference,
 * delete, open the alignment of one, and compare two aligned ones.
 */
export function MicrographsManager({ dieId, items, editable, onWork }: Props) {
  const qc = useQueryClient();
  const [error, setError] = useState<string | null>(null);
  const [deleting, setDeleting] = useState<MicrographDto | null>(null);
  const aligned = items.filter((m) => m.transform);
  const [pick, setPick] = useState<{ top?: string; bottom?: string }>({});
  const top = pick.top ?? aligned[0]?.id;
  const bottom = pick.bottom ?? aligned.find((m) => m.id !== top)?.id;
  const refresh = () => qc.invalidateQueries({ queryKey: queryKeys.micrographs(dieId) });
  const run = async (f: () => Promise<unknown>) => {
    setError(null);
    try {
      await f();
      await refresh();
    } catch (e) {
      setError((e as Error).message);
    }
  };
  const move = (i: number, by: number) => {
    const ids = items.map((m) => m.id);
    [ids[i], ids[i + by]] = [ids[i + by], ids[i]];
    return run(() => apiFetch(`/api/dies/${dieId}/micrographs/order`, { method: "PUT", body: { ids } }));
  };
  const rename = (m: MicrographDto) => {
    const label = window.prompt("New name for the micrograph", m.label);
    if (label && label.trim() !== m.label) void run(() => apiFetch(`/api/micrographs/${m.id}`, { method: "PATCH", body: { label } }));
  };
  const fixedFor = (m: MicrographDto) => aligned.find((a) => a.isReference && a.id !== m.id) ?? aligned.find((a) => a.id !== m.id);

  return (
    <section aria-label="Alignment and comparison" className="flex flex-col gap-3 text-xs">
      <h2 className="text-sm font-semibold">Alignment and comparison</h2>
      <ul className="flex flex-col gap-1.5">
        {items.map((m, i) => (
          <li key={m.id} className="flex flex-wrap items-center gap-1.5 rounded border border-ink-800 p-1.5" data-testid={`manage-${m.id}`}>
            <span className="min-w-[8rem] flex-1 break-words text-ink-100" title={m.label}>
              {m.label}{" "}
              <span className={m.isReference ? "text-kerf-300" : m.transform ? "text-ok-400" : "text-ink-400"}>
                {m.isReference ? "reference" : m.transform ? "in die frame" : "not aligned"}
              </span>
            </span>
            {editable && (
              <>
                <Button className="px-1.5 py-0.5 text-xs" disabled={i === 0} onClick={() => move(i, -1)} aria-label={`Move ${m.label} up`}>
                  ↑
                </Button>
                <Button className="px-1.5 py-0.5 text-xs" disabled={i === items.length - 1} onClick={() => move(i, 1)} aria-label={`Move ${m.label} down`}>
                  ↓
                </Button>
                <Button className="px-1.5 py-0.5 text-xs" onClick={() => rename(m)}>
                  Rename
                </Button>
                {fixedFor(m) && m.status === "ready" && (
                  <Button className="px-1.5 py-0.5 text-xs" onClick={() => onWork({ kind: "align", movingId: m.id, fixedId: fixedFor(m)!.id })}>
                    {m.transform ? "Re-align" : "Align"}
                  </Button>
                )}
                {!m.isReference && m.transform && (
                  <Button className="px-1.5 py-0.5 text-xs" onClick={() => run(() => apiFetch(`/api/micrographs/${m.id}/reference`, { method: "PUT" }))}>
                    Make reference
                  </Button>
                )}
                <Button variant="danger" className="px-1.5 py-0.5 text-xs" onClick={() => setDeleting(m)}>
                  Delete
                </Button>
              </>
            )}
          </li>
        ))}
      </ul>
      {aligned.length >= 2 && top && bottom && (
        <div className="flex flex-col gap-2 rounded border border-ink-800 p-2">
          <label className="flex items-center gap-2">
            First
            <select
              aria-label="First micrograph"
              value={top}
              onChange={(e) => {
                const top = e.target.value;
                setPick((p) => ({ ...p, top }));
              }}
              className="min-w-0 flex-1 rounded bg-ink-800 px-1 py-0.5"
            >
              {aligned.map((m) => (
                <option key={m.id} value={m.id}>
                  {m.label}
                </option>
              ))}
            </select>
          </label>
          <label className="flex items-center gap-2">
            Second
            <select
              aria-label="Second micrograph"
              value={bottom}
              onChange={(e) => {
                const bottom = e.target.value;
                setPick((p) => ({ ...p, bottom }));
              }}
              className="min-w-0 flex-1 rounded bg-ink-800 px-1 py-0.5"
            >
              {aligned.map((m) => (
                <option key={m.id} value={m.id}>
                  {m.label}
                </option>
              ))}
            </select>
          </label>
          <div className="flex gap-1.5">
            {(Object.keys(COMPARE_MODE_LABELS) as CompareMode[]).map((mode) => (
              <Button
                key={mode}
                className="px-2 py-0.5 text-xs"
                disabled={top === bottom}
                onClick={() => onWork({ kind: "compare", topId: top, bottomId: bottom, mode })}
              >
                {COMPARE_MODE_LABELS[mode]}
              </Button>
            ))}
          </div>
        </div>
      )}
      {error && (
        <p role="alert" className="text-danger-400">
          {error}
        </p>
      )}
      <ConfirmDialog
        open={!!deleting}
        title="Delete this micrograph?"
        message={`“${deleting?.label ?? ""}” and its tiles will be deleted. Markup stays in the die frame.`}
        confirmLabel="Delete micrograph"
        onClose={() => setDeleting(null)}
        onConfirm={async () => {
          await apiFetch(`/api/micrographs/${deleting!.id}`, { method: "DELETE" });
          setDeleting(null);
          onWork({ kind: "view" });
          await refresh();
        }}
      />
    </section>
  );
}
