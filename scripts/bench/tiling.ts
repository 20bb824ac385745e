// Tiling benchmark: Kerfline's sharp pyramid against `vips dzsave --layout iiif3` on the same
// generated 400-megapixel JPEG, alternating runs in one script so machine noise hits both.
import { execFileSync, spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import sharp from "sharp";

const ROOT = path.resolve(import.meta.dirname, "../..");

/** A 20000 × 20000 px JPEG with repeating structure (cached between runs). */
export async function benchImage(): Promise<string> {
  const dir = path.join(os.tmpdir(), "kerfline-bench");
  fs.mkdirSync(dir, { recursive: true });
  const file = path.join(dir, "bench-400mpx.jpg");
  if (fs.existsSync(file)) return file;
  const tile = await sharp({ create: { width: 512, height: 512, channels: 3, background: { r: 110, g: 130, b: 95 } } })
    .composite([
      { input: { create: { width: 240, height: 140, channels: 3, background: { r: 225, g: 205, b: 130 } } }, left: 40, top: 60 },
      { input: { create: { width: 60, height: 300, channels: 3, background: { r: 60, g: 70, b: 65 } } }, left: 380, top: 150 },
    ])
    .png()
    .toBuffer();
  await sharp({ create: { width: 20000, height: 20000, channels: 3, background: { r: 40, g: 50, b: 45 } }, limitInputPixels: false })
    .composite([{ input: tile, tile: true }])
    .jpeg({ quality: 90 })
    .toFile(`${file}.partial.jpg`);
  fs.renameSync(`${file}.partial.jpg`, file);
  return file;
}

function runOurs(input: string, out: string) {
  const r = spawnSync(process.execPath, ["--conditions=react-server", "--import", "tsx", path.join(ROOT, "scripts/bench/tile-once.ts"), input, out], {
    cwd: ROOT,
    encoding: "utf8",
  });
  if (r.status !== 0) throw new Error(r.stderr);
  return JSON.parse(r.stdout.trim().split("\n").pop()!) as { seconds: number; peakRssMb: number };
}

function runVips(input: string, out: string) {
  // Python's RUSAGE_CHILDREN gives the peak RSS of the vips process after it exits.
  const py = `import resource,subprocess,sys,time,json
t=time.time(); subprocess.run(sys.argv[1:],check=True); s=time.time()-t
print(json.dumps({"seconds":s,"peakRssMb":resource.getrusage(resource.RUSAGE_CHILDREN).ru_maxrss/1024}))`;
  const out2 = execFileSync(
    "python3",
    ["-c", py, "vips", "dzsave", input, out, "--layout", "iiif3", "--tile-size", "512", "--overlap", "0", "--suffix", ".jpg[Q=85]"],
    { encoding: "utf8" },
  );
  return JSON.parse(out2.trim()) as { seconds: number; peakRssMb: number };
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

/** Prints our time / vips time (target ≤ 1.10) and our peak RSS (target < 1.5 GB). */
export async function benchTiling(rounds = 3) {
  const input = await benchImage();
  const work = fs.mkdtempSync(path.join(os.tmpdir(), "kerfline-bench-tiles-"));
  const ours: { seconds: number; peakRssMb: number }[] = [];
  const vips: { seconds: number; peakRssMb: number }[] = [];
  try {
    for (let i = 0; i < rounds; i++) {
      vips.push(runVips(input, path.join(work, `vips-${i}`)));
      ours.push(runOurs(input, path.join(work, `ours-${i}`)));
      fs.rmSync(path.join(work, `vips-${i}`), { recursive: true, force: true });
      fs.rmSync(path.join(work, `ours-${i}`), { recursive: true, force: true });
    }
  } finally {
    fs.rmSync(work, { recursive: true, force: true });
  }
  const ratio = median(ours.map((o, i) => o.seconds / vips[i].seconds));
  const peak = Math.max(...ours.map((o) => o.peakRssMb));
  console.log(`tiling 400 Mpx JPEG (20000×20000, 512-px tiles, Q85), ${rounds} alternating rounds:`);
  console.log(`  kerfline (sharp tile iiif3): median ${median(ours.map((o) => o.seconds)).toFixed(2)} s, peak RSS ${peak.toFixed(0)} MB`);
  console.log(
    `  vips dzsave --layout iiif3:  median ${median(vips.map((o) => o.seconds)).toFixed(2)} s, peak RSS ${Math.max(...vips.map((o) => o.peakRssMb)).toFixed(0)} MB`,
  );
  console.log(`  time ratio kerfline / vips (median of per-round ratios): ${ratio.toFixed(3)}  (target ≤ 1.10) ${ratio <= 1.1 ? "MET" : "NOT MET"}`);
  console.log(`  peak RSS ${(peak / 1024).toFixed(2)} GB  (target < 1.5 GB) ${peak < 1536 ? "MET" : "NOT MET"}`);
}
