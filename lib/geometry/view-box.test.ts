import { describe, expect, it } from "vitest";
import { applyAffine } from "./affine";
import type { BoundingBox } from "./measure";
import type { Affine2x3 } from "./types";
import { imageBoxOfDieBox, viewBoxUm, type ScreenToImage } from "./view-box";

/** The box the review bench used to take: only the top-left and bottom-right screen corners. */
function twoCornerBox(size: { width: number; height: number }, screenToImage: ScreenToImage, t: Affine2x3): BoundingBox {
  const [a, b] = [
    [0, 0],
    [size.width, size.height],
  ].map(([x, y]) => {
    const img = screenToImage(x, y);
    return applyAffine(t, img.x, img.y);
  });
  return { minX: Math.min(a[0], b[0]), minY: Math.min(a[1], b[1]), maxX: Math.max(a[0], b[0]), maxY: Math.max(a[1], b[1]) };
}

function expectBox(actual: BoundingBox, expected: BoundingBox) {
  expect(actual.minX).toBeCloseTo(expected.minX, 9);
  expect(actual.minY).toBeCloseTo(expected.minY, 9);
  expect(actual.maxX).toBeCloseTo(expected.maxX, 9);
  expect(actual.maxY).toBeCloseTo(expected.maxY, 9);
}

describe("viewBoxUm", () => {
  it("maps a y-down screen window to a y-up die box", () => {
    // Worked by hand: 0.5 µm/px with y flipped, image (0, 0) at die (0, 500); the 200 × 200 px
    // viewer shows image px (100, 200)–(300, 400), i.e. die x 50–150 µm and y 300–400 µm.
    const frame: Affine2x3 = [
      [0.5, 0, 0],
      [0, -0.5, 500],
    ];
    const box = viewBoxUm({ width: 200, height: 200 }, (x, y) => ({ x: x + 100, y: y + 200 }), frame);
    expect(box).toEqual({ minX: 50, minY: 300, maxX: 150, maxY: 400 });
  });

  it("covers all four corners of a micrograph turned by 30° in the die frame, where two corners fall short", () => {
    // A micrograph at 2 µm/px, y flipped, turned 30°: die = R(30°)·diag(2, −2)·image + (0, 1000).
    // cos 30° = √3/2, sin 30° = 1/2 (exact), so the linear part is [[√3, 1], [1, −√3]].
    const s3 = Math.sqrt(3);
    const turned: Affine2x3 = [
      [s3, 1, 0],
      [1, -s3, 1000],
    ];
    const size = { width: 200, height: 100 };
    const identity: ScreenToImage = (x, y) => ({ x, y });
    // Ground truth, the four image corners turned by hand (√3 = 1.7320508075688772):
    //   (0, 0)     → (0, 1000)
    //   (200, 0)   → (200√3, 200 + 1000)               = (346.41016151377545, 1200)
    //   (200, 100) → (200√3 + 100, 200 − 100√3 + 1000) = (446.41016151377545, 1026.7949192431123)
    //   (0, 100)   → (100, 1000 − 100√3)                = (100, 826.7949192431123)
    const truth = { minX: 0, minY: 826.7949192431123, maxX: 446.41016151377545, maxY: 1200 };
    expectBox(viewBoxUm(size, identity, turned), truth);
    // The two-corner box spans only y 1000…1026.79: most of the view is left out.
    const old = twoCornerBox(size, identity, turned);
    expect(old.minY).toBeCloseTo(1000, 9);
    expect(old.maxY).toBeCloseTo(1026.7949192431123, 9);
    expect(old.maxY - old.minY).toBeLessThan((truth.maxY - truth.minY) / 10);
  });

  it("handles a micrograph mirrored and turned a quarter in the die frame", () => {
    // die x = 0.5·image y + 10, die y = 0.5·image x + 20 (a mirror about the diagonal); the
    // 400 × 300 px viewer shows 2 image px per screen px, image (0, 0)–(800, 600).
    // By hand: (0, 0) → (10, 20), (800, 0) → (10, 420), (800, 600) → (310, 420), (0, 600) → (310, 20).
    const swapped: Affine2x3 = [
      [0, 0.5, 10],
      [0.5, 0, 20],
    ];
    const size = { width: 400, height: 300 };
    const zoomedOut: ScreenToImage = (x, y) => ({ x: 2 * x, y: 2 * y });
    const truth = { minX: 10, minY: 20, maxX: 310, maxY: 420 };
    expectBox(viewBoxUm(size, zoomedOut, swapped), truth);
    // Under a quarter turn or a mirror opposite corners still span the box, so the old way agreed here.
    expectBox(twoCornerBox(size, zoomedOut, swapped), truth);
  });
});

describe("imageBoxOfDieBox", () => {
  it("holds all four corners of a die box on a micrograph turned 30° (corners rotated by hand)", () => {
    // image → die: rotate by 30° about the origin, 1 µm/px. The inverse turns die points by −30°.
    const c = Math.cos(Math.PI / 6);
    const s = Math.sin(Math.PI / 6);
    const t: [[number, number, number], [number, number, number]] = [
      [c, -s, 0],
      [s, c, 0],
    ];
    // The die square (0,0)–(100,100) turned by −30°: (0,0), (86.60,−50), (136.60,36.60), (50,86.60).
    const b = imageBoxOfDieBox({ minX: 0, minY: 0, maxX: 100, maxY: 100 }, t);
    expect(b.minX).toBeCloseTo(0, 6);
    expect(b.maxX).toBeCloseTo(136.6025, 3);
    expect(b.minY).toBeCloseTo(-50, 6);
    expect(b.maxY).toBeCloseTo(86.6025, 3);
  });
});
