import { expect, test, type Locator, type Page } from "@playwright/test";
import sharp from "sharp";
import { signInAs, waitForStillView } from "./helpers";
import { NV24R_LAYOUT, padByLabel } from "../../lib/demo-die/layout";
import { demoMicrographOptions } from "../../server/images/demo-die";
import { placeDie, pxPerUmForWidth, type Placement } from "../../lib/demo-die/placement";
import { applyAffine } from "../../lib/geometry/affine";

// Ground truth of the two seeded micrographs, from the renderer's own placement
// (lib/demo-die/placement.ts with the seed's settings): where each pad really is on each image.
function placementOf(look: "bright_field" | "dark_field"): Placement {
  const o = demoMicrographOptions(look);
  return placeDie(NV24R_LAYOUT, {
    pxPerUm: pxPerUmForWidth(NV24R_LAYOUT, o.widthPx!, 300),
    marginUm: 300,
    rotateDeg: o.rotateDeg,
    scale: o.scale,
    shiftPx: o.shiftPx,
  });
}
const bright = placementOf("bright_field");
const dark = placementOf("dark_field");
const PADS = ["G1", "G6", "VCC2", "VEE1"];

/** Screen px of a die point in a viewer at its fit view: the image centred and fitted (OpenSeadragon's home). */
async function fitScreen(viewer: Locator, p: Placement, die: readonly [number, number]) {
  const box = (await viewer.boundingBox())!;
  const s = Math.min(box.width / p.widthPx, box.height / p.heightPx);
  const [ix, iy] = applyAffine(p.dieToImage, die[0], die[1]);
  return { x: box.x + (box.width - p.widthPx * s) / 2 + ix * s, y: box.y + (box.height - p.heightPx * s) / 2 + iy * s };
}

/** RGB of one CSS px of a full-page screenshot (device scale 1). */
async function pixels(page: Page) {
  const { data, info } = await sharp(await page.screenshot())
    .removeAlpha()
    .raw()
    .toBuffer({ resolveWithObject: true });
  return (x: number, y: number) => {
    const i = (Math.round(y) * info.width + Math.round(x)) * 3;
    return [data[i], data[i + 1], data[i + 2]];
  };
}
const luminance = ([r, g, b]: number[]) => 0.2126 * r + 0.7152 * g + 0.0722 * b;

test.describe.serial("aligning and comparing the demo micrographs", () => {
  test("the analyst aligns the dark field by 4 control points, then overlays it on the bright field and splits the view", async ({ page }) => {
    await page.setViewportSize({ width: 1600, height: 900 });
    await signInAs(page, "analyst");
    await page.getByRole("link", { name: "NV-24R receiver teardown" }).click();
    await page.getByRole("link", { name: "NV-24R die A" }).click();
    await page.getByRole("tab", { name: "Die & micrographs" }).click();
    const row = page.locator('[data-testid^="manage-"]', { hasText: "dark field" });
    await row.getByRole("button", { name: "Align" }).click();
    const left = page.getByTestId("align-left").getByRole("application", { name: "Micrograph viewer" });
    const right = page.getByTestId("align-right").getByRole("application", { name: "Micrograph viewer" });
    await expect(left).toBeVisible();
    await expect(right).toBeVisible();
    await waitForStillView(page);

    for (const [i, label] of PADS.entries()) {
      const c = padByLabel(NV24R_LAYOUT, label).centreUm;
      const l = await fitScreen(left, dark, c);
      await page.mouse.click(l.x, l.y);
      await expect(page.getByTestId(`pair-marker-left-${i + 1}`)).toBeVisible();
      const r = await fitScreen(right, bright, c);
      await page.mouse.click(r.x, r.y);
      await expect(page.getByTestId(`pair-marker-right-${i + 1}`)).toBeVisible();
    }
    await expect(page.getByTestId("alignment-rms")).toBeVisible();
    for (let i = 1; i <= 4; i++) await expect(page.getByTestId(`pair-residual-${i}`)).toContainText("µm");
    const rms = Number((await page.getByTestId("alignment-rms").innerText()).match(/([\d.]+) µm/)![1]);
    expect(rms).toBeLessThan(15); // fit-view clicks: one screen px is about 7 µm here
    await page.getByRole("button", { name: "Accept alignment" }).click();

    // Stored: every ground-truth pad centre of the dark field maps within a few clicks' error.
    const micrographs = await page.evaluate(async () => {
      const id = location.pathname.split("/").pop();
      return (await (await fetch(`/api/dies/${id}/micrographs`)).json()) as { label: string; transform: number[][] | null }[];
    });
    const t = micrographs.find((m) => /dark field/.test(m.label))!.transform! as [[number, number, number], [number, number, number]];
    for (const pad of NV24R_LAYOUT.pads) {
      const [x, y] = applyAffine(dark.dieToImage, pad.centreUm[0], pad.centreUm[1]);
      const [u, v] = applyAffine(t, x, y);
      expect(Math.hypot(u - pad.centreUm[0], v - pad.centreUm[1])).toBeLessThan(15);
    }

    // Overlay: the dark field over the bright field at 50 %. Each image alone, then overlaid: the
    // pad must sit at the ground-truth spot in both (bright field: light pad square, dark field:
    // lit outlines). Pads without a bond ball are used: the probed VB1S (scrub mark offset along y) for x, the probed G5
    // (its scrub mark is offset along x only) for y.
    await expect(page.getByTestId("compare-view")).toHaveAttribute("data-mode", "overlay");
    const top = page.getByTestId("compare-top").getByRole("application", { name: "Micrograph viewer" });
    await waitForStillView(page);
    const opacity = page.getByLabel("Overlay opacity");
    const shot = async (value: string) => {
      await opacity.fill(value);
      await waitForStillView(page);
      return pixels(page);
    };
    const darkOnly = await shot("100");
    const brightOnly = await shot("0");
    const overlaid = await shot("50");
    const xPad = await fitScreen(top, dark, padByLabel(NV24R_LAYOUT, "VB1S").centreUm);
    const yPad = await fitScreen(top, dark, padByLabel(NV24R_LAYOUT, "G5").centreUm);
    /** Centroid along one axis of the pixels brighter than `min` in a 17 × 17 px window (the pad is about 13 px wide here). */
    const centroid = (get: (x: number, y: number) => number[], at: { x: number; y: number }, axis: "x" | "y", min: number) => {
      let sum = 0;
      let n = 0;
      for (let j = -8; j <= 8; j++) {
        for (let i = -8; i <= 8; i++) {
          if (luminance(get(at.x + i, at.y + j)) > min) {
            sum += axis === "x" ? i : j;
            n++;
          }
        }
      }
      return n ? sum / n : Number.NaN;
    };
    const found = {
      bx: centroid(brightOnly, xPad, "x", 200),
      dx: centroid(darkOnly, xPad, "x", 20),
      by: centroid(brightOnly, yPad, "y", 200),
      dy: centroid(darkOnly, yPad, "y", 20),
    };
    // Both pads within 3 screen px (about 20 µm at this zoom) of the truth, and of each other within 2.
    for (const v of Object.values(found)) expect(Math.abs(v), JSON.stringify(found)).toBeLessThan(3);
    expect(Math.abs(found.bx - found.dx), JSON.stringify(found)).toBeLessThan(2);
    expect(Math.abs(found.by - found.dy), JSON.stringify(found)).toBeLessThan(2);
    // At 50 % every pixel over the pad is the mean of the two (within compositing rounding).
    for (const [dx, dy] of [
      [0, 0],
      [-4, 0],
      [4, 0],
      [0, 4],
    ]) {
      const x = xPad.x + dx;
      const y = xPad.y + dy;
      overlaid(x, y).forEach((v, c) => expect(Math.abs(v - (darkOnly(x, y)[c] + brightOnly(x, y)[c]) / 2)).toBeLessThan(12));
    }

    // Split with the divider dragged onto the pad centre: dark field left of it, bright field right.
    await page.getByRole("button", { name: "Split", exact: true }).first().click();
    await expect(page.getByTestId("compare-view")).toHaveAttribute("data-mode", "split");
    const divider = (await page.getByTestId("split-divider").boundingBox())!;
    await page.mouse.move(divider.x + divider.width / 2, xPad.y - 150);
    await page.mouse.down();
    await page.mouse.move(xPad.x, xPad.y - 150, { steps: 8 });
    await page.mouse.up();
    await waitForStillView(page);
    const split = await pixels(page);
    for (const dy of [-4, 0, 4]) {
      split(xPad.x - 4, xPad.y + dy).forEach((v, c) => expect(Math.abs(v - darkOnly(xPad.x - 4, xPad.y + dy)[c])).toBeLessThan(12));
      split(xPad.x + 4, xPad.y + dy).forEach((v, c) => expect(Math.abs(v - brightOnly(xPad.x + 4, xPad.y + dy)[c])).toBeLessThan(12));
    }
  });

  test("a pad drawn on the bright-field view appears at the same place on the dark-field view", async ({ page }) => {
    await page.setViewportSize({ width: 1600, height: 900 });
    await signInAs(page, "analyst");
    await page.getByRole("link", { name: "NV-24R receiver teardown" }).click();
    await page.getByRole("link", { name: "NV-24R die A" }).click();
    await page.getByRole("tab", { name: "Die & micrographs" }).click();
    await page
      .getByRole("list", { name: "Micrographs" })
      .getByRole("button", { name: /bright field/ })
      .click();
    const viewer = page.getByRole("application", { name: "Micrograph viewer" });
    await expect(page.getByTestId("markup-overlay")).toBeVisible();
    await page.getByRole("button", { name: "Fit die" }).click();
    await waitForStillView(page);
    // Draw a pad over VB2 on the bright field (its layout rectangle, placed by the ground truth).
    const vb2 = padByLabel(NV24R_LAYOUT, "VB2");
    const [cx, cy] = vb2.centreUm;
    await page.getByRole("toolbar", { name: "Markup tools" }).getByRole("button", { name: /^Pad/ }).click();
    const a = await fitScreen(viewer, bright, [cx - vb2.sizeUm[0] / 2, cy + vb2.sizeUm[1] / 2]);
    const b = await fitScreen(viewer, bright, [cx + vb2.sizeUm[0] / 2, cy - vb2.sizeUm[1] / 2]);
    await page.mouse.move(a.x, a.y);
    await page.mouse.down();
    await page.mouse.move(b.x, b.y, { steps: 6 });
    await page.mouse.up();
    await expect(page.getByTestId("save-state")).toHaveAttribute("data-status", "saved");
    const shapes = await page.evaluate(async () => {
      const id = location.pathname.split("/").pop();
      return (await (await fetch(`/api/dies/${id}/markup`)).json()) as { id: string; kind: string; geometry: { coordinates: number[][][] } }[];
    });
    const drawn = shapes.filter((s) => s.kind === "pad").pop()! as { id?: string; geometry: { coordinates: number[][][] } };
    const ring = drawn.geometry.coordinates[0];
    const centre = [
      (Math.min(...ring.map((p) => p[0])) + Math.max(...ring.map((p) => p[0]))) / 2,
      (Math.min(...ring.map((p) => p[1])) + Math.max(...ring.map((p) => p[1]))) / 2,
    ] as const;

    // Switch to the dark field: the same die-frame pad is drawn through its (aligned) transform
    // and must land on the dark-field image's own VB2 pad (ground truth), within the alignment's error.
    await page
      .getByRole("list", { name: "Micrographs" })
      .getByRole("button", { name: /dark field/ })
      .click();
    await waitForStillView(page);
    await page.getByRole("button", { name: "Fit die" }).click();
    await waitForStillView(page);
    const overlay = page.getByTestId("markup-overlay");
    const m = JSON.parse((await overlay.getAttribute("data-die-to-screen"))!) as [[number, number, number], [number, number, number]];
    const o = (await overlay.boundingBox())!;
    const [sx, sy] = applyAffine(m, centre[0], centre[1]);
    const truth = await fitScreen(page.getByRole("application", { name: "Micrograph viewer" }), dark, [cx, cy]);
    // One fit-view screen px is about 7 µm; the alignment from fit-view clicks is good to a few µm.
    expect(Math.abs(o.x + sx - truth.x)).toBeLessThan(3);
    expect(Math.abs(o.y + sy - truth.y)).toBeLessThan(3);
    // Leave the shared demo die as seeded for the suites that follow.
    await page.evaluate(async (id) => fetch(`/api/markup/${id}`, { method: "DELETE" }), drawn.id);
  });
});
