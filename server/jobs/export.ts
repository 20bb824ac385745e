import "server-only";
import { rm } from "node:fs/promises";
import path from "node:path";
import type { Database } from "@/db/client";
import { expireExports, type ExportParams } from "@/server/access/exports";
import { exportForJob, setExportState } from "@/server/access/job-records";
import { userDisplayName } from "@/server/access/users";
import type { ExportResult } from "@/lib/dto/exports";
import { loadDieMicrograph, loadDieSources, loadThreadMarks, shapesOfKinds, sourceImageOf, titleBlockFor } from "@/server/access/export-sources";
import { planRender } from "@/lib/export/render-plan";
import { renderAnnotatedPngFile } from "@/server/images/render-png";
import { safeFileName } from "@/lib/markup/attachment";
import { exportKey, micrographKeys } from "../storage/keys";
import { localCopy, objectStore, scratchFolder, type LocalFile } from "../storage";
import { env } from "../env";
import type { JobHandler } from "./worker";

/** How often the export worker deletes expired exports: every 10 minutes, or twice per lifetime when that is shorter. */
const expirySweepMs = () => Math.min(10 * 60_000, (env().KERFLINE_EXPORT_TTL_HOURS * 3600_000) / 2);

/** The download name: case-die-micrograph-date.png, in safe ASCII. */
function exportFileName(caseTitle: string, dieName: string, micrograph: string, date: string): string {
  return `${[caseTitle, dieName, micrograph, date].map((p) => safeFileName(p)).join("-")}.png`;
}

/**
 * Renders one annotated PNG export: queued → running → done (file, size, result with scale bar
 * and warnings) or failed with a reason the UI shows. The caller's rights were checked when the
 * export was created.
 */
async function runExport(db: Database, exportId: string): Promise<void> {
  const row = await exportForJob(db, exportId);
  if (!row || row.status === "done") return;
  const params = row.params as ExportParams;
  const req = params.request;
  await setExportState(db, exportId, { status: "running", progress: 5, error: null });
  const src = await loadDieSources(db, row.dieId);
  const m = await loadDieMicrograph(db, row.dieId, req.micrographId);
  const image = m && sourceImageOf(m);
  if (!src || !m || !image || !m.format) throw new Error("The micrograph is gone or no longer in the die frame.");
  const planned = planRender(image, src.die, req);
  if (!planned.ok) throw new Error(planned.message);
  const plan = planned.plan;
  const author = row.createdBy ? await userDisplayName(db, row.createdBy) : null;
  const title = titleBlockFor(src, m, plan.umPerPx, author ?? "unknown", row.createdAt);
  await setExportState(db, exportId, { progress: 15 });
  // Stages report fractions; the row keeps whole percentages, never going back.
  let shown = 15;
  let written: Promise<unknown> = Promise.resolve();
  const onProgress = (fraction: number) => {
    const pct = Math.min(99, Math.round(15 + fraction * 85));
    if (pct <= shown) return;
    shown = pct;
    // Chained, so no late progress write can land after the final state below.
    written = written.then(() => setExportState(db, exportId, { progress: pct })).catch(() => {});
  };
  // Rendered in scratch from a local copy of the original, then stored; scratch goes either way.
  const work = await scratchFolder("export");
  let original: LocalFile | null = null;
  let info;
  try {
    original = await localCopy(micrographKeys(row.dieId, m.id, m.format).original!);
    if (!original) throw new Error("The micrograph's original file is missing from storage.");
    const file = path.join(/*turbopackIgnore: true*/ work, "export.png");
    info = await renderAnnotatedPngFile(
      {
        original: original.path,
        pixelCap: env().KERFLINE_MAX_PIXELS,
        plan,
        shapes: shapesOfKinds(src.shapes, req.kinds),
        threads: req.threads ? await loadThreadMarks(db, row.dieId) : [],
        labels: req.labels,
        title,
        onProgress,
      },
      file,
    );
    await objectStore().putFile(exportKey(row.dieId, row.id), file, "image/png");
  } finally {
    await original?.release();
    await rm(work, { recursive: true, force: true });
  }
  await written;
  const { lengthUm, label, px, x, y } = info.scaleBar;
  const result: ExportResult = {
    width: info.width,
    height: info.height,
    umPerPx: plan.umPerPx,
    warnings: [...plan.warnings],
    scaleBar: { lengthUm, label, px, x, y },
  };
  await setExportState(db, exportId, {
    status: "done",
    progress: 100,
    params: { ...params, result, warnings: [...plan.warnings] },
    fileName: exportFileName(title.caseTitle, title.dieName, title.micrograph, title.date),
    bytes: info.bytes,
    finishedAt: new Date(),
  });
}

/** Deletes exports finished more than KERFLINE_EXPORT_TTL_HOURS ago, rows and files. */
async function sweepExpiredExports(db: Database): Promise<number> {
  const olderThan = new Date(Date.now() - env().KERFLINE_EXPORT_TTL_HOURS * 3600_000);
  const gone = await expireExports(db, olderThan);
  await Promise.all(gone.map((g) => objectStore().remove(exportKey(g.dieId, g.id))));
  return gone.length;
}

export const exporting: JobHandler = {
  kind: "export",
  run: runExport,
  failure: (e) => `The export failed: ${(e as Error).message}`,
  markFailed: (db, id, message) => setExportState(db, id, { status: "failed", error: message, finishedAt: new Date() }),
  sweep: { everyMs: expirySweepMs, run: sweepExpiredExports },
};
