import "server-only";
import sharp from "sharp";
import type { Actor, Db } from "@/server/access/context";
import { loadDie } from "@/server/access/dies";
import { checkRenderable } from "@/server/access/exports";
import { loadDieMicrograph, loadDieSources, loadThreadMarks, shapesOfKinds, titleBlockFor } from "@/server/access/export-sources";
import { userDisplayName } from "@/server/access/users";
import { copySize, renderSource, type RenderFiles } from "./render-files";
import { NotFoundError } from "@/lib/errors";
import { previewPlan } from "@/lib/export/preview-plan";
import { renderAnnotatedPngBuffer } from "@/server/images/render-png";
import type { ExportRequest } from "@/lib/validation/exports";
import type { ExportPreviewDto } from "@/lib/dto/export-preview";

/**
 * Checks an export request exactly as creating it would (same rights, same 400/409 answers),
 * then renders a small copy of the result, read from the micrograph's downscaled preview when
 * that is sharp enough. Writes nothing.
 */
export async function previewExport(db: Db, actor: Actor, dieId: string, req: ExportRequest, files: RenderFiles): Promise<ExportPreviewDto> {
  const { row: die } = await loadDie(db, actor, dieId, "export");
  // Same checks and answers as creating the export; the plan is the full-size one.
  const src = await loadDieSources(db, dieId);
  if (!src) throw new NotFoundError("That die");
  const { m, image, plan: full } = checkRenderable(await loadDieMicrograph(db, dieId, req.micrographId), { ...die, extentUm: src.die.extentUm }, req);
  const me = await userDisplayName(db, actor.userId);
  const threads = req.threads ? await loadThreadMarks(db, dieId) : [];
  // Local files from here on (downloads on S3): released whatever happens.
  const copyFile = await files.copy(m);
  const { plan, fromCopy } = previewPlan(image, await copySize(copyFile), full);
  const source = await renderSource(files, m, copyFile, fromCopy);
  const { png } = await renderAnnotatedPngBuffer({
    original: source.path,
    pixelCap: files.pixelCap,
    plan,
    shapes: shapesOfKinds(src.shapes, req.kinds),
    threads,
    labels: req.labels,
    title: titleBlockFor(src, m, full.umPerPx, me ?? "unknown"),
  }).finally(source.release);
  const { width, height } = await sharp(png).metadata();
  return {
    width: full.width,
    height: full.height,
    umPerPx: full.umPerPx,
    warnings: [...full.warnings],
    png: png.toString("base64"),
    previewWidth: width ?? plan.width,
    previewHeight: height ?? plan.height,
  };
}
