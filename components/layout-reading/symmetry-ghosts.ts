import type { Affine2x3, Geometry, Position } from "@/lib/geometry/types";
import { axisLine, mirrorGeometry, type SymmetryReport } from "@/lib/symmetry";
import type { LineStringGeometry } from "@/lib/geometry/types";
import { deviationColour } from "@/lib/layout-reading/symmetry-view";
import type { OverlayDrawer } from "@/components/annotate/markup-overlay";

const UNMATCHED_COLOUR = "rgba(215, 221, 226, 0.85)";

function trace(ctx: CanvasRenderingContext2D, m: Affine2x3, g: Geometry) {
  const to = ([x, y]: Position): [number, number] => [m[0][0] * x + m[0][1] * y + m[0][2], m[1][0] * x + m[1][1] * y + m[1][2]];
  ctx.beginPath();
  if (g.type === "Point") {
    const [sx, sy] = to(g.coordinates);
    ctx.arc(sx, sy, 6, 0, Math.PI * 2);
    return;
  }
  const rings = g.type === "LineString" ? [g.coordinates] : g.coordinates;
  for (const ring of rings) {
    ring.forEach((p, i) => {
      const [sx, sy] = to(p);
      if (i === 0) ctx.moveTo(sx, sy);
      else ctx.lineTo(sx, sy);
    });
    if (g.type === "Polygon") ctx.closePath();
  }
}

function ghost(ctx: CanvasRenderingContext2D, m: Affine2x3, g: Geometry, colour: string, dash: number[]) {
  trace(ctx, m, g);
  ctx.setLineDash([]);
  ctx.lineWidth = 3.5;
  ctx.strokeStyle = "rgba(0,0,0,0.55)";
  ctx.stroke();
  ctx.setLineDash(dash);
  ctx.lineWidth = 1.5;
  ctx.strokeStyle = colour;
  ctx.stroke();
}

/**
 * Ghost outlines of the mirror images: each pair's partner reflected onto the other side,
 * coloured by the pair's deviation, so a symmetric pair shows its ghost on top of the shape;
 * shapes with no partner show their mirror image in grey where the partner is missing.
 */
export function symmetryGhostDrawer(
  report: SymmetryReport,
  axis: LineStringGeometry,
  geometryOf: ReadonlyMap<string, Geometry>,
  fullScaleUm: number,
): OverlayDrawer {
  const line = axisLine(axis);
  const mirrored = new Map<string, Geometry>();
  const mirror = (id: string) => {
    if (!mirrored.has(id)) {
      const g = geometryOf.get(id);
      if (g) mirrored.set(id, mirrorGeometry(g, line));
    }
    return mirrored.get(id);
  };
  return (ctx, matrix) => {
    ctx.save();
    ctx.lineJoin = "round";
    for (const p of report.pairs) {
      const colour = deviationColour(p.deviationUm, fullScaleUm);
      for (const id of p.selfPaired ? [p.aId] : [p.aId, p.bId]) {
        const g = mirror(id);
        if (g) ghost(ctx, matrix, g, colour, [6, 4]);
      }
    }
    for (const u of report.unmatched) {
      const g = mirror(u.id);
      if (g) ghost(ctx, matrix, g, UNMATCHED_COLOUR, [2, 4]);
    }
    ctx.restore();
  };
}
