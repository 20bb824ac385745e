/**
 * Edge strength of a row-major image: a 3 × 3 box blur, then the gradient magnitude by central
 * differences. Micrographs under different illumination disagree on which areas are bright
 * (dark field lights edges, bright field lights flat metal) but agree on where edges are, so
 * correlating edge maps matches them where raw intensities would not. Borders get 0.
 */
export function edgeMap(data: Float64Array, width: number, height: number): Float64Array {
  const blurred = new Float64Array(data.length);
  for (let y = 1; y < height - 1; y++) {
    for (let x = 1; x < width - 1; x++) {
      let s = 0;
      for (let j = -1; j <= 1; j++) for (let i = -1; i <= 1; i++) s += data[(y + j) * width + x + i];
      blurred[y * width + x] = s / 9;
    }
  }
  const out = new Float64Array(data.length);
  for (let y = 2; y < height - 2; y++) {
    for (let x = 2; x < width - 2; x++) {
      const gx = blurred[y * width + x + 1] - blurred[y * width + x - 1];
      const gy = blurred[(y + 1) * width + x] - blurred[(y - 1) * width + x];
      out[y * width + x] = Math.hypot(gx, gy) / 2;
    }
  }
  return out;
}
