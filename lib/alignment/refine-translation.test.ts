import { describe, it, expect } from "vitest";
import { applyAffine } from "../geometry/affine";
import type { Affine2x3 } from "../geometry/types";
import { refineTranslation } from "./refine-translation";
import { spotScene } from "./synthetic-image";
import { similarityTransform } from "./test-support";

// Both "micrographs" photograph one analytic die-frame scene through transforms we choose, so
// the true transform of each is known by construction; the refinement must find the error we
// put into the moving one's rough transform.
const scene = spotScene(5, 400, 1000, 6); // die µm, 1000 × 1000 µm

function photograph(imageToDie: Affine2x3, width: number, height: number) {
  const data = new Float64Array(width * height);
  for (let j = 0; j < height; j++) for (let i = 0; i < width; i++) data[j * width + i] = scene(...applyAffine(imageToDie, i + 0.5, j + 0.5));
  return { width, height, data };
}

describe("refineTranslation", () => {
  it("recovers a known die-frame error of a rough transform within 0.5 µm", () => {
    const refT = similarityTransform(2, 0, 0, 1000); // 2 µm/px, y flipped, 500 × 500 px
    const trueT = similarityTransform(2.04, 1.5, 20, 990); // rotated, scaled, shifted
    const reference = { image: photograph(refT, 500, 500), imageToDie: refT };
    const movingImage = photograph(trueT, 480, 480);
    const rough: Affine2x3 = [
      [trueT[0][0], trueT[0][1], trueT[0][2] + 13.4],
      [trueT[1][0], trueT[1][1], trueT[1][2] - 8.2],
    ];
    const result = refineTranslation(reference, { image: movingImage, imageToDie: rough });
    expect(result.shiftUm[0]).toBeCloseTo(-13.4, 0);
    expect(Math.abs(result.transform[0][2] - trueT[0][2])).toBeLessThan(0.5);
    expect(Math.abs(result.transform[1][2] - trueT[1][2])).toBeLessThan(0.5);
    expect(result.peak).toBeGreaterThan(0.08);
  });

  it("refuses two micrographs that do not overlap", () => {
    const a = similarityTransform(1, 0, 0, 100);
    const b = similarityTransform(1, 0, 5000, 100);
    const img = { width: 100, height: 100, data: new Float64Array(10000) };
    expect(() => refineTranslation({ image: img, imageToDie: a }, { image: img, imageToDie: b })).toThrow(/do not overlap/);
  });
});
