"use client";

import { useState } from "react";
import { useQueryClient } from "@tanstack/react-query";
import { apiFetch, ApiError } from "@/lib/client/api";
import { Button } from "@/components/ui/button";

type Preview = { dryRun: boolean; total: number; counts: Record<string, number>; unlinkedWireBonds: number };

/** GeoJSON import: pick a file, see what a dry run would add, then import it (all or nothing). */
export function ImportGeojson({ dieId }: { dieId: string }) {
  const qc = useQueryClient();
  const [body, setBody] = useState<unknown>(null);
  const [preview, setPreview] = useState<Preview | null>(null);
  const [message, setMessage] = useState("");
  const url = `/api/dies/${dieId}/markup/import`;

  async function pick(file: File | undefined) {
    setPreview(null);
    setMessage("");
    if (!file) return;
    try {
      const parsed = JSON.parse(await file.text());
      setBody(parsed);
      setPreview(await apiFetch<Preview>(`${url}?dryRun=1`, { method: "POST", body: parsed }));
    } catch (e) {
      setBody(null);
      setMessage(e instanceof ApiError ? e.message : "The file is not valid JSON.");
    }
  }

  async function run() {
    try {
      const r = await apiFetch<Preview>(url, { method: "POST", body });
      setMessage(`Imported ${r.total} shapes.`);
      setPreview(null);
      setBody(null);
      await qc.invalidateQueries();
    } catch (e) {
      setMessage(e instanceof Error ? e.message : "The import failed.");
    }
  }

  return (
    <section className="space-y-2" aria-label="Import GeoJSON">
      <h3 className="text-xs font-semibold uppercase tracking-wide text-ink-400">Import markup (GeoJSON)</h3>
      <input
        type="file"
        accept=".geojson,.json,application/geo+json,application/json"
        aria-label="GeoJSON file"
        onChange={(e) => pick(e.target.files?.[0])}
        className="block w-full text-xs text-ink-300"
      />
      {preview && (
        <div className="rounded border border-ink-700 p-2 text-xs text-ink-200" data-testid="import-preview">
          <p>
            Would add {preview.total} shapes:{" "}
            {Object.entries(preview.counts)
              .map(([k, n]) => `${n} ${k.replace("_", " ")}`)
              .join(", ")}
            .{preview.unlinkedWireBonds > 0 && ` ${preview.unlinkedWireBonds} wire bonds name a pad not in the file and lose that link.`}
          </p>
          <Button onClick={run}>Import {preview.total} shapes</Button>
        </div>
      )}
      <p aria-live="polite" className="text-xs text-ink-300">
        {message}
      </p>
    </section>
  );
}
