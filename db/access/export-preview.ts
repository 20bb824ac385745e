import "server-only";
import sharp from "sharp";
import { eq } from "drizzle-orm";
import { users } from "../schema";
import { type Actor, type Db } from "./context";
import { loadDie } from "./dies";
import { checkRenderable } from "./exports";
import { copySize, loadDieMicrograph, loadDieSources, loadThreadMarks, shapesOfKinds, sourceImageOf, titleBlockFor, type RenderFiles } from "./export-sources";
import { NotFoundError } from "@/lib/server/errors";
import { planRender } from "@/lib/export/render-plan";
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
  const m = await loadDieMicrograph(db, dieId, req.micrographId);
  const warnings = checkRenderable(m, die, req);
  const src = await loadDieSources(db, dieId);
  const image = m && sourceImageOf(m);
  if (!src || !m || !image) throw new NotFoundError("That micrograph");
  const full = planRender(image, src.die, req);
  if (!full.ok) throw new Error(full.message); // checkRenderable has refused these already
  const copyFile = files.copy(m);
  const copy = await copySize(copyFile);
  const { plan, fromCopy } = previewPlan(image, copy, full.plan);
  const [me] = await db.select({ name: users.name }).from(users).where(eq(users.id, actor.userId));
  const { png } = await renderAnnotatedPngBuffer({
    original: fromCopy ? copyFile : files.original(m),
    pixelCap: files.pixelCap,
    plan,
    shapes: shapesOfKinds(src.shapes, req.kinds),
    threads: req.threads ? await loadThreadMarks(db, dieId) : [],
    labels: req.labels,
    title: titleBlockFor(src, m, full.plan.umPerPx, me?.name ?? "unknown"),
  });
  const { width, height } = await sharp(png).metadata();
  return { width: full.plan.width, height: full.plan.height, umPerPx: full.plan.umPerPx, warnings, png: png.toString("base64"), previewWidth: width ?? plan.width, previewHeight: height ?? plan.height };
}
