"use client";

import { isUnderSampled, rayleighResolutionUm, DEFAULT_WAVELENGTH_NM } from "@/lib/micrographs/resolution";

/** The smallest distance the objective resolves, and a warning when pixels are too coarse for it. */
export function ResolutionNote({ umPerPx, numericalAperture }: { umPerPx: number | null; numericalAperture: number | null | undefined }) {
  if (numericalAperture == null || !(numericalAperture > 0) || !Number.isFinite(numericalAperture)) return null;
  const resolutionUm = rayleighResolutionUm(numericalAperture);
  const under = umPerPx !== null && umPerPx > 0 && isUnderSampled(umPerPx, resolutionUm);
  return (
    <div
      data-testid="resolution-note"
      data-resolution-um={resolutionUm}
      className="max-w-xs select-none rounded-md bg-ink-950/80 px-2 py-1 text-xs text-ink-300"
    >
      <p>
        Optical resolution ≈ {resolutionUm.toPrecision(2)} µm{" "}
        <span className="text-ink-400">
          (Rayleigh, NA {numericalAperture.toFixed(2)}, {DEFAULT_WAVELENGTH_NM} nm)
        </span>
      </p>
      {under && (
        <p data-testid="undersampled-warning" role="note" className="mt-0.5 text-danger-400">
          Under-sampled: pixels are larger than half the optical resolution — finer measurements are not meaningful
        </p>
      )}
    </div>
  );
}
