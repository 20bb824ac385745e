import "server-only";
import type { MicrographRow } from "@/db/schema";
import { sourceImageOf, titleBlockFor, type DieSources } from "@/server/access/export-sources";
import type { OverviewRenderer } from "@/server/access/report";
import { renderAnnotatedPngBuffer } from "@/server/images/render-png";
import { planRender } from "@/lib/export/render-plan";
import { previewPlan } from "@/lib/export/preview-plan";
import { withShownPadStates } from "@/lib/markup/pad-state";
import { ILLUMINATION_LABELS } from "@/lib/validation/micrographs";
import { copySize, renderSource, type RenderFiles } from "./render-files";

/** Width of the report's overview image: sharp enough for print at the page's text width. */
const OVERVIEW_WIDTH_PX = 1600;

/** The report's overview: the reference micrograph (or the first usable one) with all markup. */
export function overviewRenderer(files: RenderFiles): OverviewRenderer {
  return async (src: DieSources, ms: MicrographRow[], author: string) => {
    const m = ms.find((x) => x.isReference && x.status !== "failed" && sourceImageOf(x)) ?? ms.find((x) => x.status !== "failed" && sourceImageOf(x));
    if (!m) return null;
    const image = sourceImageOf(m)!;
    const planned = planRender(image, src.die, { widthPx: OVERVIEW_WIDTH_PX });
    if (!planned.ok) return null;
    // The tiler's downscaled copy is enough for a page-wide overview, and far quicker to read than the original.
    const copyFile = await files.copy(m);
    const { plan, fromCopy } = previewPlan(image, await copySize(copyFile), planned.plan, OVERVIEW_WIDTH_PX);
    const title = titleBlockFor(src, m, plan.umPerPx, author);
    const source = await renderSource(files, m, copyFile, fromCopy);
    const { png, info } = await renderAnnotatedPngBuffer({
      original: source.path,
      pixelCap: files.pixelCap,
      plan,
      shapes: withShownPadStates(src.shapes),
      threads: [],
      labels: true,
      title,
    }).finally(source.release);
    return {
      png,
      caption: `${m.label} (${ILLUMINATION_LABELS[m.illumination]}), whole die at ${planned.plan.umPerPx.toPrecision(3)} µm/px; scale bar ${info.scaleBar.label}.${planned.plan.warnings.length ? ` ${planned.plan.warnings.join(" ")}` : ""}`,
    };
  };
}
