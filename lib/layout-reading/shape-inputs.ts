/**
 * What the estimate formulas can take from a marked shape: a wire bond's drawn length and its
 * wire diameter, a trace's centre-line length and width, a block's size as a spiral's outer
 * diameter. Everything in die µm; the rest of each formula's inputs are typed by the analyst.
 */
import { boundingBox, polylineLength } from "../geometry/measure";
import type { AnyShape } from "../markup/types";

/** Wire diameter assumed when a wire bond has none recorded: the common 25 µm gold wire. */
const DEFAULT_WIRE_DIAMETER_UM = 25;

/** Which estimate forms a shape of this kind offers; empty for kinds with none. */
export type ShapeEstimateRole = "wire-bond" | "trace" | "spiral-block" | null;

/** The estimates a shape can feed, by its kind. */
export function estimateRoleOf(shape: AnyShape): ShapeEstimateRole {
  if (shape.kind === "wire_bond") return "wire-bond";
  if (shape.kind === "trace") return "trace";
  if (shape.kind === "block") return "spiral-block";
  return null;
}

/** A wire bond's length along its drawn path and its wire diameter (default 25 µm). */
export function wireBondInputs(shape: AnyShape & { kind: "wire_bond" }): { lengthUm: number; diameterUm: number } {
  const d = shape.properties.diameterUm;
  return {
    lengthUm: polylineLength(shape.geometry.coordinates),
    diameterUm: typeof d === "number" && Number.isFinite(d) && d > 0 ? d : DEFAULT_WIRE_DIAMETER_UM,
  };
}

/** A trace's centre-line length (meanders included, every segment counted) and its width. */
export function traceInputs(shape: AnyShape & { kind: "trace" }): { lengthUm: number; widthUm: number } {
  return { lengthUm: polylineLength(shape.geometry.coordinates), widthUm: shape.properties.widthUm };
}

/**
 * A spiral's outer diameter from the block drawn around it: the shorter side of the block's
 * bounding box, since the winding has to fit inside the block both ways.
 */
export function spiralOuterDiameterFromBlock(shape: AnyShape & { kind: "block" }): number {
  const b = boundingBox(shape.geometry);
  return Math.min(b.maxX - b.minX, b.maxY - b.minY);
}
