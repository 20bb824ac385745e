import { describe, expect, it } from "vitest";
import { dieFrameFromOutline } from "@/lib/pads/die-frame";
import { outlineFromCorners } from "./outline";

// Ground truth built by hand: rectangles of known size, centre and turn, with corners moved
// by known amounts; the die frame's own rectangle check (lib/pads/die-frame.ts) must accept
// the result.
describe("a die outline from four detected corners", () => {
  it("gives back an exact axis-aligned rectangle unchanged", () => {
    const ring = outlineFromCorners([
      [0, 0],
      [2400, 0],
      [2400, 1600],
      [0, 1600],
    ]).coordinates[0];
    const want = [
      [0, 0],
      [2400, 0],
      [2400, 1600],
      [0, 1600],
      [0, 0],
    ];
    ring.forEach((p, i) => p.forEach((v, j) => expect(v).toBeCloseTo(want[i][j], 9)));
  });

  it("turns corners a few µm off into a rectangle the die frame accepts, centred and sized as their means", () => {
    // 2400 × 1600 µm about (1200, 800); corners moved by ±3 µm in opposite pairs (means unchanged).
    const got = outlineFromCorners([
      [3, -2],
      [2397, 2],
      [2403, 1598],
      [-3, 1602],
    ]);
    const f = dieFrameFromOutline(got);
    expect(f.widthUm).toBeCloseTo((Math.hypot(2394, 4) + Math.hypot(2406, 4)) / 2, 6);
    expect(f.heightUm).toBeCloseTo((Math.hypot(6, 1596) + Math.hypot(6, 1604)) / 2, 6);
    const ring = got.coordinates[0].slice(0, 4);
    expect(ring.reduce((s, p) => s + p[0], 0) / 4).toBeCloseTo(1200, 9);
    expect(ring.reduce((s, p) => s + p[1], 0) / 4).toBeCloseTo(800, 9);
  });

  it("keeps a turned die's turn", () => {
    const t = (2 * Math.PI) / 180;
    const corner = (x: number, y: number): [number, number] => [x * Math.cos(t) - y * Math.sin(t), x * Math.sin(t) + y * Math.cos(t)];
    const f = dieFrameFromOutline(outlineFromCorners([corner(0, 0), corner(1000, 0), corner(1000, 500), corner(0, 500)]));
    expect(f.rotationDeg).toBeCloseTo(2, 9);
    expect(f.widthUm).toBeCloseTo(1000, 9);
    expect(f.heightUm).toBeCloseTo(500, 9);
  });
});
