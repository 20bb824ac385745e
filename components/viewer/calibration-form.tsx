"use client";

import { useId, useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { parseKnownLength } from "./known-length";

/** Asks for the true length between the two calibration points. */
export function CalibrationForm({
  distancePx,
  onSubmit,
  onCancel,
}: {
  distancePx: number;
  onSubmit: (lengthUm: number) => Promise<void> | void;
  onCancel: () => void;
}) {
  const id = useId();
  const [text, setText] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const submit = async (e: FormEvent) => {
    e.preventDefault();
    const parsed = parseKnownLength(text);
    if (!parsed.ok) return setError(parsed.message);
    setError(null);
    setBusy(true);
    try {
      await onSubmit(parsed.value);
    } catch (err) {
      setError(err instanceof Error ? err.message : "The scale could not be saved.");
    } finally {
      setBusy(false);
    }
  };

  return (
    <form onSubmit={submit} aria-label="Two-point calibration" noValidate className="flex flex-col gap-2">
      <p className="text-xs text-ink-300">
        Distance between the points: <span className="tabular-nums text-ink-100">{distancePx.toFixed(1)} px</span>
      </p>
      <div className="flex flex-col gap-1">
        <label htmlFor={id} className="text-xs font-medium text-ink-300">
          Known length (µm)
        </label>
        <input
          id={id}
          inputMode="decimal"
          autoComplete="off"
          autoFocus
          value={text}
          onChange={(e) => setText(e.target.value)}
          aria-invalid={!!error}
          aria-describedby={error ? `${id}-error` : undefined}
          className="w-40 rounded-md border border-ink-700 bg-ink-900 px-2.5 py-1.5 text-sm text-ink-100 focus:border-kerf-500 focus:outline-none aria-[invalid=true]:border-danger-500"
        />
        {error && (
          <p id={`${id}-error`} role="alert" className="text-xs text-danger-400">
            {error}
          </p>
        )}
      </div>
      <div className="flex gap-2">
        <Button type="submit" variant="primary" disabled={busy}>
          {busy ? "Saving…" : "Set scale"}
        </Button>
        <Button onClick={onCancel}>Cancel</Button>
      </div>
    </form>
  );
}
