"use client";

import { useMemo, useState } from "react";
import type { Geometry } from "@/lib/geometry/types";
import type { AnyShape } from "@/lib/markup/types";
import { symmetryReport, SymmetryInputError, type SymmetryReport } from "@/lib/symmetry";
import { axisOfShape, colourScaleUm, symmetryShapes } from "@/lib/layout-reading/symmetry-view";
import type { OverlayDrawer } from "@/components/annotate/markup-overlay";
import { parseNumber } from "./fields";
import { symmetryGhostDrawer } from "./symmetry-ghosts";

const NO_DRAWERS: readonly OverlayDrawer[] = [];
const NO_SHAPES: readonly AnyShape[] = [];

export type SymmetryView = ReturnType<typeof useSymmetryView>;

/**
 * State of the symmetry reading, kept by the die bench so the canvas ghosts stay on while the
 * side panel shows another tab: the chosen axis, tolerance and search radius (typed), the
 * report recomputed on every markup change, and the overlay drawer when ghosts are on.
 */
export function useSymmetryView(markup: readonly AnyShape[] | undefined) {
  const shapes = markup ?? NO_SHAPES;
  const [axisId, setAxisId] = useState<string | null>(null);
  const [tolerance, setTolerance] = useState("1");
  const [radius, setRadius] = useState("50");
  const [showGhosts, setShowGhosts] = useState(false);
  const axes = useMemo(() => shapes.filter((s) => s.kind === "symmetry_axis"), [shapes]);
  const axisShape = axes.find((a) => a.id === axisId) ?? axes[0] ?? null;
  const axis = useMemo(() => (axisShape ? axisOfShape(axisShape) : null), [axisShape]);
  const toleranceUm = parseNumber(tolerance);

  const computed = useMemo((): { report: SymmetryReport | null; error: string | null } => {
    if (!axis) return { report: null, error: null };
    try {
      return { report: symmetryReport(symmetryShapes(shapes), axis, { toleranceUm, maxDistanceUm: parseNumber(radius) }), error: null };
    } catch (e) {
      if (e instanceof SymmetryInputError) return { report: null, error: e.message };
      throw e;
    }
  }, [shapes, axis, toleranceUm, radius]);

  const fullScaleUm = colourScaleUm(Number.isFinite(toleranceUm) ? toleranceUm : 1);
  const drawers = useMemo(() => {
    if (!showGhosts || !computed.report || !axis) return NO_DRAWERS;
    const geometryOf = new Map<string, Geometry>(shapes.map((s) => [s.id, s.geometry]));
    return [symmetryGhostDrawer(computed.report, axis, geometryOf, fullScaleUm)];
  }, [showGhosts, computed.report, axis, shapes, fullScaleUm]);

  return { axes, axisShape, setAxisId, tolerance, setTolerance, radius, setRadius, showGhosts, setShowGhosts, fullScaleUm, ...computed, drawers };
}
