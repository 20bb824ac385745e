import type { Position } from "../geometry/types";
import type { Spiral } from "./layout-types";

/**
 * Centre lines of a symmetric (centre-tapped) square spiral: concentric rings split on the
 * side where a crossover joins them to the next ring, crossovers alternating left and right,
 * and the two ports leaving the outer ring to the right. The drawing is mirror-symmetric
 * about the horizontal line through the centre, like the differential circuit around it.
 */
export type SpiralPaths = {
  /** Ring halves and leads, drawn in the top metal. */
  readonly top: readonly (readonly Position[])[];
  /** The arm of each crossover that dives under the other (lower metal). */
  readonly under: readonly (readonly Position[])[];
};

/** Half the side of ring i's centre line (ring 0 is the outermost). */
export function ringHalfSize(s: Spiral, i: number): number {
  return s.outerDiameterUm / 2 - s.widthUm / 2 - i * (s.widthUm + s.spacingUm);
}

/** Which sides of ring i are open: crossover i→i+1 is on the left when i is even. */
function openSides(s: Spiral, i: number): { left: boolean; right: boolean } {
  const crossLeft = (j: number) => j >= 0 && j < s.turns - 1 && j % 2 === 0;
  const crossRight = (j: number) => j >= 0 && j < s.turns - 1 && j % 2 === 1;
  return {
    left: crossLeft(i) || crossLeft(i - 1),
    right: i === 0 || crossRight(i) || crossRight(i - 1),
  };
}

/** The centre lines of a spiral in die µm. */
export function spiralPaths(s: Spiral): SpiralPaths {
  const [cx, cy] = s.centreUm;
  const g = s.widthUm; // half-height of each gap
  const top: Position[][] = [];
  const under: Position[][] = [];
  for (let i = 0; i < s.turns; i += 1) {
    const a = ringHalfSize(s, i);
    const open = openSides(s, i);
    if (open.left && open.right) {
      const upper: Position[] = [
        [cx + a, cy + g],
        [cx + a, cy + a],
        [cx - a, cy + a],
        [cx - a, cy + g],
      ];
      top.push(
        upper,
        upper.map(([x, y]) => [x, 2 * cy - y] as Position),
      );
    } else {
      const sx = open.right ? 1 : -1;
      top.push([
        [cx + sx * a, cy + g],
        [cx + sx * a, cy + a],
        [cx - sx * a, cy + a],
        [cx - sx * a, cy - a],
        [cx + sx * a, cy - a],
        [cx + sx * a, cy - g],
      ]);
    }
    if (i < s.turns - 1) {
      const b = ringHalfSize(s, i + 1);
      const sx = i % 2 === 0 ? -1 : 1;
      top.push([
        [cx + sx * a, cy + g],
        [cx + sx * b, cy - g],
      ]);
      under.push([
        [cx + sx * a, cy - g],
        [cx + sx * b, cy + g],
      ]);
    }
  }
  const a0 = ringHalfSize(s, 0);
  const lead = s.outerDiameterUm / 4;
  top.push(
    [
      [cx + a0, cy + g],
      [cx + a0 + lead, cy + g],
    ],
    [
      [cx + a0, cy - g],
      [cx + a0 + lead, cy - g],
    ],
  );
  return { top, under };
}
