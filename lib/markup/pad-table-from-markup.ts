import { buildPadTable, PadTableInputError, type PadInput, type PadTable } from "@/lib/pads";
import type { PolygonGeometry } from "@/lib/geometry/types";
import { bondedPadIds, shownPadState } from "./pad-state";
import type { AnyShape, Shape } from "./types";

/** Where the die outline of a pad table came from. */
type OutlineSource = "die_outline" | "die_size";

export type PadTableResult =
  | { readonly ok: true; readonly table: PadTable; readonly outlineSource: OutlineSource }
  /** bad_request: the caller asked for something impossible; conflict: the die's markup cannot make a table yet. */
  | { readonly ok: false; readonly reason: "bad_request" | "conflict"; readonly message: string };

/** The rectangle [0, 0]–[width, height] of a die whose size is known. */
export function dieRectangle(widthUm: number, heightUm: number): PolygonGeometry {
  return {
    type: "Polygon",
    coordinates: [
      [
        [0, 0],
        [widthUm, 0],
        [widthUm, heightUm],
        [0, heightUm],
        [0, 0],
      ],
    ],
  };
}

function toPadInput(shape: Shape<"pad">, bonded: ReadonlySet<string>): PadInput {
  const p = shape.properties;
  return {
    id: shape.id,
    geometry: shape.geometry,
    properties: { label: p.label, net: p.net, state: shownPadState(shape, bonded), isPadOne: p.isPadOne, numberOutside: p.numberOutside },
  };
}

/**
 * The pad table of a die from its markup: its pads, numbered around its drawn die outline, or
 * around the rectangle of its recorded size when no outline is drawn. States are the shown ones
 * (from the wire bonds unless set by hand); pads off the die are listed apart, unnumbered.
 * @param options.padOneId the pad to number 1 (else a pad flagged isPadOne, else the topmost on the left edge)
 */
export function padTableFromMarkup(
  shapes: readonly AnyShape[],
  die: { readonly widthUm: number | null; readonly heightUm: number | null },
  options: { readonly padOneId?: string } = {},
): PadTableResult {
  const bonded = bondedPadIds(shapes);
  const pads = shapes.filter((s): s is Shape<"pad"> => s.kind === "pad").map((s) => toPadInput(s, bonded));
  if (options.padOneId !== undefined && !pads.some((p) => p.id === options.padOneId)) {
    return { ok: false, reason: "bad_request", message: `Pad 1 must be one of the die's pads; ${options.padOneId} is not.` };
  }
  const outlines = shapes.filter((s): s is Shape<"die_outline"> => s.kind === "die_outline");
  if (outlines.length > 1) {
    return { ok: false, reason: "conflict", message: `The die has ${outlines.length} die outlines; delete all but one to number its pads.` };
  }
  let outline: PolygonGeometry;
  let outlineSource: OutlineSource;
  if (outlines.length === 1) {
    outline = outlines[0].geometry;
    outlineSource = "die_outline";
  } else if (die.widthUm && die.heightUm) {
    outline = dieRectangle(die.widthUm, die.heightUm);
    outlineSource = "die_size";
  } else {
    return { ok: false, reason: "conflict", message: "The die has no outline and no recorded size: draw its die outline or enter its width and height." };
  }
  try {
    return { ok: true, table: buildPadTable(pads, outline, options), outlineSource };
  } catch (e) {
    if (e instanceof PadTableInputError) return { ok: false, reason: "conflict", message: `The pad table cannot be made: ${e.message}.` };
    throw e;
  }
}
