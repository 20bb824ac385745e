/**
 * The die at a glance: its size (from the marked die outline, else the recorded size), pad
 * count and density, pad states, and the estimates saved on its shapes.
 */
import { boundingBox } from "../geometry/measure";
import type { AnyShape, MarkupKind, SavedEstimate } from "../markup/types";
import { dieFrameFromOutline } from "../pads/die-frame";
import { bondedPadIds, shownPadState } from "../markup/pad-state";
import { savedEstimatesOf } from "./saved-estimates";

export type DieSize = {
  readonly widthUm: number;
  readonly heightUm: number;
  /** die_outline: a rectangle marked on the die; outline_box: a non-rectangular outline's bounding box; recorded: the die's width and height fields. */
  readonly source: "die_outline" | "outline_box" | "recorded";
};

/**
 * The die's size: the marked die outline when there is exactly one (its own sides, so a
 * rotated rectangle reads true), else the recorded width and height, else null.
 */
export function dieSize(shapes: readonly AnyShape[], recorded: { readonly widthUm: number | null; readonly heightUm: number | null }): DieSize | null {
  const outlines = shapes.filter((s) => s.kind === "die_outline");
  if (outlines.length === 1 && outlines[0].geometry.type === "Polygon") {
    try {
      const f = dieFrameFromOutline(outlines[0].geometry);
      return { widthUm: f.widthUm, heightUm: f.heightUm, source: "die_outline" };
    } catch {
      const b = boundingBox(outlines[0].geometry);
      return { widthUm: b.maxX - b.minX, heightUm: b.maxY - b.minY, source: "outline_box" };
    }
  }
  if (recorded.widthUm && recorded.heightUm) return { widthUm: recorded.widthUm, heightUm: recorded.heightUm, source: "recorded" };
  return null;
}

export type PadDensity = {
  readonly areaMm2: number;
  readonly perimeterMm: number;
  /** Pads per mm of die edge: what limits a pad-limited die. */
  readonly padsPerMm: number;
  readonly padsPerMm2: number;
};

/** Pad density of a rectangular die of this size (µm) with `padCount` pads. */
export function padDensity(padCount: number, widthUm: number, heightUm: number): PadDensity {
  const areaMm2 = (widthUm * heightUm) / 1e6;
  const perimeterMm = (2 * (widthUm + heightUm)) / 1e3;
  return { areaMm2, perimeterMm, padsPerMm: padCount / perimeterMm, padsPerMm2: padCount / areaMm2 };
}

export type PadStateCounts = { readonly total: number; readonly bonded: number; readonly probed: number; readonly unbonded: number };

/**
 * Pads counted by their shown state (from the wire bonds unless set by hand; a pad with an
 * unknown stored state counts only in the total).
 */
export function padStateCounts(shapes: readonly AnyShape[]): PadStateCounts {
  const c = { total: 0, bonded: 0, probed: 0, unbonded: 0 };
  const bonded = bondedPadIds(shapes);
  for (const s of shapes) {
    if (s.kind !== "pad") continue;
    c.total++;
    const st = s.properties.state;
    if (st === "bonded" || st === "probed" || st === "unbonded") c[shownPadState(s, bonded)]++;
  }
  return c;
}

export type SavedEstimateRow = {
  readonly shapeId: string;
  readonly shapeKind: MarkupKind;
  readonly label: string;
  readonly key: string;
  readonly estimate: SavedEstimate;
};

/** Every estimate saved on the die's shapes, one row each, in drawing order. */
export function savedEstimateRows(shapes: readonly AnyShape[], labelOf: (s: AnyShape) => string): SavedEstimateRow[] {
  return shapes.flatMap((s) =>
    Object.entries(savedEstimatesOf(s.properties)).map(([key, estimate]) => ({ shapeId: s.id, shapeKind: s.kind, label: labelOf(s), key, estimate })),
  );
}
