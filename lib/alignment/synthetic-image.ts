import { seededRandom } from "./test-support";

/**
 * A test scene of Gaussian spots at seeded positions, evaluated analytically, so a copy moved
 * by any (fractional) amount is exact: the shift a test asks for is known by construction.
 * Test use only.
 */
export function spotScene(seed: number, count: number, extent: number, sigma = 3) {
  const rnd = seededRandom(seed);
  const spots = Array.from({ length: count }, () => ({ x: rnd() * extent, y: rnd() * extent, a: 50 + 200 * rnd() }));
  return (x: number, y: number) => {
    let v = 10;
    for (const s of spots) {
      const d2 = (x - s.x) ** 2 + (y - s.y) ** 2;
      if (d2 < 25 * sigma * sigma) v += s.a * Math.exp(-d2 / (2 * sigma * sigma));
    }
    return v;
  };
}

/** Samples scene(x − dx, y − dy) at pixel centres of a width × height raster. Test use only. */
export function rasterise(scene: (x: number, y: number) => number, width: number, height: number, dx = 0, dy = 0): Float64Array {
  const out = new Float64Array(width * height);
  for (let j = 0; j < height; j++) for (let i = 0; i < width; i++) out[j * width + i] = scene(i + 0.5 - dx, j + 0.5 - dy);
  return out;
}
