"use client";

import { useEffect, useState } from "react";
import { Button } from "@/components/ui/button";
import { CalibrationForm } from "./calibration-form";
import { CalibrationMarks } from "./calibration-marks";
import { usePointPicker } from "./use-point-picker";
import type { ViewerApi } from "./viewer-api";

/** A two-point calibration in full-resolution image px and the true length between them. */
type Calibration = { p1: [number, number]; p2: [number, number]; lengthUm: number };

type Props = {
  api: ViewerApi | null;
  active: boolean;
  onCalibrate: (c: Calibration) => Promise<void> | void;
  onCancel: () => void;
};

/**
 * Two-point calibration over a feature of known length: click both ends on the image, type
 * the length, and the scale follows. Render it inside the viewer's overlay layer.
 */
export function CalibrationTool({ api, active, ...rest }: Props) {
  // Mounting only while active gives every calibration fresh points.
  return active && api ? <ActiveCalibration api={api} {...rest} /> : null;
}

/**
 * Escape ends the calibration. Listened for in the capture phase: the markup editor takes its
 * keys there and stops them, which would otherwise keep Escape from ever reaching us.
 */
function useEscape(onCancel: () => void) {
  useEffect(() => {
    const key = (e: KeyboardEvent) => {
      if (e.key === "Escape") onCancel();
    };
    window.addEventListener("keydown", key, true);
    return () => window.removeEventListener("keydown", key, true);
  }, [onCancel]);
}

function ActiveCalibration({ api, onCalibrate, onCancel }: Omit<Props, "api" | "active"> & { api: ViewerApi }) {
  const [points, setPoints] = useState<[number, number][]>([]);
  // A third pick starts over, so a misplaced pair is fixed by clicking again.
  const [pick] = useState(() => (p: [number, number]) => setPoints((prev) => (prev.length >= 2 ? [p] : [...prev, p])));
  usePointPicker(api, true, pick);
  useEscape(onCancel);
  const [p1, p2] = points;
  const distancePx = p1 && p2 ? Math.hypot(p2[0] - p1[0], p2[1] - p1[1]) : 0;

  const submit = async (lengthUm: number) => {
    if (!(distancePx > 0)) throw new Error("The two points are the same; pick two distinct points.");
    await onCalibrate({ p1, p2, lengthUm });
  };

  return (
    <div data-testid="calibration-tool" className="absolute inset-0">
      <CalibrationMarks api={api} points={points} />
      <div className="pointer-events-auto absolute left-1/2 top-2 z-30 w-72 -translate-x-1/2 rounded-lg border border-ink-700 bg-ink-900/95 p-3 text-sm shadow-lg">
        <h2 className="mb-1 text-sm font-semibold text-ink-100">Calibrate scale</h2>
        {points.length < 2 ? (
          <div className="flex items-center justify-between gap-2">
            <p aria-live="polite" className="text-xs text-ink-300">
              {points.length === 0 ? "Click one end of a feature of known length." : "Click the other end."} Esc cancels.
            </p>
            <Button variant="ghost" onClick={onCancel}>
              Cancel
            </Button>
          </div>
        ) : (
          <CalibrationForm distancePx={distancePx} onSubmit={submit} onCancel={onCancel} />
        )}
      </div>
    </div>
  );
}
