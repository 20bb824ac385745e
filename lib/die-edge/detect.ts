import type { Gray } from "../find-similar/types";

/**
 * Die-edge detection: where the die's sawn edge meets the background around it. The method is
 * the classic two-step one for straight boundaries: (1) projections of the gradient magnitude
 * (the |∂I/∂x| profile summed down the columns, |∂I/∂y| along the rows) locate each side of the
 * die roughly, as the outermost strong peak; (2) along every scan line in a band around it the
 * first strong edge seen from outside is an edge point (sub-pixel by a three-point parabola), and
 * a least-squares line is fitted to the points of each side with iterative rejection of outliers
 * beyond 3 robust standard deviations (median absolute deviation), so wires and bond stitches
 * that cross the edge do not pull it. The four lines intersect in the corners; a turned die is
 * fine as long as the turn is small (a few degrees).
 */

type Side = "left" | "right" | "top" | "bottom";
/** A fitted side: for left/right x = a + b·y, for top/bottom y = a + b·x. */
type Line = { a: number; b: number; inliers: number; total: number; rms: number };

function smooth3(img: Gray): Float32Array {
  const { width: w, height: h, data } = img;
  const tmp = new Float32Array(w * h);
  const out = new Float32Array(w * h);
  for (let y = 0; y < h; y++)
    for (let x = 0; x < w; x++) {
      const i = y * w + x;
      tmp[i] = (data[i - (x > 0 ? 1 : 0)] + data[i] + data[i + (x < w - 1 ? 1 : 0)]) / 3;
    }
  for (let y = 0; y < h; y++)
    for (let x = 0; x < w; x++) {
      const i = y * w + x;
      out[i] = (tmp[i - (y > 0 ? w : 0)] + tmp[i] + tmp[i + (y < h - 1 ? w : 0)]) / 3;
    }
  return out;
}

function boxFilter(p: Float64Array, k: number): Float64Array {
  const out = new Float64Array(p.length);
  const r = Math.floor(k / 2);
  for (let i = 0; i < p.length; i++) {
    let s = 0;
    for (let j = Math.max(0, i - r); j <= Math.min(p.length - 1, i + r); j++) s += p[j];
    out[i] = s;
  }
  return out;
}

/** The outermost position (from index 0 up) of a profile where it reaches `frac` of its maximum. */
function outermost(profile: Float64Array, frac: number): number {
  let max = 0;
  for (const v of profile) max = Math.max(max, v);
  for (let i = 0; i < profile.length; i++) if (profile[i] >= frac * max) return i;
  return 0;
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s.length ? s[Math.floor(s.length / 2)] : 0;
}

/** Least-squares line v = a + b·t with iterative 3-robust-sigma outlier rejection. */
function robustLine(points: [number, number][]): Line | null {
  let use = points;
  let fit = { a: 0, b: 0 };
  for (let iter = 0; iter < 8; iter++) {
    if (use.length < 5) return null;
    const n = use.length;
    let st = 0;
    let sv = 0;
    for (const [t, v] of use) {
      st += t;
      sv += v;
    }
    const mt = st / n;
    const mv = sv / n;
    let stt = 0;
    let stv = 0;
    for (const [t, v] of use) {
      stt += (t - mt) ** 2;
      stv += (t - mt) * (v - mv);
    }
    const b = stt > 0 ? stv / stt : 0;
    fit = { a: mv - b * mt, b };
    const res = points.map(([t, v]) => Math.abs(v - fit.a - fit.b * t));
    const sigma = 1.4826 * median(use.map(([t, v]) => Math.abs(v - fit.a - fit.b * t)));
    const limit = Math.max(0.75, 3 * sigma);
    const next = points.filter((_, i) => res[i] <= limit);
    if (next.length === use.length) {
      use = next;
      break;
    }
    use = next;
  }
  const rms = Math.sqrt(use.reduce((s, [t, v]) => s + (v - fit.a - fit.b * t) ** 2, 0) / Math.max(1, use.length));
  return { ...fit, inliers: use.length, total: points.length, rms };
}

/**
 * Edge points of one side: per scan line across the band [lo, hi) (positions measured from the
 * outside inwards), the first gradient above `threshold` climbed to its local maximum.
 */
function sidePoints(grad: (line: number, pos: number) => number, lines: [number, number], band: [number, number], outward: boolean): [number, number][] {
  const [l0, l1] = lines;
  const [b0, b1] = band;
  const maxima: number[] = [];
  for (let l = l0; l < l1; l++) {
    let m = 0;
    for (let p = b0; p < b1; p++) m = Math.max(m, grad(l, p));
    maxima.push(m);
  }
  // Lines crossed by a wire show no edge there; the threshold comes from the typical line.
  const sorted = [...maxima].sort((a, b) => a - b);
  const typical = sorted[Math.floor(sorted.length * 0.75)] ?? 0;
  const threshold = 0.5 * typical;
  const points: [number, number][] = [];
  for (let l = l0; l < l1; l++) {
    if (maxima[l - l0] < threshold) continue;
    const order = outward ? (k: number) => b1 - 1 - k : (k: number) => b0 + k;
    let found = -1;
    for (let k = 0; k < b1 - b0; k++) {
      if (grad(l, order(k)) >= threshold) {
        found = k;
        break;
      }
    }
    if (found < 0) continue;
    while (found + 1 < b1 - b0 && grad(l, order(found + 1)) > grad(l, order(found))) found++;
    const p = order(found);
    const c = grad(l, p);
    const lft = p > 0 ? grad(l, p - 1) : c;
    const rgt = grad(l, p + 1);
    const d = lft - 2 * c + rgt;
    const off = d < 0 ? Math.max(-0.5, Math.min(0.5, (lft - rgt) / (2 * d))) : 0;
    // Gradient at index p is the central difference around pixel p, whose centre is p + 0.5.
    points.push([l + 0.5, p + 0.5 + off]);
  }
  return points;
}

function intersect(vertical: Line, horizontal: Line): [number, number] {
  // x = av + bv·y and y = ah + bh·x  →  x = av + bv·(ah + bh·x)
  const x = (vertical.a + vertical.b * horizontal.a) / (1 - vertical.b * horizontal.b);
  return [x, horizontal.a + horizontal.b * x];
}

/**
 * The die outline in `image`'s px: corners counter-clockwise from the lower-left as seen in die
 * terms (image y down: lower-left has the largest y and smallest x; then lower-right, upper-right,
 * upper-left), and a confidence 0–1 from how many scan lines agree with each fitted side and how
 * square the corners are.
 */
export function detectDieEdge(image: Gray): { corners: [number, number][]; confidence: number } {
  const { width: w, height: h } = image;
  if (w < 16 || h < 16 || image.data.length !== w * h) throw new RangeError("the image is too small to find a die edge in");
  const s = smooth3(image);
  const gx = (x: number, y: number) => (x <= 0 || x >= w - 1 ? 0 : Math.abs(s[y * w + x + 1] - s[y * w + x - 1]) / 2);
  const gy = (x: number, y: number) => (y <= 0 || y >= h - 1 ? 0 : Math.abs(s[(y + 1) * w + x] - s[(y - 1) * w + x]) / 2);
  const col = new Float64Array(w);
  const row = new Float64Array(h);
  for (let y = 1; y < h - 1; y++)
    for (let x = 1; x < w - 1; x++) {
      col[x] += gx(x, y);
      row[y] += gy(x, y);
    }
  // A turned edge spreads over tan(turn)·length px of the profile; 3 % covers about 1.7°.
  const colS = boxFilter(col, Math.max(3, Math.round(0.03 * h)));
  const rowS = boxFilter(row, Math.max(3, Math.round(0.03 * w)));
  const half = (p: Float64Array, from: number, to: number) => p.slice(from, to);
  const left = outermost(half(colS, 0, Math.floor(w / 2)), 0.4);
  const right = w - 1 - outermost(half(colS, Math.ceil(w / 2), w).reverse(), 0.4);
  const top = outermost(half(rowS, 0, Math.floor(h / 2)), 0.4);
  const bottom = h - 1 - outermost(half(rowS, Math.ceil(h / 2), h).reverse(), 0.4);
  const bandX = Math.max(6, Math.round(0.04 * h));
  const bandY = Math.max(6, Math.round(0.04 * w));
  const clampX = (v: number) => Math.max(0, Math.min(w, v));
  const clampY = (v: number) => Math.max(0, Math.min(h, v));
  // Scan lines between the rough corners, keeping clear of them by the band.
  const rows: [number, number] = [Math.round(clampY(top + bandY)), Math.round(clampY(bottom - bandY))];
  const cols: [number, number] = [Math.round(clampX(left + bandX)), Math.round(clampX(right - bandX))];
  const fits: Record<Side, Line | null> = {
    left: robustLine(sidePoints((l, p) => gx(p, l), rows, [clampX(left - bandX), clampX(left + bandX)], false)),
    right: robustLine(sidePoints((l, p) => gx(p, l), rows, [clampX(right - bandX), clampX(right + bandX)], true)),
    top: robustLine(sidePoints((l, p) => gy(l, p), cols, [clampY(top - bandY), clampY(top + bandY)], false)),
    bottom: robustLine(sidePoints((l, p) => gy(l, p), cols, [clampY(bottom - bandY), clampY(bottom + bandY)], true)),
  };
  const { left: L, right: R, top: T, bottom: B } = fits;
  if (!L || !R || !T || !B) return { corners: [], confidence: 0 };
  const corners = [intersect(L, B), intersect(R, B), intersect(R, T), intersect(L, T)];
  const agreement = [L, R, T, B].reduce((m, f) => Math.min(m, f.inliers / Math.max(1, f.total)), 1);
  const sharpness = [L, R, T, B].reduce((m, f) => Math.min(m, 1 / (1 + f.rms)), 1);
  // Vertical sides run along (b, 1), horizontal ones along (1, b): square corners need bv ≈ −bh.
  const square = 1 - Math.min(1, (Math.abs(L.b + B.b) + Math.abs(R.b + T.b)) * 10);
  return { corners, confidence: Math.max(0, Math.min(1, agreement * sharpness * square)) };
}
