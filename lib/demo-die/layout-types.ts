// The shapes of the demo die's layout description (values in layout.ts).
import type { Position } from "../geometry/types";

export type PadState = "bonded" | "probed" | "unbonded";
export type DieSide = "left" | "right" | "top" | "bottom";

export type Pad = {
  readonly label: string;
  readonly net: string;
  readonly state: PadState;
  readonly side: DieSide;
  readonly centreUm: Position;
  /** Metal size [w, h]; the passivation opening is inset by `padOpeningInsetUm`. */
  readonly sizeUm: Position;
};

/** A wire bond from the pad centre (ball) straight out beyond the die edge (to the package). */
export type WireBond = { readonly pad: string; readonly fromUm: Position; readonly toUm: Position; readonly diameterUm: number };

/** A functional block; the polygon ring is closed (first position repeated, as in RFC 7946). */
export type Block = { readonly name: string; readonly function: string; readonly polygonUm: readonly Position[] };

/** A square spiral inductor drawn as a symmetric (centre-tapped) winding. */
export type Spiral = {
  readonly name: string;
  readonly centreUm: Position;
  readonly turns: number;
  readonly outerDiameterUm: number;
  readonly widthUm: number;
  readonly spacingUm: number;
};

/** A metal line given by its centre line and width. */
export type Trace = { readonly name: string; readonly pointsUm: readonly Position[]; readonly widthUm: number };

export type Capacitor = { readonly name: string; readonly function: string; readonly centreUm: Position; readonly sizeUm: Position };

/** Text in top metal; `positionUm` is the left end of the baseline. */
export type TextMark = {
  readonly kind: "maker" | "part" | "mask_id" | "date_code";
  readonly text: string;
  readonly positionUm: Position;
  readonly heightUm: number;
};

export type DieLayout = {
  readonly part: string;
  readonly maker: string;
  readonly process: string;
  readonly description: string;
  readonly dieSizeUm: Position;
  readonly symmetryAxisYUm: number;
  readonly sealRing: { readonly insetUm: number; readonly widthUm: number };
  readonly padOpeningInsetUm: number;
  readonly pads: readonly Pad[];
  readonly wireBonds: readonly WireBond[];
  readonly blocks: readonly Block[];
  readonly spirals: readonly Spiral[];
  readonly meanders: readonly Trace[];
  readonly routes: readonly Trace[];
  readonly capacitors: readonly Capacitor[];
  readonly textMarks: readonly TextMark[];
};
