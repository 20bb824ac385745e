/**
 * Kerfline's remark marker, one design for the screen and the exports: a square tag holding the
 * remark's number, standing up and to the right of the place it marks on a short slanted tail
 * whose tip is exactly that place. Open remarks are filled copper; closed ones are a grey outline
 * on a dark plate, so the number stays readable on bright and dark micrographs alike.
 *
 * Coordinates are px of the surface drawn on (screen or output image), y down, with the tip at
 * (0, 0); the drawers only translate. Sizes are data, so both drawers scale the same shape.
 */

/** A remark as a marker shows it; the stored status `resolved` reads as closed. */
export type RemarkMarkerState = "open" | "closed";

/** Colours of each state; `plate` is the fill (copper when open, a dark translucent plate when closed). */
export const REMARK_MARKER_STYLES: Readonly<Record<RemarkMarkerState, { readonly plate: string; readonly edge: string; readonly number: string }>> = {
  open: { plate: "#d27f42", edge: "#2a1608", number: "#fff8f0" },
  closed: { plate: "rgba(13,15,17,0.72)", edge: "#a3adb6", number: "#c9d0d6" },
};

/** Proportions of the tag, as fractions of its size (the square body's side). */
export const REMARK_MARKER_PROPORTIONS = {
  /** How far the body's lower edge stands above the tip. */
  tailRise: 0.45,
  /** How far the body's left edge stands right of the tip. */
  tailRun: 0.3,
  /** Width of the tail where it meets the body. */
  tailBase: 0.4,
  /** Advance of one digit in em (DejaVu Sans Bold: 1425 of 2048 units); a long number widens the body. */
  digitEm: 0.7,
  /** Room left and right of the number, together. */
  numberMargin: 0.3,
  /** Number height (font size) and edge width. */
  font: 0.56,
  edge: 0.09,
  /** Where SVG text's baseline goes below the number's centre, in em (DejaVu digits' middle; canvas centres by itself). */
  numberBaselineEm: 0.36,
} as const;

/** Body sizes in px: on screen (grown when selected), and in an export from its label font size. */
export const REMARK_MARKER_SIZES = {
  screenPx: 16,
  selectedScale: 1.3,
  exportPerFontPx: 1.35,
} as const;

export type RemarkMarkerShape = {
  /** The closed outline, tip first: tip → tail root → body corners → tail root again. */
  readonly outline: readonly (readonly [number, number])[];
  /** Where the number is centred, and its font size. */
  readonly label: { readonly x: number; readonly y: number; readonly fontPx: number };
  readonly edgePx: number;
  /** Bounding box of the outline relative to the tip. */
  readonly box: { readonly minX: number; readonly minY: number; readonly maxX: number; readonly maxY: number };
};

/** The stored status as the marker shows it. */
export const remarkMarkerState = (status: "open" | "resolved"): RemarkMarkerState => (status === "open" ? "open" : "closed");

/** The marker of remark `number` with a body of side `size` px, tip at (0, 0). */
export function remarkMarkerShape(size: number, number: number): RemarkMarkerShape {
  const p = REMARK_MARKER_PROPORTIONS;
  const digits = String(number).length;
  const width = size * Math.max(1, digits * p.digitEm * p.font + p.numberMargin);
  const left = size * p.tailRun;
  const bottom = -size * p.tailRise;
  const top = bottom - size;
  const outline: [number, number][] = [
    [0, 0],
    [left + size * p.tailBase, bottom],
    [left + width, bottom],
    [left + width, top],
    [left, top],
    [left, bottom],
  ];
  return {
    outline,
    label: { x: left + width / 2, y: (top + bottom) / 2, fontPx: size * p.font },
    edgePx: size * p.edge,
    box: { minX: 0, minY: top, maxX: left + width, maxY: 0 },
  };
}

/** The outline as an SVG path with the tip at (x, y). */
export function remarkMarkerPath(shape: RemarkMarkerShape, x: number, y: number): string {
  const f = (v: number) => String(Math.round(v * 100) / 100);
  return `M${shape.outline.map(([px, py]) => `${f(x + px)},${f(y + py)}`).join("L")}Z`;
}
