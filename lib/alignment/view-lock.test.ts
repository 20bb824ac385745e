import { describe, it, expect } from "vitest";
import { applyAffine } from "../geometry/affine";
import { followerView } from "./view-lock";
import { similarityTransform } from "./test-support";

/** Screen position of an image point for a view that rotates (clockwise, y-down) and zooms about a screen point. */
function toScreen(p: readonly [number, number], view: { imagePoint: readonly [number, number]; imageZoom: number; rotationDeg: number }, at: [number, number]) {
  const t = (view.rotationDeg * Math.PI) / 180;
  const dx = (p[0] - view.imagePoint[0]) * view.imageZoom;
  const dy = (p[1] - view.imagePoint[1]) * view.imageZoom;
  return [at[0] + dx * Math.cos(t) - dy * Math.sin(t), at[1] + dx * Math.sin(t) + dy * Math.cos(t)];
}

describe("followerView", () => {
  // Independent check: every die point must land on the same screen px in both views, with the
  // screen maps written out from the definition of a rotate-and-zoom view (above).
  const leaderT = similarityTransform(1, 0, -300, 1900);
  const followerT = similarityTransform(1.02, 1.5, -335, 1924); // the demo dark field's kind of offset

  it("puts every die point on the same screen px in both views", () => {
    const leader = { imagePoint: [1200, 800] as const, imageZoom: 0.37, rotationDeg: 10 };
    const f = followerView(leaderT, followerT, leader);
    for (const p of [
      [0, 0],
      [3000, 0],
      [1500, 1100],
      [2900, 2100],
    ] as const) {
      const die = applyAffine(followerT, p[0], p[1]);
      const inLeader = applyAffine(
        [
          [1, 0, 300],
          [0, -1, 1900],
        ],
        die[0],
        die[1],
      ); // leaderT⁻¹ by hand
      const a = toScreen(inLeader, leader, [400, 300]);
      const b = toScreen(p, f, [400, 300]);
      expect(Math.hypot(a[0] - b[0], a[1] - b[1])).toBeLessThan(1e-9);
    }
  });

  it("scales the zoom by the ratio of the scales and adds the relative angle", () => {
    const f = followerView(leaderT, followerT, { imagePoint: [0, 0], imageZoom: 1, rotationDeg: 0 });
    expect(f.imageZoom).toBeCloseTo(1.02, 12);
    // The two images are turned 1.5° against each other (by construction above).
    expect(Math.abs(f.rotationDeg)).toBeCloseTo(1.5, 12);
  });
});
