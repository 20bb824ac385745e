import { applyAffine } from "../geometry/affine";
import type { Affine2x3 } from "../geometry/types";

/** A single-channel image, row-major, one value per pixel (e.g. sharp's greyscale raw output). */
export type GreyImage = {
  readonly width: number;
  readonly height: number;
  readonly data: ArrayLike<number>;
};

/**
 * Bilinear sample at continuous image coordinates (pixel (i, j) covers [i, i + 1) × [j, j + 1),
 * its value sits at its centre), or NaN off the image.
 */
export function sampleBilinear(img: GreyImage, x: number, y: number): number {
  const fx = x - 0.5;
  const fy = y - 0.5;
  if (!(fx >= -0.5 && fy >= -0.5 && fx <= img.width - 0.5 && fy <= img.height - 0.5)) return Number.NaN;
  const x0 = Math.max(0, Math.min(img.width - 1, Math.floor(fx)));
  const y0 = Math.max(0, Math.min(img.height - 1, Math.floor(fy)));
  const x1 = Math.min(img.width - 1, x0 + 1);
  const y1 = Math.min(img.height - 1, y0 + 1);
  const tx = Math.max(0, Math.min(1, fx - x0));
  const ty = Math.max(0, Math.min(1, fy - y0));
  const d = img.data;
  const top = d[y0 * img.width + x0] * (1 - tx) + d[y0 * img.width + x1] * tx;
  const bottom = d[y1 * img.width + x0] * (1 - tx) + d[y1 * img.width + x1] * tx;
  return top * (1 - ty) + bottom * ty;
}

/**
 * Resamples an image onto a width × height grid: grid pixel (i, j), at its centre, is looked up
 * at gridToImage(i + 0.5, j + 0.5). Grid pixels that fall off the image get the mean of those
 * that do not, so the border carries no edge into a correlation. Also returns the covered fraction.
 */
export function resampleToGrid(img: GreyImage, gridToImage: Affine2x3, width: number, height: number) {
  const out = new Float64Array(width * height);
  let sum = 0;
  let count = 0;
  for (let j = 0; j < height; j++) {
    for (let i = 0; i < width; i++) {
      const [x, y] = applyAffine(gridToImage, i + 0.5, j + 0.5);
      const v = sampleBilinear(img, x, y);
      out[j * width + i] = v;
      if (!Number.isNaN(v)) {
        sum += v;
        count++;
      }
    }
  }
  const mean = count ? sum / count : 0;
  for (let k = 0; k < out.length; k++) if (Number.isNaN(out[k])) out[k] = mean;
  return { data: out, covered: count / out.length };
}
