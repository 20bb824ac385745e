import type { ExportDto } from "@/lib/dto/exports";

/** The die's tables and report, each a plain download link. */
export function TableDownloads({ dieId }: { dieId: string }) {
  return (
    <section aria-label="Downloads" className="space-y-1 text-xs">
      <h3 className="font-semibold uppercase tracking-wide text-ink-400">Tables and report</h3>
      <a className="mr-3 underline" href={`/api/dies/${dieId}/pads.csv`}>
        Pad table (CSV)
      </a>
      <a className="mr-3 underline" href={`/api/dies/${dieId}/markup.csv`}>
        Markup table (CSV)
      </a>
      <a className="mr-3 underline" href={`/api/dies/${dieId}/markup.geojson`}>
        Markup (GeoJSON)
      </a>
      <a className="underline" href={`/api/dies/${dieId}/report.pdf`}>
        Die report (PDF)
      </a>
    </section>
  );
}

/** The die's recent PNG exports: file link when ready, size, who made it and when. */
export function RecentExports({ list }: { list: readonly ExportDto[] }) {
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
