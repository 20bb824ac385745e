import { applyAffine, invertAffine } from "./affine";
import { boundingBoxOf, type BoundingBox } from "./measure";
import type { Affine2x3 } from "./types";

/** A viewer's screen px → image px mapping at its current view. */
export type ScreenToImage = (x: number, y: number) => { x: number; y: number };

/**
 * What a viewer shows, as a box in die µm: the four corners of the viewer element (CSS px,
 * top-left origin) are taken through the screen → image mapping and the micrograph's
 * image → die transform, and the box is their bounding box. All four are needed: once the
 * micrograph is turned against the die frame by an angle that is not a multiple of 90° (or the
 * viewer itself is turned), two opposite corners no longer span the other two.
 */
export function viewBoxUm(size: { readonly width: number; readonly height: number }, screenToImage: ScreenToImage, imageToDie: Affine2x3): BoundingBox {
  const { width: w, height: h } = size;
  const corners = [
    [0, 0],
    [w, 0],
    [w, h],
    [0, h],
  ].map(([x, y]) => {
    const img = screenToImage(x, y);
    return applyAffine(imageToDie, img.x, img.y);
  });
  return boundingBoxOf(corners);
}

/**
 * The image-px box that holds a die-µm box: its four corners through the inverse of the
 * image → die transform. As above, two corners are not enough once the micrograph is turned
 * by an angle that is not a multiple of 90°.
 */
export function imageBoxOfDieBox(b: BoundingBox, imageToDie: Affine2x3): BoundingBox {
  const toImage = invertAffine(imageToDie);
  const corners = [
    [b.minX, b.minY],
    [b.maxX, b.minY],
    [b.maxX, b.maxY],
    [b.minX, b.maxY],
  ].map(([x, y]) => applyAffine(toImage, x, y));
  return boundingBoxOf(corners);
}
