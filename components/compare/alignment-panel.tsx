"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { apiFetch } from "@/lib/client/api";
import { MIN_PAIRS } from "@/lib/alignment/fit";
import type { Affine2x3 } from "@/lib/geometry/types";
import type { useAlignmentSession } from "./use-alignment-session";

type Session = ReturnType<typeof useAlignmentSession>;
type Refined = {
  transform: Affine2x3;
  rmsBeforeUm: number | null;
  rmsAfterUm: number | null;
  shiftUm: [number, number];
  peak: number;
  minMatchStrength: number;
  improved: boolean | null;
  proposed: boolean;
  reason: string;
};

const um = (v: number) => `${v.toFixed(2)} µm`;

/** The pair list with residuals, the model, the mirrored option, refinement and accept. */
export function AlignmentPanel({
  movingId,
  fixedId,
  session,
  onAccepted,
  onCancel,
}: {
  movingId: string;
  fixedId: string;
  session: Session;
  onAccepted: () => void;
  onCancel: () => void;
}) {
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<string | null>(null);
  const [refined, setRefined] = useState<Refined | null>(null);
  const { pairs, solve, model, mirrored } = session;
  const need = MIN_PAIRS[model] - pairs.length;

  const save = async (transform?: Affine2x3) => {
    setBusy(true);
    setMessage(null);
    try {
      await apiFetch(`/api/micrographs/${movingId}/alignment`, { method: "PUT", body: { ...session.body, ...(transform ? { transform } : {}) } });
      onAccepted();
    } catch (e) {
      setMessage((e as Error).message);
    } finally {
      setBusy(false);
    }
  };
  const refine = async () => {
    if (!solve) return;
    setBusy(true);
    setMessage(null);
    try {
      setRefined(
        await apiFetch<Refined>(`/api/micrographs/${movingId}/alignment/refine`, {
          method: "POST",
          body: { transform: solve.transform, pairs: session.body.pairs, againstId: fixedId },
        }),
      );
    } catch (e) {
      setMessage((e as Error).message);
    } finally {
      setBusy(false);
    }
  };

  return (
    <aside aria-label="Control points" className="flex w-80 shrink-0 flex-col gap-3 overflow-y-auto border-l border-ink-800 bg-ink-900 p-3 text-sm">
      <h2 className="font-semibold">Alignment by control points</h2>
      <p className="text-xs text-ink-400" role="status" aria-live="polite">
        {session.pending
          ? `Now click the same feature on the aligned micrograph (right) for point ${pairs.length + 1}.`
          : `Click a feature on the new micrograph (left), then the same feature on the right.`}
      </p>
      <label className="flex min-w-0 items-center gap-2">
        Model
        <select
          value={model}
          onChange={(e) => session.setModel(e.target.value as typeof model)}
          className="min-w-0 flex-1 truncate rounded bg-ink-800 px-2 py-1"
          aria-label="Model"
        >
          <option value="similarity">Similarity (turn, scale, shift; 2+ points)</option>
          <option value="affine">Affine (also shear; 3+ points)</option>
        </select>
      </label>
      <label className="flex items-center gap-2 text-xs">
        <input type="checkbox" checked={mirrored} onChange={(e) => session.setMirrored(e.target.checked)} className="accent-kerf-500" /> This photo is mirrored
      </label>
      <table className="w-full text-xs" aria-label="Control-point pairs">
        <thead>
          <tr className="text-left text-ink-400">
            <th>#</th>
            <th>Image px</th>
            <th>Residual</th>
            <th />
          </tr>
        </thead>
        <tbody>
          {pairs.map((p, i) => {
            const r = solve?.residualsUm[i];
            const worst = solve && pairs.length > 1 && solve.worstIndex === i;
            return (
              <tr key={i} data-testid={`pair-row-${i + 1}`} className={worst ? "text-danger-400" : ""}>
                <td>{i + 1}</td>
                <td>
                  {p.imagePx[0].toFixed(1)}, {p.imagePx[1].toFixed(1)}
                </td>
                <td data-testid={`pair-residual-${i + 1}`}>
                  {r === undefined ? "–" : um(r)}
                  {worst ? " (worst)" : ""}
                </td>
                <td>
                  <button type="button" onClick={() => session.remove(i)} className="text-ink-400 hover:text-danger-400" aria-label={`Delete pair ${i + 1}`}>
                    Delete
                  </button>
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      {need > 0 ? <p className="text-xs text-ink-400">{`${need} more pair${need > 1 ? "s" : ""} needed for the ${model} model.`}</p> : null}
      {solve && (
        <p data-testid="alignment-rms">
          RMS <strong>{um(solve.rmsUm)}</strong> over {pairs.length} pairs
        </p>
      )}
      {session.error && (
        <p role="alert" className="text-danger-400">
          {session.error}
        </p>
      )}
      {message && (
        <p role="alert" className="text-danger-400">
          {message}
        </p>
      )}
      <div className="flex flex-wrap gap-2">
        <Button variant="primary" disabled={!solve || busy} onClick={() => save()}>
          Accept alignment
        </Button>
        <Button disabled={!solve || busy} onClick={refine}>
          Refine automatically
        </Button>
        <Button onClick={onCancel}>Close</Button>
      </div>
      {refined && (
        <section aria-label="Refinement" className="rounded border border-ink-700 p-2 text-xs" data-testid="refinement" data-proposed={refined.proposed}>
          <p>
            Image correlation would move the transform by {um(Math.hypot(...refined.shiftUm))}. RMS on the control points:{" "}
            {refined.rmsBeforeUm === null ? "–" : um(refined.rmsBeforeUm)} before, {refined.rmsAfterUm === null ? "–" : um(refined.rmsAfterUm)} after. Match
            strength {refined.peak.toFixed(2)}.
          </p>
          <p className={`mt-1 ${refined.proposed ? "text-ok-400" : "text-danger-400"}`} role="status" data-testid="refinement-verdict">
            {refined.reason}
          </p>
          <p className="mt-1 text-ink-400">
            Match strength is the height of the phase-correlation peak between the two micrographs&apos; edges in the die frame: 1 when they are the same
            picture shifted, near 0 when nothing lines up. Below {refined.minMatchStrength.toFixed(2)} it is too weak to use (our rule of thumb, not a
            standard).
          </p>
          <div className="mt-2 flex gap-2">
            {refined.proposed && (
              <Button variant="primary" disabled={busy} onClick={() => save(refined.transform)}>
                Accept refined
              </Button>
            )}
            <Button onClick={() => setRefined(null)}>{refined.proposed ? "Discard" : "Keep the control-point fit"}</Button>
          </div>
        </section>
      )}
    </aside>
  );
}
