import type { AnyShape, PadProperties, PadState } from "./types";

/**
 * The state a pad shows (inspector, pad table, summary, CSV, PDF). A pad's state follows its
 * wire bonds (bonded when at least one bond is attached, else unbonded) unless the analyst set
 * it by hand. Probed cannot be seen from the markup, so it is always a choice by hand; a pad
 * stored as probed without the flag (drawn before the flag existed) keeps it.
 */
export function isPadStateByHand(p: Pick<PadProperties, "state" | "stateByHand">): boolean {
  return p.stateByHand ?? p.state === "probed";
}

/** Ids of the pads that at least one wire bond in `shapes` is attached to. */
export function bondedPadIds(shapes: Iterable<AnyShape>): Set<string> {
  const ids = new Set<string>();
  for (const s of shapes) if (s.kind === "wire_bond" && s.properties.padId) ids.add(s.properties.padId);
  return ids;
}

/** The state of one pad as shown, given the ids of the pads that carry a bond. */
export function shownPadState(
  pad: { readonly id: string; readonly properties: Pick<PadProperties, "state" | "stateByHand"> },
  bonded: ReadonlySet<string>,
): PadState {
  if (isPadStateByHand(pad.properties)) return pad.properties.state;
  return bonded.has(pad.id) ? "bonded" : "unbonded";
}

/** The shown state of every pad in `shapes`, by pad id. */
function shownPadStates(shapes: readonly AnyShape[]): Map<string, PadState> {
  const bonded = bondedPadIds(shapes);
  const out = new Map<string, PadState>();
  for (const s of shapes) if (s.kind === "pad") out.set(s.id, shownPadState(s, bonded));
  return out;
}

/**
 * The shapes with each pad's state replaced by the state it shows, for renderers that see only
 * some of the shapes (a subset of kinds, one overlay tile) and so cannot count its bonds.
 */
export function withShownPadStates(shapes: readonly AnyShape[]): AnyShape[] {
  const states = shownPadStates(shapes);
  return shapes.map((s) => (s.kind === "pad" ? { ...s, properties: { ...s.properties, state: states.get(s.id)!, stateByHand: true } } : s));
}
