import type { PolygonGeometry } from "../geometry/types";

export type PadState = "bonded" | "probed" | "unbonded";

/** Die edge a pad sits on, seen in the die frame (y up): N top, E right, S bottom, W left. */
export type PadSide = "N" | "E" | "S" | "W";

/** A pad as stored in markup: a rectangle in die µm with its analyst-given properties. */
export type PadInput = {
  readonly id: string;
  readonly geometry: PolygonGeometry;
  readonly properties: {
    readonly label: string;
    readonly net: string;
    readonly state: PadState;
    /** Set on the pad the analyst chose as pad 1 (overridden by the padOneId option). */
    readonly isPadOne?: boolean;
    /** Numbered even though its centre lies outside the die outline (the analyst said so). */
    readonly numberOutside?: boolean;
  };
};

export type PadTableOptions = {
  /** Id of the pad to number 1; default: a pad flagged isPadOne, else the topmost on the left edge. */
  readonly padOneId?: string;
};

/** One line of the pad table; lengths in µm, in the die outline's own axes. */
export type PadRow = {
  readonly number: number;
  readonly id: string;
  readonly label: string;
  readonly net: string;
  readonly state: PadState;
  readonly side: PadSide;
  /** Centre from the die's lower-left corner. */
  readonly xUm: number;
  readonly yUm: number;
  /** Centre from the die centre. */
  readonly xFromCentreUm: number;
  readonly yFromCentreUm: number;
  /** Extent along the die's x axis and y axis. */
  readonly widthUm: number;
  readonly heightUm: number;
  /** Centre-to-centre distance along the side to the next pad counter-clockwise; null for the last. */
  readonly pitchUm: number | null;
};

export type PadTable = {
  readonly die: { readonly widthUm: number; readonly heightUm: number; readonly rotationDeg: number };
  readonly rows: readonly PadRow[];
  /** Pads whose centre lies outside the die outline, left out of the numbering (centre in outline axes). */
  readonly outsideDie: readonly { readonly id: string; readonly label: string; readonly xUm: number; readonly yUm: number }[];
  readonly summary: {
    readonly padsPerSide: Readonly<Record<PadSide, number>>;
    /** Smallest pitch on any side; null when no side has two pads. */
    readonly minPitchUm: number | null;
    /** Pads whose state is probed: touched by a probe needle but carrying no bond. */
    readonly probedNotBonded: readonly { readonly number: number; readonly id: string; readonly label: string }[];
  };
};
