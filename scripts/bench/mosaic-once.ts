// Child process for the mosaic benchmark: stitches the frames listed in a JSON file and tiles
// the result with Kerfline's pyramid builder, then prints wall times and peak RSS (libvips
// runs in this process, so maxRSS includes it).
import fs from "node:fs";
import path from "node:path";
import { buildPyramid } from "@/server/images/pyramid";
import { stitchMosaic } from "@/server/images/mosaic/stitch";

const [listFile, work] = process.argv.slice(2);
const job = JSON.parse(fs.readFileSync(listFile, "utf8")) as { framePaths: string[]; rows: number; cols: number; overlapPercent: number };
const t0 = performance.now();
const outPath = path.join(work, "mosaic.tif");
const layout = await stitchMosaic({ ...job, order: "rows", flatField: true, outPath, workDir: work });
const stitchSeconds = (performance.now() - t0) / 1000;
await buildPyramid(outPath, path.join(work, "pyramid"), { pollMs: 1000 });
const seconds = (performance.now() - t0) / 1000;
console.log(
  JSON.stringify({
    seconds,
    stitchSeconds,
    peakRssMb: process.resourceUsage().maxRSS / 1024,
    width: layout.width,
    height: layout.height,
    residualPx: layout.residualPx,
    warnings: layout.warnings.length,
  }),
);
