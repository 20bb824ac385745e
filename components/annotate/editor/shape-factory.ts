import type { AnyShape, BlockProperties, PadProperties } from "@/lib/markup/types";
import type { DraftShape } from "./types";

/** Side of the square pad a plain click places, in µm: a typical bond pad (common practice). */
export const DEFAULT_PAD_SIZE_UM = 80;
/** Bond wire diameter of a new wire bond, in µm: 1 mil gold wire (common practice). */
export const DEFAULT_BOND_DIAMETER_UM = 25;
/** Width of a new trace, in µm. */
export const DEFAULT_TRACE_WIDTH_UM = 5;

/** Where new shapes get their id, time stamp and author. */
export type ShapeStamp = { readonly newId: () => string; readonly now: () => string; readonly userId: string | null };

/**
 * A new shape from a draft. Version 0 marks it as not yet saved: the server's echo brings the
 * real version.
 */
export function createShape(draft: DraftShape, stamp: ShapeStamp): AnyShape {
  return { ...draft, id: stamp.newId(), version: 0, createdBy: stamp.userId, updatedAt: stamp.now() } as AnyShape;
}

/** `<prefix><n>` with the smallest n ≥ 1 that no name in `taken` uses, so gaps left by deletions fill first. */
export function nextFreeName(prefix: string, taken: Iterable<string>): string {
  const used = new Set(taken);
  let n = 1;
  while (used.has(`${prefix}${n}`)) n++;
  return `${prefix}${n}`;
}

function namesOf(shapes: Iterable<AnyShape>, kind: AnyShape["kind"], key: string): string[] {
  const names: string[] = [];
  for (const s of shapes) {
    const value = (s.properties as Record<string, unknown>)[key];
    if (s.kind === kind && typeof value === "string") names.push(value);
  }
  return names;
}

/**
 * Properties of a new pad: the next free label P1, P2, …, no net yet, unbonded. The state then
 * follows the wire bonds attached to it until the analyst sets one by hand.
 */
export function newPadProperties(shapes: Iterable<AnyShape>): PadProperties {
  return { label: nextFreeName("P", namesOf(shapes, "pad", "label")), net: "", state: "unbonded" };
}

/** Properties of a new block: the next free name "Block 1", "Block 2", …, no function yet. */
export function newBlockProperties(shapes: Iterable<AnyShape>): BlockProperties {
  return { name: nextFreeName("Block ", namesOf(shapes, "block", "name")), function: "" };
}

/** Name of a new symmetry axis: "Axis 1", "Axis 2", … among the axes that remain. */
export function newAxisName(shapes: Iterable<AnyShape>): string {
  return nextFreeName("Axis ", namesOf(shapes, "symmetry_axis", "name"));
}
