import { applyAffine, composeAffine, invertAffine } from "@/lib/geometry/affine";
import type { Affine2x3 } from "@/lib/geometry/types";
import { wholeDieRegion, type ExtentUm } from "./view-region";

/**
 * Where an annotated export reads its pixels and how it maps the die onto the output. Pure
 * arithmetic: the renderer (sharp) only carries it out.
 */

/** Widest output the renderer accepts (and its tallest). */
export const MAX_OUTPUT_PX = 16_384;
/** Width used when the request gives neither a width nor a scale (capped at the native one). */
const DEFAULT_OUTPUT_WIDTH = 4096;

/** A rectangle in die µm: lower-left corner, width to the right, height upwards. */
export type DieRegion = { readonly x: number; readonly y: number; readonly width: number; readonly height: number };

export type PlanRequest = { readonly region?: DieRegion; readonly widthPx?: number; readonly umPerPx?: number };

export type SourceImage = { readonly width: number; readonly height: number; readonly transform: Affine2x3 };

/**
 * An axis-aligned transform (x from a, y from d; either may mirror): an integer rectangle of
 * source pixels and where (and how large) it lands in the output once resized.
 */
type AxisWindow = {
  readonly kind: "axis";
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

/**
 * A transform that rotates or shears: the source rectangle is first resized by a uniform
 * factor to about the output scale (so the resampling filters, not the affine interpolator,
 * do the shrinking), then mapped by a residual affine whose output is placed on the canvas.
 */
type AffineWindow = {
  readonly kind: "affine";
  readonly left: number;
  readonly top: number;
  readonly width: number;
  readonly height: number;
  /** Size of the window after the uniform resize. */
  readonly resizedWidth: number;
  readonly resizedHeight: number;
  /** Resized-window px → output px, linear part [a, b, c, d] (x' = a·x + b·y), as libvips' affine takes it. */
  readonly matrix: readonly [number, number, number, number];
  /** Sub-pixel displacement handed to the affine (odx, ody), in [0, 1). */
  readonly odx: number;
  readonly ody: number;
  /** Size of the affine's output and where its top-left pixel lands on the canvas (may be negative). */
  readonly outWidth: number;
  readonly outHeight: number;
  readonly outLeft: number;
  readonly outTop: number;
};

type SourceWindow = AxisWindow | AffineWindow;

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

function corners(width: number, height: number): [number, number][] {
  return [
    [0, 0],
    [width, 0],
    [0, height],
    [width, height],
  ];
}

/** The die rectangle the micrograph covers (its bounding box when rotated), for dies of unknown size. */
function imageExtentUm(image: SourceImage): DieRegion {
  const pts = corners(image.width, image.height).map(([x, y]) => applyAffine(image.transform, x, y));
  const xs = pts.map((p) => p[0]);
  const ys = pts.map((p) => p[1]);
  return { x: Math.min(...xs), y: Math.min(...ys), width: Math.max(...xs) - Math.min(...xs), height: Math.max(...ys) - Math.min(...ys) };
}

function outputScale(region: DieRegion, req: PlanRequest, nativeUmPerPx: number): number {
  if (req.umPerPx !== undefined) return req.umPerPx;
  if (req.widthPx !== undefined) return region.width / req.widthPx;
  const nativeWidth = region.width / nativeUmPerPx;
  return region.width / Math.max(1, Math.min(DEFAULT_OUTPUT_WIDTH, Math.round(nativeWidth)));
}

/** The source window for an axis-aligned transform (x from a, y from d; either may mirror). */
function axisWindow(image: SourceImage, region: DieRegion, W: number, H: number): AxisWindow | null {
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
    kind: "axis",
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

/** Source pixels kept around the exact window so the interpolator has its neighbours. */
const AFFINE_MARGIN_PX = 3;

/** The source window for a transform that rotates or shears; `toOutput` maps image px → output px. */
function affineWindow(image: SourceImage, toOutput: Affine2x3, W: number, H: number): AffineWindow | null {
  const back = invertAffine(toOutput);
  const pts = corners(W, H).map(([x, y]) => applyAffine(back, x, y));
  const xs = pts.map((p) => p[0]);
  const ys = pts.map((p) => p[1]);
  const left = Math.max(0, Math.floor(Math.min(...xs)) - AFFINE_MARGIN_PX);
  const top = Math.max(0, Math.floor(Math.min(...ys)) - AFFINE_MARGIN_PX);
  const right = Math.min(image.width, Math.ceil(Math.max(...xs)) + AFFINE_MARGIN_PX);
  const bottom = Math.min(image.height, Math.ceil(Math.max(...ys)) + AFFINE_MARGIN_PX);
  if (right <= left || bottom <= top) return null;
  const [[a, b, tx], [c, d, ty]] = toOutput;
  // Shrink first by the output's mean scale; never enlarge here (the affine does that, and says so).
  const k = Math.min(1, Math.sqrt(Math.abs(a * d - b * c)));
  const width = right - left;
  const height = bottom - top;
  const resizedWidth = Math.max(1, Math.round(width * k));
  const resizedHeight = Math.max(1, Math.round(height * k));
  const rx = resizedWidth / width;
  const ry = resizedHeight / height;
  // Resized (u, v) → image (left + u / rx, top + v / ry) → output.
  const m: [number, number, number, number] = [a / rx, b / ry, c / rx, d / ry];
  const ox = a * left + b * top + tx;
  const oy = c * left + d * top + ty;
  // Pixel i covers [i, i + 1): its centre i + ½ lands on output x = m·(i + ½) + o, which is
  // the centre of output index x − ½. libvips counts in indices (centres at integers).
  const px = ox + (m[0] + m[1]) / 2 - 0.5;
  const py = oy + (m[2] + m[3]) / 2 - 0.5;
  // libvips' affine output is the bounding box of the transformed input rectangle, its corner
  // rounded to the nearest pixel (vips__transform_set_area); index j of that output is canvas
  // index j + (p + corner). The integer part places the output, the fraction goes to odx/ody.
  const box = corners(resizedWidth, resizedHeight);
  const rx0 = box.map(([u, v]) => m[0] * u + m[1] * v);
  const ry0 = box.map(([u, v]) => m[2] * u + m[3] * v);
  const round = (v: number) => Math.floor(v + 0.5);
  const placeX = px + round(Math.min(...rx0));
  const placeY = py + round(Math.min(...ry0));
  const outLeft = Math.floor(placeX);
  const outTop = Math.floor(placeY);
  return {
    kind: "affine",
    left,
    top,
    width,
    height,
    resizedWidth,
    resizedHeight,
    matrix: m,
    odx: placeX - outLeft,
    ody: placeY - outTop,
    outWidth: round(Math.max(...rx0) - Math.min(...rx0)),
    outHeight: round(Math.max(...ry0) - Math.min(...ry0)),
    outLeft,
    outTop,
  };
}

/**
 * Plans an export of `req.region` (die µm; absent = the whole die with the markup around it and
 * a margin (`wholeDieRegion`), or the micrograph's extent when the die has no size) at `umPerPx`, or at `region.width / widthPx`. Refuses outputs over
 * 16,384 px; warns when the output enlarges the source. Micrographs whose alignment rotates or
 * shears them are resampled through their transform, so the export is always in the die frame.
 */
export function planRender(
  image: SourceImage,
  die: { widthUm: number | null; heightUm: number | null; extentUm?: ExtentUm | null },
  req: PlanRequest,
): PlanResult {
  const [[a, b], [c, d]] = image.transform;
  const axisAligned = Math.abs(b) <= ROTATION_TOLERANCE * Math.abs(a) && Math.abs(c) <= ROTATION_TOLERANCE * Math.abs(d) && a !== 0 && d !== 0;
  const region = req.region ?? wholeDieRegion(die) ?? imageExtentUm(image);
  if (!(region.width > 0 && region.height > 0)) return { ok: false, message: "The region must have a positive width and height." };
  const native = Math.sqrt(Math.abs(a * d - b * c));
  if (!(native > 0)) return { ok: false, message: "This micrograph's transform is degenerate; align it again." };
  const s = outputScale(region, req, native);
  const width = Math.round(region.width / s);
  const height = Math.round(region.height / s);
  if (width > MAX_OUTPUT_PX || height > MAX_OUTPUT_PX) {
    return {
      ok: false,
      message: `The output would be ${width} × ${height} px; at most ${MAX_OUTPUT_PX} px on each side. Choose a coarser scale or a smaller region.`,
    };
  }
  if (width < 1 || height < 1) return { ok: false, message: "The output would be smaller than one pixel; choose a finer scale." };
  const dieToOutput: Affine2x3 = [
    [1 / s, 0, -region.x / s],
    [0, -1 / s, (region.y + region.height) / s],
  ];
  const source = axisAligned ? axisWindow(image, region, width, height) : affineWindow(image, composeAffine(dieToOutput, image.transform), width, height);
  const k = s / native;
  const warnings: string[] = [];
  if (k < 1 - 1e-9)
    warnings.push(
      `The output is enlarged ${(1 / k).toFixed(2)}× beyond the micrograph's resolution (${native.toPrecision(3)} µm/px); it shows no more detail than the source.`,
    );
  if (!source) warnings.push("The region does not overlap this micrograph; only the markup is drawn.");
  return { ok: true, plan: { region, umPerPx: s, width, height, dieToOutput, source, sourcePxPerOutputPx: k, warnings } };
}
