"use client";

import { useState } from "react";
import { useQueryClient } from "@tanstack/react-query";
import { queryKeys } from "@/lib/client/query-keys";
import type { MicrographDto } from "@/lib/dto/micrographs";
import { apiFetch } from "@/lib/client/api";
import { CalibrationTool, MicrographViewer, type MicrographSource, type ViewerApi } from "@/components/viewer";
import { Button } from "@/components/ui/button";

function sourceOf(m: MicrographDto): MicrographSource | null {
  if (m.status === "ready") return { kind: "iiif", infoUrl: `/api/micrographs/${m.id}/iiif/info.json` };
  if (m.previewWidth && m.previewHeight) return { kind: "image", url: `/api/micrographs/${m.id}/preview`, width: m.previewWidth, height: m.previewHeight };
  return null;
}

/**
 * The work area: the selected micrograph in the viewer (its preview while the pyramid is
 * built), with the two-point calibration tool for those who may edit.
 */
export function ViewerPane({
  micrograph,
  canEdit,
  onViewer,
  overlay,
}: {
  micrograph: MicrographDto | null;
  canEdit: boolean;
  onViewer?: (api: ViewerApi | null) => void;
  overlay?: React.ReactNode;
}) {
  const qc = useQueryClient();
  const [api, setApi] = useState<ViewerApi | null>(null);
  const [calibrating, setCalibrating] = useState(false);
  const [error, setError] = useState<string | null>(null);
  if (!micrograph) return <Empty text="No micrographs on this die yet. Upload one to start reading it." />;
  const source = sourceOf(micrograph);
  if (!source || !micrograph.width || !micrograph.height) {
    return (
      <Empty
        text={
          micrograph.status === "failed"
            ? `This micrograph could not be tiled: ${micrograph.error}`
            : `Preparing “${micrograph.label}”… ${micrograph.progress} %`
        }
      />
    );
  }
  return (
    <div className="relative h-full w-full">
      <MicrographViewer
        key={micrograph.id}
        source={source}
        imageWidth={micrograph.width}
        imageHeight={micrograph.height}
        umPerPx={micrograph.scaleUmPerPx}
        transform={micrograph.transform}
        numericalAperture={micrograph.numericalAperture}
        onReady={(a) => {
          setApi(a);
          onViewer?.(a);
        }}
        className="h-full w-full"
      >
        {overlay}
        {api && (
          <CalibrationTool
            api={api}
            active={calibrating}
            onCancel={() => setCalibrating(false)}
            onCalibrate={async (c) => {
              setError(null);
              try {
                await apiFetch(`/api/micrographs/${micrograph.id}`, { method: "PATCH", body: { calibration: c } });
                await qc.invalidateQueries({ queryKey: queryKeys.micrographs(micrograph.dieId) });
                setCalibrating(false);
              } catch (e) {
                setError((e as Error).message);
              }
            }}
          />
        )}
      </MicrographViewer>
      {canEdit && !calibrating && (
        <div className="absolute right-3 top-3 flex flex-col items-end gap-1">
          <Button onClick={() => setCalibrating(true)}>{micrograph.scaleUmPerPx ? "Recalibrate scale" : "Calibrate scale"}</Button>
        </div>
      )}
      {error && (
        <p role="alert" className="absolute right-3 top-14 rounded bg-ink-900 px-2 py-1 text-sm text-danger-400">
          {error}
        </p>
      )}
      {micrograph.status !== "ready" && (
        <p className="absolute left-1/2 top-3 -translate-x-1/2 rounded bg-ink-900/90 px-3 py-1 text-xs text-ink-200" role="status">
          Showing the preview while the full-resolution pyramid is built ({micrograph.progress} %)
        </p>
      )}
    </div>
  );
}

function Empty({ text }: { text: string }) {
  return (
    <div className="flex h-full items-center justify-center p-6">
      <p className="max-w-md text-center text-sm text-ink-400" role="status">
        {text}
      </p>
    </div>
  );
}
