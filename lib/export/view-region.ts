import type { DieRegion } from "./render-plan";

/** What the die's markup covers in die µm (wire bonds run past the die edge to the package). */
export type ExtentUm = { readonly minX: number; readonly minY: number; readonly maxX: number; readonly maxY: number };

/** Margin around a whole-die export's markup, as a fraction of its larger side. */
const WHOLE_DIE_MARGIN = 0.03;
/**
 * Room kept around the die itself, as a fraction of its larger side: bond wires leave the die
 * edge for the package, and a photo shows them whether or not they are marked up.
 */
const DIE_SURROUND = 0.1;

/**
 * The region of a "whole die" export: the die rectangle with 10 % of its larger side around it
 * (so the bond wires leaving its edge stay in the picture), grown further where drawn shapes
 * reach beyond that (wire bonds out to the package), with a margin of 3 % of the larger side of
 * die and markup on every edge so nothing touches the border. Null when the die has no size.
 */
export function wholeDieRegion(die: {
  readonly widthUm: number | null;
  readonly heightUm: number | null;
  readonly extentUm?: ExtentUm | null;
}): DieRegion | null {
  if (!die.widthUm || !die.heightUm) return null;
  const room = DIE_SURROUND * Math.max(die.widthUm, die.heightUm);
  let x0 = -room;
  let y0 = -room;
  let x1 = die.widthUm + room;
  let y1 = die.heightUm + room;
  const e = die.extentUm;
  if (e) {
    const ux0 = Math.min(0, e.minX);
    const uy0 = Math.min(0, e.minY);
    const ux1 = Math.max(die.widthUm, e.maxX);
    const uy1 = Math.max(die.heightUm, e.maxY);
    const margin = WHOLE_DIE_MARGIN * Math.max(ux1 - ux0, uy1 - uy0);
    x0 = Math.min(x0, ux0 - margin);
    y0 = Math.min(y0, uy0 - margin);
    x1 = Math.max(x1, ux1 + margin);
    y1 = Math.max(y1, uy1 + margin);
  }
  return { x: x0, y: y0, width: x1 - x0, height: y1 - y0 };
}
