import { mkdir, writeFile } from "node:fs/promises";
import path from "node:path";
import { NV24R_LAYOUT } from "@/lib/demo-die/layout";
import type { Look } from "@/lib/demo-die/render-svg";
import { demoMicrographOptions, renderDemoMicrograph } from "@/server/images/demo-die";

/**
 * Writes the two full-size demo micrographs of the NV-24R die and their ground-truth
 * transforms: `npx tsx scripts/demo-die.ts OUTDIR`.
 */

const FILES: Record<Look, string> = { bright_field: "nv24r-bright-field.jpg", dark_field: "nv24r-dark-field.jpg" };

async function main(args: string[]): Promise<void> {
  const outDir = args[0];
  if (!outDir || args.length > 1) {
    console.error("usage: npx tsx scripts/demo-die.ts OUTDIR");
    process.exitCode = 2;
    return;
  }
  await mkdir(outDir, { recursive: true });
  const micrographs = [];
  // One after the other: each render needs about 0.25 GB while it runs.
  for (const look of ["bright_field", "dark_field"] as const) {
    const options = demoMicrographOptions(look);
    const started = Date.now();
    const render = await renderDemoMicrograph(path.join(outDir, FILES[look]), options);
    console.log(`${FILES[look]}: ${render.widthPx} × ${render.heightPx} px, ${render.umPerPx.toFixed(5)} µm/px, ${Date.now() - started} ms`);
    micrographs.push({ file: FILES[look], illumination: look, ...render, rendering: options });
  }
  const manifest = {
    part: NV24R_LAYOUT.part,
    maker: NV24R_LAYOUT.maker,
    note: "imageToDie maps image px (origin at the top-left pixel corner, y down) to die µm (origin lower-left, y up).",
    micrographs,
  };
  await writeFile(path.join(outDir, "nv24r-transforms.json"), `${JSON.stringify(manifest, null, 2)}\n`);
}

main(process.argv.slice(2)).catch((err: unknown) => {
  console.error(err instanceof Error ? err.message : err);
  process.exitCode = 1;
});
