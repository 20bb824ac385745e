import { boundingBox, geometryCentre, polygonArea, polylineLength } from "@/lib/geometry/measure";
import { summariseSavedEstimates } from "@/lib/layout-reading/saved-estimates";
import { csvRecords } from "./csv";
import type { AnyShape, MarkupKind } from "./types";

/** One line of the markup table; lengths in µm, areas in µm², in the die frame. */
export type MarkupTableRow = {
  readonly id: string;
  readonly kind: MarkupKind;
  /** What the analyst called it: a pad's label, a block's name, a note's text, else its label. */
  readonly label: string;
  /** Length along a line (wire bond, symmetry axis, trace, ruler); null for other geometry. */
  readonly lengthUm: number | null;
  /** Area inside a polygon less its holes (pad, block, die outline); null for other geometry. */
  readonly areaUm2: number | null;
  /** Bounding box size along the die frame's x and y. */
  readonly widthUm: number;
  readonly heightUm: number;
  /** Centre: a polygon's centre of area, a line's centre of length, a point itself. */
  readonly xUm: number;
  readonly yUm: number;
  /** The name of who drew the shape; empty when unknown (account removed). */
  readonly author: string;
  readonly updatedAt: string;
  /** Estimates saved on the shape, summarised ("L 0.865 nH · Z0 49.8 Ω (microstrip)"); empty when none. */
  readonly estimates: string;
};

function text(value: unknown): string {
  return typeof value === "string" ? value : "";
}

/** The label column: the property each kind is named by. */
export function shapeLabel(shape: AnyShape): string {
  const p = shape.properties as Record<string, unknown>;
  switch (shape.kind) {
    case "block":
      return text(p.name);
    case "note":
      return text(p.text);
    case "symmetry_axis":
      return text(p.label) || text(p.name);
    default:
      return text(p.label);
  }
}

/** One row per shape, in the order given. `authors` maps user ids to display names. */
export function markupTableRows(shapes: readonly AnyShape[], authors: Readonly<Record<string, string>>): MarkupTableRow[] {
  return shapes.map((shape) => {
    const g = shape.geometry;
    const box = boundingBox(g);
    const [xUm, yUm] = geometryCentre(g);
    return {
      id: shape.id,
      kind: shape.kind,
      label: shapeLabel(shape),
      lengthUm: g.type === "LineString" ? polylineLength(g.coordinates) : null,
      areaUm2: g.type === "Polygon" ? polygonArea(g) : null,
      widthUm: box.maxX - box.minX,
      heightUm: box.maxY - box.minY,
      xUm,
      yUm,
      author: shape.createdBy ? (authors[shape.createdBy] ?? "") : "",
      updatedAt: shape.updatedAt,
      estimates: summariseSavedEstimates(shape.properties),
    };
  });
}

const COLUMNS: readonly { header: string; value: (r: MarkupTableRow) => string | number | null }[] = [
  { header: "id", value: (r) => r.id },
  { header: "kind", value: (r) => r.kind },
  { header: "label", value: (r) => r.label },
  { header: "length_um", value: (r) => r.lengthUm },
  { header: "area_um2", value: (r) => r.areaUm2 },
  { header: "width_um", value: (r) => r.widthUm },
  { header: "height_um", value: (r) => r.heightUm },
  { header: "x_um", value: (r) => r.xUm },
  { header: "y_um", value: (r) => r.yUm },
  { header: "author", value: (r) => r.author },
  { header: "updated_at", value: (r) => r.updatedAt },
  { header: "estimates", value: (r) => r.estimates },
];

/** The CSV header of the markup table, in column order. */
export const MARKUP_TABLE_HEADERS: readonly string[] = COLUMNS.map((c) => c.header);

/**
 * The markup table as CSV (RFC 4180): a header row and one record per row, CRLF line ends,
 * µm values to `decimals` places (default 3: 1 nm, far below optical resolution), empty cells
 * where a column does not apply.
 */
export function markupTableCsv(rows: readonly MarkupTableRow[], decimals = 3): string {
  return csvRecords([MARKUP_TABLE_HEADERS, ...rows.map((row) => COLUMNS.map((c) => c.value(row)))], decimals);
}
