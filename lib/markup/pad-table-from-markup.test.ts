import { describe, it, expect } from "vitest";
import { dieRectangle, padTableFromMarkup } from "./pad-table-from-markup";
import type { AnyShape } from "./types";

const T = "2026-03-02T10:00:00.000Z";
const square = (cx: number, cy: number, half = 40) => ({
  type: "Polygon" as const,
  coordinates: [
    [
      [cx - half, cy - half],
      [cx + half, cy - half],
      [cx + half, cy + half],
      [cx - half, cy + half],
      [cx - half, cy - half],
    ] as [number, number][],
  ],
});
const pad = (id: string, cx: number, cy: number, extra: Record<string, unknown> = {}): AnyShape =>
  ({
    id,
    kind: "pad",
    geometry: square(cx, cy),
    properties: { label: id.toUpperCase(), net: "", state: "bonded", ...extra },
    version: 1,
    createdBy: null,
    updatedAt: T,
  }) as AnyShape;
const outline = (id: string, w: number, h: number): AnyShape =>
  ({ id, kind: "die_outline", geometry: dieRectangle(w, h), properties: {}, version: 1, createdBy: null, updatedAt: T }) as AnyShape;
const note: AnyShape = {
  id: "n",
  kind: "note",
  geometry: { type: "Point", coordinates: [5, 5] },
  properties: { text: "x" },
  version: 1,
  createdBy: null,
  updatedAt: T,
};

// The invented demo die: 2400 µm × 1600 µm. Pads 80 µm square, 60 µm in from the edge.
const DIE = { widthUm: 2400, heightUm: 1600 };
const shapes = [pad("w1", 60, 1400), pad("s1", 1200, 60), pad("e1", 2340, 800), pad("n1", 1200, 1540), note];

describe("padTableFromMarkup", () => {
  it("numbers the pads around the die's rectangle when no outline is drawn", () => {
    const r = padTableFromMarkup(shapes, DIE);
    if (!r.ok) throw new Error(r.message);
    expect(r.outlineSource).toBe("die_size");
    // Hand-worked: counter-clockwise in the y-up frame from the top of the left edge: W, S, E, N.
    expect(r.table.rows.map((row) => [row.number, row.id, row.side])).toEqual([
      [1, "w1", "W"],
      [2, "s1", "S"],
      [3, "e1", "E"],
      [4, "n1", "N"],
    ]);
    // Centre (60, 1400) is 1140 µm left of and 600 µm above the die centre (1200, 800). Hand-worked.
    expect(r.table.rows[0]).toMatchObject({ xUm: 60, yUm: 1400, xFromCentreUm: -1140, yFromCentreUm: 600, widthUm: 80, heightUm: 80 });
    expect(r.table.die).toEqual({ widthUm: 2400, heightUm: 1600, rotationDeg: 0 });
  });

  it("uses a drawn die outline in preference to the recorded size", () => {
    const r = padTableFromMarkup([...shapes, outline("o", 2400, 1600)], { widthUm: 9999, heightUm: 9999 });
    expect(r.ok && r.outlineSource).toBe("die_outline");
    expect(r.ok && r.table.die.widthUm).toBe(2400);
  });

  it("starts from the pad asked for as pad 1", () => {
    const r = padTableFromMarkup(shapes, DIE, { padOneId: "e1" });
    expect(r.ok && r.table.rows.map((row) => row.id)).toEqual(["e1", "n1", "w1", "s1"]);
  });

  it("refuses a pad 1 that is not a pad, two outlines, and a die with neither outline nor size", () => {
    expect(padTableFromMarkup(shapes, DIE, { padOneId: "n" })).toMatchObject({ ok: false, reason: "bad_request" });
    expect(padTableFromMarkup([...shapes, outline("o1", 10, 10), outline("o2", 10, 10)], DIE)).toMatchObject({
      ok: false,
      reason: "conflict",
      message: /2 die outlines/,
    });
    expect(padTableFromMarkup(shapes, { widthUm: null, heightUm: 1600 })).toMatchObject({
      ok: false,
      reason: "conflict",
      message: /no outline and no recorded size/,
    });
  });

  it("reports two pads marked as pad 1 as a conflict", () => {
    const two = [pad("a", 60, 1400, { isPadOne: true }), pad("b", 60, 1000, { isPadOne: true })];
    expect(padTableFromMarkup(two, DIE)).toMatchObject({ ok: false, reason: "conflict", message: /more than one pad/ });
  });

  it("shows each pad's state from its wire bonds unless set by hand; probed stays as chosen", () => {
    const bond = (id: string, padId: string): AnyShape =>
      ({
        id,
        kind: "wire_bond",
        geometry: {
          type: "LineString",
          coordinates: [
            [60, 1400],
            [-300, 1400],
          ],
        },
        properties: { diameterUm: 25, padId },
        version: 1,
        createdBy: null,
        updatedAt: T,
      }) as AnyShape;
    const mixed = [
      pad("w1", 60, 1400), // stored bonded, has a bond: bonded
      pad("s1", 1200, 60), // stored bonded, no bond: unbonded (the fault: it read bonded)
      pad("e1", 2340, 800, { state: "probed" }), // probed is always by hand
      pad("n1", 1200, 1540, { state: "unbonded", stateByHand: true }), // by hand, even with a bond
      bond("b1", "w1"),
      bond("b2", "n1"),
    ];
    const r = padTableFromMarkup(mixed, DIE);
    if (!r.ok) throw new Error(r.message);
    expect(r.table.rows.map((row) => [row.id, row.state])).toEqual([
      ["w1", "bonded"],
      ["s1", "unbonded"],
      ["e1", "probed"],
      ["n1", "unbonded"],
    ]);
  });

  it("keeps a pad outside the die out of the numbering unless it is asked for", () => {
    // A pad centred at (-200, 1500): left of the die's left edge x = 0. Before, it took pad 1.
    const stray = pad("x1", -200, 1500);
    const r = padTableFromMarkup([...shapes, stray], DIE);
    if (!r.ok) throw new Error(r.message);
    expect(r.table.rows.map((row) => [row.number, row.id])).toEqual([
      [1, "w1"],
      [2, "s1"],
      [3, "e1"],
      [4, "n1"],
    ]);
    expect(r.table.outsideDie).toEqual([{ id: "x1", label: "X1", xUm: -200, yUm: 1500 }]);
    const asked = padTableFromMarkup([...shapes, pad("x1", -200, 1500, { numberOutside: true })], DIE);
    expect(asked.ok && asked.table.rows.map((row) => row.id)).toEqual(["x1", "w1", "s1", "e1", "n1"]);
    expect(asked.ok && asked.table.outsideDie).toEqual([]);
  });
});
