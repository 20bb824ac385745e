// Mosaic benchmark: 48 frames of 2448 × 2048 px (6 × 8 grid, 10 % overlap) stitched and tiled,
// against tiling one JPEG of the composed size with the same pyramid builder, alternating
// runs in one script so machine noise hits both. Each run is a child process so its peak RSS
// is its own.
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import sharp from "sharp";
import { cutFrames, dieLikeScene, sceneSizeFor, type GridSpec } from "../../server/images/mosaic/test-support";

const ROOT = path.resolve(import.meta.dirname, "../..");
const SPEC: GridSpec = {
  rows: 6,
  cols: 8,
  order: "rows",
  frameWidth: 2448,
  frameHeight: 2048,
  overlapPercent: 10,
  jitter: 0.01,
  seed: 17,
  origin: { x: 40, y: 40 },
  format: "jpeg",
};

type Fixture = { framePaths: string[]; reference: string };

/** The frames (JPEG Q90) and a JPEG of the composed size cut from the same scene, cached between runs. */
async function fixture(): Promise<Fixture> {
  const dir = path.join(os.tmpdir(), "kerfline-bench", "mosaic-6x8");
  const done = path.join(dir, "fixture.json");
  if (fs.existsSync(done)) return JSON.parse(fs.readFileSync(done, "utf8")) as Fixture;
  fs.mkdirSync(dir, { recursive: true });
  const size = sceneSizeFor(SPEC);
  const scene = await dieLikeScene(size.width, size.height, 4);
  const { framePaths, truth } = await cutFrames(scene, SPEC, dir);
  const x0 = Math.min(...truth.map((t) => t.x));
  const y0 = Math.min(...truth.map((t) => t.y));
  const width = Math.max(...truth.map((t) => t.x)) + SPEC.frameWidth - x0;
  const height = Math.max(...truth.map((t) => t.y)) + SPEC.frameHeight - y0;
  const reference = path.join(dir, "composed-size.jpg");
  await sharp(scene.rgb, { raw: { width: scene.width, height: scene.height, channels: 3 }, limitInputPixels: false })
    .extract({ left: x0, top: y0, width, height })
    .jpeg({ quality: 90 })
    .toFile(reference);
  const result = { framePaths, reference };
  fs.writeFileSync(done, JSON.stringify(result));
  return result;
}

type Run = { seconds: number; peakRssMb: number; stitchSeconds?: number; width?: number; height?: number; residualPx?: { rms: number; max: number } };

function child(script: string, args: string[]): Run {
  const r = spawnSync(process.execPath, ["--conditions=react-server", "--import", "tsx", path.join(ROOT, script), ...args], { cwd: ROOT, encoding: "utf8" });
  if (r.status !== 0) throw new Error(r.stderr);
  return JSON.parse(r.stdout.trim().split("\n").pop()!) as Run;
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

/** Prints stitch+tile time / tile time (target ≤ 2) and the stitch run's peak RSS (target < 1.5 GB); exits 1 on a miss. */
export async function benchMosaic(rounds = 3) {
  const { framePaths, reference } = await fixture();
  const work = fs.mkdtempSync(path.join(os.tmpdir(), "kerfline-bench-mosaic-"));
  const list = path.join(work, "frames.json");
  fs.writeFileSync(list, JSON.stringify({ framePaths, rows: SPEC.rows, cols: SPEC.cols, overlapPercent: SPEC.overlapPercent }));
  const ours: Run[] = [];
  const tiling: Run[] = [];
  try {
    for (let i = 0; i < rounds; i++) {
      const a = path.join(work, `tile-${i}`);
      tiling.push(child("scripts/bench/tile-once.ts", [reference, a]));
      fs.rmSync(a, { recursive: true, force: true });
      const b = path.join(work, `mosaic-${i}`);
      fs.mkdirSync(b);
      ours.push(child("scripts/bench/mosaic-once.ts", [list, b]));
      fs.rmSync(b, { recursive: true, force: true });
    }
  } finally {
    fs.rmSync(work, { recursive: true, force: true });
  }
  const ratio = median(ours.map((o, i) => o.seconds / tiling[i].seconds));
  const peak = Math.max(...ours.map((o) => o.peakRssMb));
  const { width, height, residualPx } = ours[0];
  console.log(
    `mosaic 6×8 frames of ${SPEC.frameWidth}×${SPEC.frameHeight} (${SPEC.overlapPercent} % overlap) → ${width}×${height} px, ${rounds} alternating rounds:`,
  );
  console.log(
    `  stitch + tile: median ${median(ours.map((o) => o.seconds)).toFixed(2)} s (stitching ${median(ours.map((o) => o.stitchSeconds ?? 0)).toFixed(2)} s), peak RSS ${peak.toFixed(0)} MB, residual rms ${residualPx?.rms} px max ${residualPx?.max} px`,
  );
  console.log(
    `  tile one JPEG of that size: median ${median(tiling.map((o) => o.seconds)).toFixed(2)} s, peak RSS ${Math.max(...tiling.map((o) => o.peakRssMb)).toFixed(0)} MB`,
  );
  console.log(`  time ratio (median of per-round ratios): ${ratio.toFixed(3)}  (target ≤ 2) ${ratio <= 2 ? "MET" : "NOT MET"}`);
  console.log(`  peak RSS ${(peak / 1024).toFixed(2)} GB  (target < 1.5 GB) ${peak < 1536 ? "MET" : "NOT MET"}`);
  if (ratio > 2 || peak >= 1536) process.exitCode = 1;
}
