import "server-only";
import sharp from "sharp";
import { eq } from "drizzle-orm";
import { users } from "../schema";
import { type Actor, type Db } from "./context";
import { loadDie } from "./dies";
import { checkRenderable } from "./exports";
import { copySize, loadDieMicrograph, loadDieSources, loadThreadMarks, shapesOfKinds, titleBlockFor, type RenderFiles } from "./export-sources";
import { NotFoundError } from "@/lib/server/errors";
import { previewPlan } from "@/lib/export/preview-plan";
import { renderAnnotatedPngBuffer } from "@/lib/export/render-png";
import type { ExportRequest } from "@/lib/validation/exports";

/** What the export form shows before a render is queued. */
export type ExportPreviewDto = {
  /** Size and scale of the PNG the request would produce. */
  width: number;
  height: number;
  umPerPx: number;
  warnings: string[];
  /** A small rendering of it (PNG, base64) and its size. */
  png: string;
  previewWidth: number;
  previewHeight: number;
};


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
  const copyFile = files.copy(m);
  const copy = await copySize(copyFile);
  const { plan, fromCopy } = previewPlan(image, copy, full);
  const [me] = await db.select({ name: users.name }).from(users).where(eq(users.id, actor.userId));
  const { png } = await renderAnnotatedPngBuffer({
    original: fromCopy ? copyFile : files.original(m),
    pixelCap: files.pixelCap,
    plan,
    shapes: shapesOfKinds(src.shapes, req.kinds),
    threads: req.threads ? await loadThreadMarks(db, dieId) : [],
    labels: req.labels,
    title: titleBlockFor(src, m, full.umPerPx, me?.name ?? "unknown"),
  });
  const { width, height } = await sharp(png).metadata();
  return { width: full.width, height: full.height, umPerPx: full.umPerPx, warnings: [...full.warnings], png: png.toString("base64"), previewWidth: width ?? plan.width, previewHeight: height ?? plan.height };
}
