import type { ExportDto } from "@/lib/dto/exports";

/** Progress of the export just started: a bar while it renders, then its download link or the reason it failed. */
export function ExportStatus({ e }: { e: ExportDto }) {
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
