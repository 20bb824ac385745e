import { describe, expect, it } from "vitest";
import { frameFromScale, invertAffine } from "@/lib/geometry/affine";
import { candidateInDie, overlapShare, regionProblem, shapeBoxPx, templateBoxProblem, umBoxOf, withoutMarked } from "./template";

// Ground truth constructed by hand: a 1000 × 800 px image at 0.5 µm/px, die origin at the
// image's lower-left corner (frameFromScale: u = 0.5·x, v = 0.5·(800 − y)).
const image = { width: 1000, height: 800 };
const imageToDie = frameFromScale(0.5, 800);
const dieToImage = invertAffine(imageToDie);

describe("template boxes", () => {
  it("refuses an empty, a one-pixel and an outside box, accepts one inside", () => {
    expect(templateBoxProblem({ x: 10, y: 10, w: 0, h: 0 }, image)).toMatch(/at least 8 × 8 px/);
    expect(templateBoxProblem({ x: 10, y: 10, w: 1, h: 1 }, image)).toMatch(/at least 8 × 8 px/);
    expect(templateBoxProblem({ x: 995, y: 10, w: 20, h: 20 }, image)).toMatch(/outside the image \(1000 × 800 px\)/);
    expect(templateBoxProblem({ x: 10, y: 790, w: 20, h: 20 }, image)).toMatch(/outside the image/);
    expect(templateBoxProblem({ x: 980, y: 780, w: 20, h: 20 }, image)).toBeNull();
  });

  it("refuses a region outside the image or smaller than the template", () => {
    const t = { x: 0, y: 0, w: 40, h: 40 };
    expect(regionProblem({ x: 900, y: 0, w: 200, h: 100 }, t, image)).toMatch(/outside the image/);
    expect(regionProblem({ x: 0, y: 0, w: 30, h: 300 }, t, image)).toMatch(/smaller than the template/);
    expect(regionProblem({ x: 0, y: 0, w: 300, h: 300 }, t, image)).toBeNull();
  });

  it("maps a die-frame rectangle to its pixel box, rounded outwards and clipped", () => {
    // Die µm (10, 380)–(30, 390) → px x 20..60, y (800 − 780 = 20)..(800 − 760 = 40).
    const ring: [number, number][] = [
      [10, 380],
      [30, 380],
      [30, 390],
      [10, 390],
      [10, 380],
    ];
    expect(shapeBoxPx(ring, dieToImage, image)).toEqual({ x: 20, y: 20, w: 40, h: 20 });
    const half: [number, number][] = [
      [10.2, 380],
      [30, 380],
      [30, 390.3],
    ];
    expect(shapeBoxPx(half, dieToImage, image)).toEqual({ x: 20, y: 19, w: 40, h: 21 });
    const beyond: [number, number][] = [
      [490, 10],
      [520, 30],
    ];
    expect(shapeBoxPx(beyond, dieToImage, image)).toEqual({ x: 980, y: 740, w: 20, h: 40 });
    expect(
      shapeBoxPx(
        [
          [600, 10],
          [620, 20],
        ],
        dieToImage,
        image,
      ),
    ).toBeNull();
  });
});

describe("candidates in the die frame", () => {
  it("gives the die box with its lower-left corner, y up", () => {
    // px (100, 200, 40 × 20) → µm x 50..70, y 0.5·(800 − 220) = 290 .. 0.5·(800 − 200) = 300.
    expect(umBoxOf({ x: 100, y: 200, w: 40, h: 20 }, imageToDie)).toEqual({ x: 50, y: 290, w: 20, h: 10 });
  });

  it("centres the template shape's own size on the sub-pixel centre, turned with the candidate", () => {
    const c = { box: { x: 100, y: 200, w: 20, h: 40 }, centre: [110.5, 220.25] as [number, number], score: 0.91, rotation: 90 as const, mirrored: false };
    const got = candidateInDie(c, imageToDie, [20.4, 10]);
    expect(got.centreUm).toEqual([55.25, 289.875]);
    expect(got.boxUm).toEqual({ x: 55.25 - 5, y: 289.875 - 10.2, w: 10, h: 20.4 });
    expect(candidateInDie({ ...c, rotation: 180 }, imageToDie, [20.4, 10]).boxUm.w).toBe(20.4);
    expect(candidateInDie(c, imageToDie).boxUm).toEqual({ x: 50, y: 280, w: 10, h: 20 });
  });

  it("drops candidates a quarter or more covered by a marked shape of the kind", () => {
    const at = (x: number) => ({ boxUm: { x, y: 0, w: 10, h: 10 } });
    expect(overlapShare(at(0).boxUm, { minX: 5, minY: 0, maxX: 15, maxY: 10 })).toBe(0.5);
    expect(overlapShare(at(0).boxUm, { minX: 10, minY: 0, maxX: 20, maxY: 10 })).toBe(0);
    // A marked shape 8 µm off covers 2/10 of the candidate: kept; 7 µm off covers 3/10: dropped.
    const kept = withoutMarked([at(0), at(100)], [{ minX: 8, minY: 0, maxX: 18, maxY: 10 }]);
    expect(kept).toHaveLength(2);
    expect(withoutMarked([at(0), at(100)], [{ minX: 7, minY: 0, maxX: 17, maxY: 10 }])).toEqual([at(100)]);
  });
});
