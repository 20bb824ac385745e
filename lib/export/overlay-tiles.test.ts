import { describe, expect, it } from "vitest";
import type { AnyShape } from "@/lib/markup/types";
import { markupTiles } from "./overlay-tiles";

// 1 µm per output px, y flipped over a 4096 × 1024 px output: X = x, Y = 1024 − y (written by hand).
const m = [
  [1, 0, 0],
  [0, -1, 1024],
] as const;
const pad = (id: string, x: number, y: number, label = ""): AnyShape =>
  ({
    id,
    kind: "pad",
    geometry: {
      type: "Polygon",
      coordinates: [
        [
          [x, y],
          [x + 40, y],
          [x + 40, y + 40],
          [x, y + 40],
          [x, y],
        ],
      ],
    },
    properties: { label, net: "", state: "bonded" },
    version: 1,
    createdBy: null,
    updatedAt: "2025-01-01T00:00:00.000Z",
  }) as AnyShape;

describe("markupTiles", () => {
  it("puts a shape only in the tiles it reaches and leaves empty tiles out", () => {
    // A pad at output X 100–140, Y 884–924: the bottom-left tile (left 0, top 512) alone.
    const tiles = markupTiles([pad("a", 100, 100)], [], m, 4096, 1024, { labels: false });
    expect(tiles.map((t) => [t.left, t.top])).toEqual([[0, 512]]);
    expect(tiles[0].svg).toContain('width="1024" height="512"');
  });

  it("draws a shape on a tile boundary in both tiles, each shifted to its own origin", () => {
    const tiles = markupTiles([pad("b", 1010, 600)], [], m, 4096, 1024, { labels: false });
    expect(tiles.map((t) => [t.left, t.top])).toEqual([
      [0, 0],
      [1024, 0],
    ]);
    // X 1010 is 1010 in the first tile and −14 in the second.
    expect(tiles[0].svg).toContain("M1010,");
    expect(tiles[1].svg).toContain("M-14,");
  });

  it("widens a shape's reach by its label plate, and by nothing without labels", () => {
    const labelled = pad("c", 900, 100, "A_VERY_LONG_PAD_LABEL"); // X 900–940; the label plate is ~570 px wide
    expect(markupTiles([labelled], [], m, 4096, 1024, { labels: false })).toHaveLength(1);
    expect(markupTiles([labelled], [], m, 4096, 1024, { labels: true }).map((t) => t.left)).toEqual([0, 1024]);
  });

  it("places thread markers in the tile under them", () => {
    const tiles = markupTiles([], [{ at: [2800, 900], open: true, number: 7 }], m, 4096, 1024, { labels: false });
    expect(tiles.map((t) => [t.left, t.top])).toEqual([[2048, 0]]);
    expect(tiles[0].svg).toContain(">7</text>");
  });
});
