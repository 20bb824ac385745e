import type { Affine2x3 } from "@/lib/geometry/types";

/**
 * Where an annotated export reads its pixels and how it maps the die onto the output. Pure
 * arithmetic: the renderer (sharp) only carries it out.
 */

/** Widest output the renderer accepts (and its tallest). */
export const MAX_OUTPUT_PX = 16_384;
/** Width used when the request gives neither a width nor a scale (capped at the native one). */
export const DEFAULT_OUTPUT_WIDTH = 4096;

/** A rectangle in die µm: lower-left corner, width to the right, height upwards. */
export type DieRegion = { readonly x: number; readonly y: number; readonly width: number; readonly height: number };

export type PlanRequest = { readonly region?: DieRegion; readonly widthPx?: number; readonly umPerPx?: number };

export type SourceImage = { readonly width: number; readonly height: number; readonly transform: Affine2x3 };

/** An integer rectangle of source pixels and where (and how large) it lands in the output. */
export type SourceWindow = {
  readonly left: number;
  readonly top: number;
  readonly width: number;
  readonly height: number;
  /** Size of the window once resized to the output scale. */
  readonly outWidth: number;
  readonly outHeight: number;
  /** Output position of the resized window's top-left corner (may be slightly negative). */
  readonly outLeft: number;
  readonly outTop: number;
  readonly flop: boolean;
  readonly flip: boolean;
};

export type RenderPlan = {
  readonly region: DieRegion;
  readonly umPerPx: number;
  readonly width: number;
  readonly height: number;
  /** Die µm → output px: x right, y down, origin at the region's upper-left corner. */
  readonly dieToOutput: Affine2x3;
  /** Null when the region does not overlap the micrograph at all. */
  readonly source: SourceWindow | null;
  /** Source pixels per output pixel (below 1 the output is enlarged). */
  readonly sourcePxPerOutputPx: number;
  readonly warnings: readonly string[];
};

export type PlanResult = { readonly ok: true; readonly plan: RenderPlan } | { readonly ok: false; readonly message: string };

const ROTATION_TOLERANCE = 1e-9;

/** The die rectangle the micrograph covers, for dies of unknown size. */
export function imageExtentUm(image: SourceImage): DieRegion {
  const [[a, , tx], [, d, ty]] = image.transform;
  const xs = [tx, tx + a * image.width];
  const ys = [ty, ty + d * image.height];
  return { x: Math.min(...xs), y: Math.min(...ys), width: Math.abs(a * image.width), height: Math.abs(d * image.height) };
}

function outputScale(region: DieRegion, req: PlanRequest, nativeUmPerPx: number): number {
  if (req.umPerPx !== undefined) return req.umPerPx;
  if (req.widthPx !== undefined) return region.width / req.widthPx;
  const nativeWidth = region.width / nativeUmPerPx;
  return region.width / Math.max(1, Math.min(DEFAULT_OUTPUT_WIDTH, Math.round(nativeWidth)));
}

/** The source window for an axis-aligned transform (x from a, y from d; either may mirror). */
function sourceWindow(image: SourceImage, region: DieRegion, s: number, W: number, H: number): SourceWindow | null {
  const [[a, , tx], [, d, ty]] = image.transform;
  // Image x (fractional) at the output's left and right edges, and image y at its top and bottom.
  const xl = (region.x - tx) / a;
  const xr = (region.x + region.width - tx) / a;
  const yt = (region.y + region.height - ty) / d;
  const yb = (region.y - ty) / d;
  const [x0, x1] = [Math.min(xl, xr), Math.max(xl, xr)];
  const [y0, y1] = [Math.min(yt, yb), Math.max(yt, yb)];
  const left = Math.max(0, Math.floor(x0));
  const top = Math.max(0, Math.floor(y0));
  const right = Math.min(image.width, Math.ceil(x1));
  const bottom = Math.min(image.height, Math.ceil(y1));
  if (right <= left || bottom <= top) return null;
  const kx = W / (x1 - x0);
  const ky = H / (y1 - y0);
  const flop = a < 0;
  const flip = d > 0;
  // After a flop the window's left edge in the output is where its right edge was.
  const outLeft = flop ? (x1 - right) * kx : (left - x0) * kx;
  const outTop = flip ? (y1 - bottom) * ky : (top - y0) * ky;
  return {
    left,
    top,
    width: right - left,
    height: bottom - top,
    outWidth: Math.max(1, Math.round((right - left) * kx)),
    outHeight: Math.max(1, Math.round((bottom - top) * ky)),
    outLeft: Math.round(outLeft),
    outTop: Math.round(outTop),
    flop,
    flip,
  };
}

/**
 * Plans an export of `req.region` (die µm; absent = the whole die, or the micrograph's extent
 * when the die has no size) at `umPerPx`, or at `region.width / widthPx`. Refuses outputs over
 * 16,384 px and micrographs whose transform rotates or shears (not yet supported); warns when
 * the output enlarges the source.
 */
export function planRender(image: SourceImage, die: { widthUm: number | null; heightUm: number | null }, req: PlanRequest): PlanResult {
  const [[a, b], [c, d]] = image.transform;
  if (Math.abs(b) > ROTATION_TOLERANCE * Math.abs(a) || Math.abs(c) > ROTATION_TOLERANCE * Math.abs(d)) {
    return { ok: false, message: "This micrograph's alignment rotates it against the die frame; exports of rotated micrographs are not supported yet. Export the reference micrograph." };
  }
  const region = req.region ?? (die.widthUm && die.heightUm ? { x: 0, y: 0, width: die.widthUm, height: die.heightUm } : imageExtentUm(image));
  if (!(region.width > 0 && region.height > 0)) return { ok: false, message: "The region must have a positive width and height." };
  const native = Math.sqrt(Math.abs(a * d));
  const s = outputScale(region, req, native);
  const width = Math.round(region.width / s);
  const height = Math.round(region.height / s);
  if (width > MAX_OUTPUT_PX || height > MAX_OUTPUT_PX) {
    return { ok: false, message: `The output would be ${width} × ${height} px; at most ${MAX_OUTPUT_PX} px on each side. Choose a coarser scale or a smaller region.` };
  }
  if (width < 1 || height < 1) return { ok: false, message: "The output would be smaller than one pixel; choose a finer scale." };
  const source = sourceWindow(image, region, s, width, height);
  const k = s / native;
  const warnings: string[] = [];
  if (k < 1 - 1e-9) warnings.push(`The output is enlarged ${(1 / k).toFixed(2)}× beyond the micrograph's resolution (${native.toPrecision(3)} µm/px); it shows no more detail than the source.`);
  if (!source) warnings.push("The region does not overlap this micrograph; only the markup is drawn.");
  const dieToOutput: Affine2x3 = [
    [1 / s, 0, -region.x / s],
    [0, -1 / s, (region.y + region.height) / s],
  ];
  return { ok: true, plan: { region, umPerPx: s, width, height, dieToOutput, source, sourcePxPerOutputPx: k, warnings } };
}
