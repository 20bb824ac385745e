import type { Geometry, LineStringGeometry } from "../geometry/types";

/** Kinds that take part in a symmetry report; other markup kinds are ignored. */
export const SYMMETRY_KINDS = ["pad", "block", "trace"] as const;
export type SymmetryKind = (typeof SYMMETRY_KINDS)[number];

/** A markup shape as the report needs it: geometry in die µm. */
export type SymmetryShape = { readonly id: string; readonly kind: string; readonly geometry: Geometry };

/** The symmetry axis: a LineString of exactly two distinct points in die µm. */
export type SymmetryAxis = LineStringGeometry;

export type SymmetryOptions = {
  /** Largest centre offset still counted as symmetric (default 1 µm). */
  toleranceUm?: number;
  /** Largest size difference still counted as symmetric (default: toleranceUm). */
  sizeToleranceUm?: number;
  /** Pairs whose centre offset exceeds this are not made; the shapes stay unmatched (default 50 µm). */
  maxDistanceUm?: number;
};

type Vector = { readonly x: number; readonly y: number };

/** Size difference A − mirror(B): bounding-box width and height, or length for traces. */
export type SizeDifference = { readonly widthUm: number; readonly heightUm: number } | { readonly lengthUm: number };

export type SymmetryPair = {
  readonly kind: SymmetryKind;
  /** Shape on the left of the axis direction (or on the axis). */
  readonly aId: string;
  /** Its partner on the other side; equal to aId for a shape that is its own mirror image. */
  readonly bId: string;
  readonly selfPaired: boolean;
  /** Centre of A minus centre of the mirror image of B, die µm. */
  readonly offsetUm: Vector;
  /** |offsetUm|; for a self-paired shape, twice its centre's distance from the axis. */
  readonly deviationUm: number;
  readonly sizeDifferenceUm: SizeDifference;
  readonly withinTolerance: boolean;
};

export type UnmatchedShape = { readonly id: string; readonly kind: SymmetryKind };

export type SymmetryReport = {
  readonly pairs: SymmetryPair[];
  readonly unmatched: UnmatchedShape[];
  /** `pairs` holds the shapes on the axis too (selfPaired); the summary counts them apart. */
  readonly summary: {
    /** Pairs of two different shapes mirrored across the axis. */
    readonly pairCount: number;
    readonly withinToleranceCount: number;
    /** Shapes on the axis, each its own mirror image. */
    readonly onAxisCount: number;
    readonly onAxisWithinToleranceCount: number;
    /** Largest and mean offset over the pairs of two shapes (shapes on the axis left out). */
    readonly maxDeviationUm: number;
    readonly meanDeviationUm: number;
    /** Sum of deviations over all pairs and on-axis shapes: the quantity the assignment minimises. */
    readonly totalDeviationUm: number;
  };
  readonly options: Required<SymmetryOptions>;
};

/** Thrown for an unusable axis or options. */
export class SymmetryInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "SymmetryInputError";
  }
}
