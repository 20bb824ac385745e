import { execFileSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { stitchMosaic } from "./stitch";
import { cutFrames, dieLikeScene, sceneSizeFor, type GridSpec } from "./test-support";

// Reference: libvips's own mosaic operation (Debian's `vips` CLI, `vips mosaic ref sec out
// horizontal|vertical xref yref xsec ysec`), which finds the offset of two overlapping images
// from a rough tie-point by correlating small windows around many points of the overlap and
// prints the integer offset it found (`--dx0 --dy0`: ref minus sec, so −(b − a)). We give it
// the nominal overlap as the tie-point and a search wide enough for the jitter, and compare
// with our pair translations for the same frames (and both with the ground truth).

const VIPS = "/usr/bin/vips";
const haveVips = fs.existsSync(VIPS);
if (!haveVips) console.warn(`${VIPS} is missing (apt-get install libvips-tools): the libvips agreement check is skipped.`);

const SPEC: GridSpec = {
  rows: 2,
  cols: 3,
  order: "rows",
  frameWidth: 800,
  frameHeight: 640,
  overlapPercent: 25,
  jitter: 0.02,
  seed: 11,
  origin: { x: 24, y: 24 },
  vignetting: 0.15,
  noise: 3,
};

let dir: string;
beforeAll(() => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), "kerfline-mosaic-vips-"));
});
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

/** libvips's offset b − a for one pair, from a tie-point at the middle of the nominal overlap. */
function vipsOffset(a: string, b: string, direction: "horizontal" | "vertical"): { dx: number; dy: number } {
  const { frameWidth: w, frameHeight: h, overlapPercent } = SPEC;
  const ox = Math.round(w * (overlapPercent / 100));
  const oy = Math.round(h * (overlapPercent / 100));
  const [xref, yref, xsec, ysec] =
    direction === "horizontal"
      ? [w - Math.round(ox / 2), Math.round(h / 2), Math.round(ox / 2), Math.round(h / 2)]
      : [Math.round(w / 2), h - Math.round(oy / 2), Math.round(w / 2), Math.round(oy / 2)];
  const out = execFileSync(
    VIPS,
    [
      "mosaic",
      a,
      b,
      path.join(dir, "pair.v"),
      direction,
      String(xref),
      String(yref),
      String(xsec),
      String(ysec),
      "--harea",
      "40",
      "--hwindow",
      "10",
      "--dx0",
      "--dy0",
    ],
    { encoding: "utf8" },
  );
  const [dx0, dy0] = out.trim().split(/\s+/).map(Number);
  return { dx: -dx0, dy: -dy0 };
}

describe.skipIf(!haveVips)("pair offsets against libvips's mosaic operation", () => {
  it("finds the same offset as `vips mosaic` within 1 px for every neighbour pair", async () => {
    const size = sceneSizeFor(SPEC);
    const scene = await dieLikeScene(size.width, size.height, 21);
    const { framePaths, truth } = await cutFrames(scene, SPEC, dir);
    const layout = await stitchMosaic({
      framePaths,
      rows: SPEC.rows,
      cols: SPEC.cols,
      order: SPEC.order,
      overlapPercent: SPEC.overlapPercent,
      flatField: false,
      outPath: path.join(dir, "mosaic.tif"),
      workDir: dir,
    });
    expect(layout.pairs).toHaveLength(7);
    for (const p of layout.pairs) {
      const direction = layout.frames[p.a].row === layout.frames[p.b].row ? "horizontal" : "vertical";
      const v = vipsOffset(framePaths[p.a], framePaths[p.b], direction);
      const t = { dx: truth[p.b].x - truth[p.a].x, dy: truth[p.b].y - truth[p.a].y };
      console.info(`pair ${p.a}–${p.b} ${direction}: ours (${p.dx}, ${p.dy}), vips (${v.dx}, ${v.dy}), truth (${t.dx}, ${t.dy})`);
      expect(Math.abs(p.dx - v.dx)).toBeLessThanOrEqual(1);
      expect(Math.abs(p.dy - v.dy)).toBeLessThanOrEqual(1);
      // libvips agrees with the ground truth too, so the comparison means something.
      expect(Math.hypot(v.dx - t.dx, v.dy - t.dy)).toBeLessThanOrEqual(1);
    }
  });
});
