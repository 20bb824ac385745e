import fs from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import { applyAffine, invertAffine } from "@/lib/geometry/affine";
import type { Affine2x3 } from "@/lib/geometry/types";
import { NV24R_LAYOUT } from "@/lib/demo-die/layout";
import { demoMicrographOptions, renderDemoMicrograph, type DemoRender } from "@/server/images/demo-die";
import type { ApiClient } from "./client";
import { uploadForm } from "./images";
import { waitForStatus } from "./micrographs";

export type UploadedDemo = { id: string; render: DemoRender; width: number; height: number };

/**
 * Renders the demo die as a bright-field or dark-field micrograph `widthPx` wide (the seed's
 * settings, scaled), uploads it to `dieId` as `client` with the scale given, and waits until
 * it is tiled. The render's imageToDie is the ground truth.
 */
export async function uploadDemoMicrograph(client: ApiClient, dieId: string, look: "bright_field" | "dark_field", widthPx = 3000): Promise<UploadedDemo> {
  const dir = await fs.mkdtemp(path.join(os.tmpdir(), "kerf-align-"));
  const file = path.join(dir, `${look}.jpg`);
  try {
    const render = await renderDemoMicrograph(file, demoMicrographOptions(look, widthPx));
    const form = uploadForm(await fs.readFile(file), `nv24r-${look}.jpg`, {
      illumination: look,
      label: `NV-24R ${look.replace("_", " ")}`,
      scaleUmPerPx: String(render.umPerPx),
    });
    const res = await client.upload<{ id: string; error?: string }>(`/api/dies/${dieId}/micrographs`, form);
    if (res.status !== 202) throw new Error(`upload failed: ${res.status} ${JSON.stringify(res.body)}`);
    await waitForStatus(client, res.body.id, "ready");
    return { id: res.body.id, render, width: render.widthPx, height: render.heightPx };
  } finally {
    await fs.rm(dir, { recursive: true, force: true });
  }
}

/** Ground-truth control points: each pad centre of the layout, where the render put it, and its die µm. */
export function padPairs(render: DemoRender, labels?: readonly string[]) {
  const dieToImage: Affine2x3 = invertAffine(render.imageToDie);
  const pads = labels ? labels.map((l) => NV24R_LAYOUT.pads.find((p) => p.label === l)!) : NV24R_LAYOUT.pads;
  return pads.map((p) => {
    const [x, y] = applyAffine(dieToImage, p.centreUm[0], p.centreUm[1]);
    return { imagePx: [x, y] as [number, number], dieUm: [p.centreUm[0], p.centreUm[1]] as [number, number] };
  });
}
