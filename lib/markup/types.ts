import type { Geometry, LineStringGeometry, PointGeometry, PolygonGeometry } from "@/lib/geometry/types";

/**
 * Markup is plain, readonly data in the die frame (µm, origin lower-left, y up), never in one
 * image's pixels, so it shows on every aligned micrograph. Geometry is GeoJSON-shaped.
 */
export const MARKUP_KINDS = ["pad", "wire_bond", "block", "symmetry_axis", "trace", "ruler", "note", "die_outline"] as const;
export type MarkupKind = (typeof MARKUP_KINDS)[number];

export const PAD_STATES = ["bonded", "probed", "unbonded"] as const;
export type PadState = (typeof PAD_STATES)[number];

/** Bumped when the stored shape of markup changes, so old exports can be read. */
export const MARKUP_SCHEMA_VERSION = 1;

export type PadProperties = {
  label: string;
  net: string;
  /** The stored state; what is shown follows the pad's wire bonds unless `stateByHand` (see pad-state.ts). */
  state: PadState;
  /** True when the analyst chose the state; false or absent: it follows the wire bonds. */
  stateByHand?: boolean;
  side?: "N" | "E" | "S" | "W" | "";
  isPadOne?: boolean;
  /** Numbered in the pad table even though its centre lies outside the die outline. */
  numberOutside?: boolean;
};
type WireBondProperties = { label?: string; diameterUm: number; padId?: string | null };
export type BlockProperties = { name: string; function: string };
type SymmetryAxisProperties = { name?: string; label?: string };
type TraceProperties = { label?: string; widthUm: number; layerNote?: string };
type RulerProperties = { label?: string };
type NoteProperties = { text: string };
type DieOutlineProperties = { label?: string };

export type PropertiesOf = {
  pad: PadProperties;
  wire_bond: WireBondProperties;
  block: BlockProperties;
  symmetry_axis: SymmetryAxisProperties;
  trace: TraceProperties;
  ruler: RulerProperties;
  note: NoteProperties;
  die_outline: DieOutlineProperties;
};

export type GeometryOf = {
  pad: PolygonGeometry;
  wire_bond: LineStringGeometry;
  block: PolygonGeometry;
  symmetry_axis: LineStringGeometry;
  trace: LineStringGeometry;
  ruler: LineStringGeometry;
  note: PointGeometry;
  die_outline: PolygonGeometry;
};

/** A shape as the API returns it. `estimates` (saved electrical estimates) may sit in properties. */
export type Shape<K extends MarkupKind = MarkupKind> = {
  readonly id: string;
  readonly kind: K;
  readonly geometry: K extends MarkupKind ? GeometryOf[K] : Geometry;
  readonly properties: K extends MarkupKind ? PropertiesOf[K] & Record<string, unknown> : Record<string, unknown>;
  readonly version: number;
  readonly createdBy: string | null;
  readonly updatedAt: string;
};

export type AnyShape = { [K in MarkupKind]: Shape<K> }[MarkupKind];

/** One saved estimate result: a flat record of small values (inputs, outputs, units). */
export type SavedEstimate = Readonly<Record<string, number | string | boolean | null>>;
/** Saved estimates a shape may carry in `properties.estimates`, keyed by the estimate's name. */
export type SavedEstimates = Readonly<Record<string, SavedEstimate>>;
