/**
 * Glue between the markup and the symmetry report: the axes marked on the die, the shapes
 * the report reads, and the colour scale that paints a deviation.
 */
import type { LineStringGeometry } from "../geometry/types";
import type { AnyShape } from "../markup/types";
import type { SymmetryShape } from "../symmetry";

/**
 * A marked symmetry axis as the report's two-point line: its first and last vertex (an axis
 * drawn with extra clicks along it is still one straight line). Null when those coincide.
 */
export function axisOfShape(shape: AnyShape): LineStringGeometry | null {
  if (shape.kind !== "symmetry_axis") return null;
  const pts = shape.geometry.coordinates;
  const a = pts[0];
  const b = pts[pts.length - 1];
  if (!a || !b || (a[0] === b[0] && a[1] === b[1])) return null;
  return {
    type: "LineString",
    coordinates: [
      [a[0], a[1]],
      [b[0], b[1]],
    ],
  };
}

/** The shapes as the symmetry report takes them (it ignores kinds it does not pair). */
export function symmetryShapes(shapes: readonly AnyShape[]): SymmetryShape[] {
  return shapes.map((s) => ({ id: s.id, kind: s.kind, geometry: s.geometry }));
}

/**
 * Colour of a deviation on a scale of our own: hue 150 (green) at zero through yellow to 0
 * (red) at `fullScaleUm`, clamped beyond; returned as a CSS hsl() colour.
 */
export function deviationHue(deviationUm: number, fullScaleUm: number): number {
  if (!(fullScaleUm > 0) || !Number.isFinite(deviationUm)) return 0;
  const t = Math.min(1, Math.max(0, deviationUm / fullScaleUm));
  return 150 * (1 - t);
}

/** CSS colour for a deviation (see deviationHue). */
export function deviationColour(deviationUm: number, fullScaleUm: number): string {
  return `hsl(${deviationHue(deviationUm, fullScaleUm).toFixed(0)} 85% 55%)`;
}

/** The colour scale's full-scale value: four tolerances, so "within tolerance" stays green-ish. */
export function colourScaleUm(toleranceUm: number): number {
  return Math.max(4 * toleranceUm, 1e-3);
}
