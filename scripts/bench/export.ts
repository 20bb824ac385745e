// Export benchmark: an annotated PNG 8,192 px wide of the 400-megapixel benchmark image with
// 5,000 shapes (targets: < 10 s, peak RSS < 1.5 GB), and the widest output, 16,384 px, for memory.
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import sharp from "sharp";
import { configureSharp } from "@/server/images/limits";
import { benchImage } from "./tiling";

const ROOT = path.resolve(import.meta.dirname, "../..");

function renderOnce(input: string, widthPx: number, shapes: number) {
  const out = path.join(os.tmpdir(), "kerfline-bench", `export-${widthPx}.png`);
  const r = spawnSync(
    process.execPath,
    ["--conditions=react-server", "--import", "tsx", path.join(ROOT, "scripts/bench/export-once.ts"), input, out, String(widthPx), String(shapes)],
    { cwd: ROOT, encoding: "utf8" },
  );
  if (r.status !== 0) throw new Error(`export render failed: ${r.stderr}`);
  fs.rmSync(out, { force: true });
  return JSON.parse(r.stdout.trim().split("\n").pop()!) as { seconds: number; peakRssMb: number; width: number; height: number; bytes: number };
}

/** The floor on this machine right now: sharp resizing the same image to a plain PNG, no markup. */
async function plainResizeSeconds(input: string, widthPx: number): Promise<number> {
  const out = path.join(os.tmpdir(), "kerfline-bench", `plain-${widthPx}.png`);
  configureSharp(); // the same libvips threads as the export it is compared with
  const t0 = performance.now();
  await sharp(input, { limitInputPixels: false }).resize(widthPx).png({ compressionLevel: 6, adaptiveFiltering: false }).toFile(out);
  fs.rmSync(out, { force: true });
  return (performance.now() - t0) / 1000;
}

/** Prints time and peak RSS of the annotated PNG export against the targets. */
export async function benchExport(widths: readonly number[] = [8192, 16_384]) {
  const input = await benchImage();
  console.log("\nAnnotated PNG export (20000 × 20000 px JPEG, 5,000 shapes)");
  for (const w of widths) {
    const r = renderOnce(input, w, 5000);
    const plain = await plainResizeSeconds(input, w);
    const timeTarget = w === 8192 ? ` (target < 10 s) ${r.seconds < 10 ? "MET" : "NOT MET"}` : "";
    console.log(
      `  ${r.width} × ${r.height} px: ${r.seconds.toFixed(2)} s${timeTarget}, peak RSS ${(r.peakRssMb / 1024).toFixed(2)} GB (target < 1.5 GB) ${r.peakRssMb < 1536 ? "MET" : "NOT MET"}, ${(r.bytes / 1e6).toFixed(1)} MB`,
    );
    console.log(`    reference, same run: plain sharp resize to PNG without markup ${plain.toFixed(2)} s (export / plain ${(r.seconds / plain).toFixed(2)})`);
  }
}

if (process.argv[1] === import.meta.filename) await benchExport(process.argv[2] ? [Number(process.argv[2])] : undefined);
