import { beforeAll, describe, expect, it } from "vitest";
import { loadOpenCv, openCvScoreMap, type OpenCv } from "./opencv-reference";
import type { Gray } from "./types";
import { ZnccPlan, znccScoreMap } from "./zncc";

const gray = (width: number, height: number, values: ArrayLike<number>): Gray => ({ width, height, data: Float32Array.from(values) });

/** A deterministic pseudo-random generator (mulberry32) so the images are the same every run. */
function rng(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A smooth-ish 8-bit texture: random blobs plus noise, like a small micrograph crop. */
function texture(w: number, h: number, seed: number): Gray {
  const r = rng(seed);
  const data = new Float32Array(w * h);
  const blobs = Array.from({ length: 12 }, () => [r() * w, r() * h, 2 + r() * 6, r() * 200] as const);
  for (let y = 0; y < h; y++)
    for (let x = 0; x < w; x++) {
      let v = 30 + r() * 20;
      for (const [bx, by, s, a] of blobs) v += a * Math.exp(-((x - bx) ** 2 + (y - by) ** 2) / (2 * s * s));
      data[y * w + x] = Math.min(255, Math.round(v));
    }
  return { width: w, height: h, data };
}

function crop(img: Gray, x: number, y: number, w: number, h: number): Gray {
  const data = new Float32Array(w * h);
  for (let j = 0; j < h; j++) data.set(img.data.subarray((y + j) * img.width + x, (y + j) * img.width + x + w), j * w);
  return { width: w, height: h, data };
}

function maxAbsDiff(a: Gray, b: Gray): number {
  expect([a.width, a.height]).toEqual([b.width, b.height]);
  let m = 0;
  for (let i = 0; i < a.data.length; i++) m = Math.max(m, Math.abs(a.data[i] - b.data[i]));
  return m;
}

describe("znccScoreMap by hand (5×5 image, 2×2 template)", () => {
  // Template t = [[0, 2], [2, 0]]: mean 1, zero-mean t' = [[−1, 1], [1, −1]], Σ t'² = 4, ‖t'‖ = 2.
  const image = gray(5, 5, [0, 1, 0, 0, 3, 1, 0, 0, 0, 0, 0, 0, 5, 5, 0, 0, 0, 5, 5, 0, 2, 0, 0, 0, 1]);
  const template = gray(2, 2, [0, 2, 2, 0]);
  const map = znccScoreMap(image, template);
  const at = (u: number, v: number) => map.data[v * map.width + u];

  it("is (5 − 2 + 1) × (5 − 2 + 1)", () => expect([map.width, map.height]).toEqual([4, 4]));
  it("scores a scaled copy of the template 1", () => {
    // Window at (0, 0) = [[0, 1], [1, 0]] = t / 2: f' = t'/2, so Σ f·t' = 2, ‖f'‖ = 1, score 2 / (1·2) = 1.
    expect(at(0, 0)).toBeCloseTo(1, 6);
  });
  it("scores a lone bright pixel −1/√3", () => {
    // Window at (1, 0) = [[1, 0], [0, 0]]: mean 0.25, Σ f'² = 0.75² + 3·0.25² = 0.75;
    // Σ f·t' = 1·(−1) = −1; score −1 / (√0.75 · 2) = −0.57735.
    expect(at(1, 0)).toBeCloseTo(-1 / Math.sqrt(3), 5);
    // Window at (1, 1) = [[0, 0], [0, 5]]: mean 1.25, Σ f'² = 3·1.25² + 3.75² = 18.75;
    // Σ f·t' = 5·(−1) = −5; score −5 / (√18.75 · 2) = −0.57735.
    expect(at(1, 1)).toBeCloseTo(-1 / Math.sqrt(3), 5);
  });
  it("scores a flat window 0, as OpenCV does", () => {
    // Window at (2, 2) = [[5, 5], [5, 5]] has no variance; OpenCV's normalisation gives 0.
    expect(at(2, 2)).toBe(0);
  });
});

describe("znccScoreMap against OpenCV matchTemplate TM_CCOEFF_NORMED", () => {
  let cv: OpenCv;
  beforeAll(async () => {
    ({ cv } = await loadOpenCv());
  }, 60_000);

  it("equals OpenCV within 1e-3 on textured images (odd and even sizes, non-square templates)", () => {
    const cases: [number, number, number, number, number, number][] = [
      [64, 48, 7, 5, 3, 11],
      [100, 77, 16, 16, 40, 20],
      [129, 65, 31, 9, 2, 50],
    ];
    for (const [w, h, tw, th, tx, ty] of cases) {
      const img = texture(w, h, w * 31 + h);
      const tpl = crop(img, tx, ty, tw, th);
      const ours = znccScoreMap(img, tpl);
      const ref = openCvScoreMap(cv, img, tpl);
      expect(maxAbsDiff(ours, ref), `${w}×${h} with ${tw}×${th}`).toBeLessThan(1e-3);
      // The template's own position scores 1 in both.
      expect(ours.data[ty * ours.width + tx]).toBeCloseTo(1, 4);
    }
  });

  it("equals OpenCV within 1e-3 with a template from elsewhere and flat areas in the image", () => {
    const img = texture(90, 70, 7);
    for (let y = 10; y < 30; y++) img.data.fill(128, y * 90 + 10, y * 90 + 40); // flat patch: OpenCV's 0 rule
    const tpl = crop(texture(40, 40, 99), 5, 5, 12, 10);
    expect(maxAbsDiff(znccScoreMap(img, tpl), openCvScoreMap(cv, img, tpl))).toBeLessThan(1e-3);
  });

  it("gives both maps of a template pair from one transform (consistency with the single form)", () => {
    const img = texture(80, 60, 3);
    const a = crop(img, 4, 8, 10, 6);
    const b = crop(img, 30, 20, 6, 10);
    const [pa, pb] = new ZnccPlan(img).scores(a, b);
    expect(maxAbsDiff(pa, openCvScoreMap(cv, img, a))).toBeLessThan(1e-3);
    expect(maxAbsDiff(pb, openCvScoreMap(cv, img, b))).toBeLessThan(1e-3);
  });
});
