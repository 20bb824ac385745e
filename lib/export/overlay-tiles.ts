import { APP_FONT_FAMILY } from "@/lib/fonts/app-fonts";
import { applyAffine } from "@/lib/geometry/affine";
import { boundingBox } from "@/lib/geometry/measure";
import type { Affine2x3 } from "@/lib/geometry/types";
import type { AnyShape } from "@/lib/markup/types";
import { labelBox, markupLayerSvg, markupStyle, placeThreadMarks, remarkMarkShape, type MarkupStyle, type ThreadMark } from "./markup-svg";

/**
 * Splits the markup over the output into small SVG tiles, each holding only the shapes that
 * reach into it. librsvg walks every element of a document for every region libvips asks of
 * it, so one big SVG costs shapes × regions; tiles bring it back to about shapes.
 */

/** One tile of markup: an SVG document and where its top-left corner goes on the output. */
export type OverlayTile = { readonly svg: string; readonly left: number; readonly top: number; readonly width: number; readonly height: number };

const TILE_WIDTH = 1024;
const TILE_HEIGHT = 512;

/** SVG text of the export asks for the face the app ships (lib/fonts), by name. */
export const EXPORT_FONT_FAMILY = `${APP_FONT_FAMILY}, sans-serif`;

type Box = readonly [number, number, number, number];

/** Output-pixel box a shape and its label may paint, strokes and halo included. */
function shapeReach(shape: AnyShape, m: Affine2x3, style: MarkupStyle, labels: boolean): Box {
  const b = boundingBox(shape.geometry);
  const pts = [applyAffine(m, b.minX, b.minY), applyAffine(m, b.maxX, b.minY), applyAffine(m, b.minX, b.maxY), applyAffine(m, b.maxX, b.maxY)];
  const stroke = style.stroke * 4;
  let x0 = Math.min(...pts.map((p) => p[0])) - stroke;
  let x1 = Math.max(...pts.map((p) => p[0])) + stroke;
  let y0 = Math.min(...pts.map((p) => p[1])) - stroke;
  let y1 = Math.max(...pts.map((p) => p[1])) + stroke;
  const label = labels ? labelBox(shape, m, style) : null;
  if (label) {
    x0 = Math.min(x0, label.x - 1);
    x1 = Math.max(x1, label.x + label.width + 1);
    y0 = Math.min(y0, label.y - 1);
    y1 = Math.max(y1, label.y + label.height + 1);
  }
  return [x0, y0, x1, y1];
}

/** Output-pixel box of a remark marker, its leader and anchor included. */
function threadReach(t: ThreadMark, m: Affine2x3, style: MarkupStyle): Box {
  const [x, y] = applyAffine(m, t.at[0], t.at[1]);
  const [dx, dy] = t.offsetPx ?? [0, 0];
  const { box, edgePx } = remarkMarkShape(t, style);
  const e = edgePx + style.stroke * 2;
  return [Math.min(x, x + dx + box.minX) - e, Math.min(y, y + dy + box.minY) - e, Math.max(x, x + dx + box.maxX) + e, Math.max(y, y + dy + box.maxY) + e];
}

const touches = (b: Box, left: number, top: number, w: number, h: number) => b[2] >= left && b[0] <= left + w && b[3] >= top && b[1] <= top + h;

/** The markup tiles of a `width` × `height` output; tiles with nothing in them are left out. */
export function markupTiles(
  shapes: readonly AnyShape[],
  threads: readonly ThreadMark[],
  m: Affine2x3,
  width: number,
  height: number,
  opts: { labels: boolean; tileWidth?: number; tileHeight?: number },
): OverlayTile[] {
  const tw = opts.tileWidth ?? TILE_WIDTH;
  const th = opts.tileHeight ?? TILE_HEIGHT;
  const style = markupStyle(width);
  const shapeBoxes = shapes.map((s) => shapeReach(s, m, style, opts.labels));
  // Placed once over the whole output, so a marker crossing tiles is drawn the same in each.
  const placed = placeThreadMarks(threads, shapes, m, style, opts.labels);
  const threadBoxes = placed.map((t) => threadReach(t, m, style));
  const tiles: OverlayTile[] = [];
  for (let top = 0; top < height; top += th) {
    const h = Math.min(th, height - top);
    // Rows first: most shapes fall out here, before the per-tile test.
    const rowShapes = shapes.filter((_, i) => shapeBoxes[i][3] >= top && shapeBoxes[i][1] <= top + h);
    const rowBoxes = shapeBoxes.filter((b) => b[3] >= top && b[1] <= top + h);
    for (let left = 0; left < width; left += tw) {
      const w = Math.min(tw, width - left);
      const inShapes = rowShapes.filter((_, i) => touches(rowBoxes[i], left, top, w, h));
      const inThreads = placed.filter((_, i) => touches(threadBoxes[i], left, top, w, h));
      if (inShapes.length === 0 && inThreads.length === 0) continue;
      const local: Affine2x3 = [
        [m[0][0], m[0][1], m[0][2] - left],
        [m[1][0], m[1][1], m[1][2] - top],
      ];
      // Styles follow the whole output's width, not the tile's.
      const layer = markupLayerSvg(inShapes, local, width, { labels: opts.labels, threads: inThreads });
      tiles.push({
        svg: `<svg xmlns="http://www.w3.org/2000/svg" width="${w}" height="${h}" font-family="${EXPORT_FONT_FAMILY}">${layer}</svg>`,
        left,
        top,
        width: w,
        height: h,
      });
    }
  }
  return tiles;
}
