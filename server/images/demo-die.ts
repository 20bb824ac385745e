import { mkdir, rename, rm } from "node:fs/promises";
import path from "node:path";
import sharp from "sharp";
import { meanScale } from "@/lib/geometry/affine";
import type { Affine2x3 } from "@/lib/geometry/types";
import { configureSharp } from "./limits";
import { NV24R_LAYOUT } from "@/lib/demo-die/layout";
import type { DieLayout } from "@/lib/demo-die/layout-types";
import { placeDie, pxPerUmForWidth } from "@/lib/demo-die/placement";
import { renderDieSvg, type Look } from "@/lib/demo-die/render-svg";

/**
 * Rasterises a demo micrograph of the invented die with sharp (librsvg) and writes it as
 * JPEG. libvips renders the SVG region by region while the encoder pulls rows, so a
 * 12000 × 8800 px render runs in one pass; what costs memory is JPEG Huffman optimisation
 * (it holds every coefficient of the image until the end: about 1 GB instead of 0.3 GB here),
 * so it is turned off.
 */

export type DemoRenderOptions = {
  look: Look;
  /** Width of the image in px (the die plus its margin); 12000 gives 0.25 µm/px. */
  widthPx?: number;
  marginUm?: number;
  rotateDeg?: number;
  scale?: number;
  shiftPx?: readonly [number, number];
  quality?: number;
  layout?: DieLayout;
};

export type DemoRender = {
  readonly widthPx: number;
  readonly heightPx: number;
  /** Mean µm per image px of this rendering (√|det| of imageToDie). */
  readonly umPerPx: number;
  /** Ground truth: image px (continuous, origin at the top-left pixel corner) → die µm. */
  readonly imageToDie: Affine2x3;
};

/**
 * Settings of the two demo micrographs the seed data uses, for a given width: the dark-field
 * one is turned 1.5°, enlarged 2 % and shifted (35 µm left, 24 µm down at any width), so
 * aligning it to the bright-field one is real work.
 */
export function demoMicrographOptions(look: Look, widthPx = 12000): DemoRenderOptions {
  if (look === "bright_field") return { look, widthPx };
  const k = widthPx / 12000;
  return { look, widthPx, rotateDeg: 1.5, scale: 1.02, shiftPx: [-140 * k, 95 * k] };
}

const SVG_DENSITY = 72; // librsvg renders one SVG px per image px at 72 dpi

/**
 * Renders the demo die (NV-24R unless another layout is given) to `outFile` as JPEG and
 * returns the exact image → die transform of the picture.
 */
export async function renderDemoMicrograph(outFile: string, options: DemoRenderOptions): Promise<DemoRender> {
  configureSharp();
  const { look, widthPx = 12000, marginUm = 300, quality = 90, layout = NV24R_LAYOUT } = options;
  const placementOptions = {
    pxPerUm: pxPerUmForWidth(layout, widthPx, marginUm),
    marginUm,
    rotateDeg: options.rotateDeg ?? 0,
    scale: options.scale ?? 1,
    shiftPx: options.shiftPx ?? ([0, 0] as const),
  };
  const placement = placeDie(layout, placementOptions);
  const svg = renderDieSvg(layout, { ...placementOptions, look });
  await mkdir(path.dirname(outFile), { recursive: true });
  const temp = `${outFile}.partial.jpg`;
  try {
    await sharp(Buffer.from(svg), { density: SVG_DENSITY, limitInputPixels: placement.widthPx * placement.heightPx })
      .removeAlpha()
      .jpeg({ quality, optimiseCoding: false })
      .toFile(temp);
    await rename(temp, outFile);
  } catch (err) {
    await rm(temp, { force: true });
    throw err;
  }
  const { widthPx: w, heightPx } = placement;
  return { widthPx: w, heightPx, umPerPx: meanScale(placement.imageToDie), imageToDie: placement.imageToDie };
}
