import { describe, expect, it } from "vitest";
import { applyAffine } from "@/lib/geometry/affine";
import { planRender } from "./render-plan";
import { downscaledSource, previewPlan, PREVIEW_WIDTH_PX } from "./preview-plan";

// A 12,000 × 9,000 px micrograph at 0.25 µm/px, y flipped, with a 2,048 × 1,536 px copy.
const original = {
  width: 12_000,
  height: 9_000,
  transform: [
    [0.25, 0, 0],
    [0, -0.25, 2250],
  ] as const,
};
const die = { widthUm: 3000, heightUm: 2250 };

describe("downscaledSource", () => {
  it("maps each corner of the copy onto the same die point as the original's corner", () => {
    const copy = downscaledSource(original, 2048, 1536);
    for (const [u, v, x, y] of [
      [0, 0, 0, 0],
      [2048, 0, 12_000, 0],
      [0, 1536, 0, 9000],
      [2048, 1536, 12_000, 9000],
    ]) {
      expect(applyAffine(copy.transform, u, v)).toEqual(applyAffine(original.transform, x, y));
    }
  });
});

describe("previewPlan", () => {
  const full = (region?: { x: number; y: number; width: number; height: number }) => {
    const r = planRender(original, die, { region, widthPx: 8192 });
    if (!r.ok) throw new Error(r.message);
    return r.plan;
  };

  it("reads the whole die from the copy at most 640 px wide, over the same region", () => {
    const p = previewPlan(original, { width: 2048, height: 1536 }, full());
    expect(p.fromCopy).toBe(true);
    expect(p.plan.width).toBe(PREVIEW_WIDTH_PX);
    // The 3000 × 2250 µm die with 10 % of its larger side (300 µm) around it.
    expect(p.plan.region).toEqual({ x: -300, y: -300, width: 3600, height: 2850 });
    // 3600 µm over 640 px = 5.625 µm/px (by hand); the copy has 3000 / 2048 = 1.46 µm/px.
    expect(p.plan.umPerPx).toBeCloseTo(5.625, 9);
  });

  it("falls back to the original for a small region the copy would have to enlarge", () => {
    // 100 µm over 640 px = 0.156 µm/px, finer than the copy's 1.46 µm/px.
    const p = previewPlan(original, { width: 2048, height: 1536 }, full({ x: 1000, y: 1000, width: 100, height: 80 }));
    expect(p.fromCopy).toBe(false);
    expect(p.plan.region).toEqual({ x: 1000, y: 1000, width: 100, height: 80 });
  });

  it("takes a wider limit for the report's overview, still from the copy while it has the pixels", () => {
    const p = previewPlan(original, { width: 2048, height: 1536 }, full(), 1600);
    expect([p.plan.width, p.fromCopy]).toEqual([1600, true]);
    // Wider than the copy: the original is read.
    expect(previewPlan(original, { width: 2048, height: 1536 }, full(), 4000).fromCopy).toBe(false);
  });

  it("uses the original when there is no copy yet", () => {
    expect(previewPlan(original, null, full()).fromCopy).toBe(false);
  });
});
