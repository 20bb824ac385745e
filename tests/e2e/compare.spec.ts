import { expect, test, type Page } from "@playwright/test";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import sharp from "sharp";
import { signInAs, waitForStillView } from "./helpers";
import { NV24R_LAYOUT } from "../../lib/demo-die/layout";
import { demoMicrographOptions, renderDemoMicrograph } from "../../server/images/demo-die";
import { placeDie, pxPerUmForWidth, type Placement } from "../../lib/demo-die/placement";
import { applyAffine, composeAffine, invertAffine } from "../../lib/geometry/affine";

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
const dark = placementOf("dark_field");

type Micrograph = { id: string; label: string; status: string; transform: number[][] | null };
type Matrix = [[number, number, number], [number, number, number]];

/** Opens the demo die's bench and returns its id. */
async function openDie(page: Page) {
  await page.setViewportSize({ width: 1600, height: 900 });
  await signInAs(page, "analyst");
  await page.getByRole("link", { name: "NV-24R receiver teardown" }).click();
  await page.getByRole("link", { name: "NV-24R die A" }).click();
  await expect(page.getByRole("tab", { name: "Die & micrographs" })).toBeVisible();
  return page.url().split("/").pop()!.split("?")[0];
}

async function micrographs(page: Page, dieId: string) {
  return (await (await page.request.get(`/api/dies/${dieId}/micrographs`)).json()) as Micrograph[];
}

/** Waits until both demo micrographs are tiled, then aligns the dark field by its ground-truth pad centres. */
async function alignDarkByTruth(page: Page, dieId: string) {
  await expect.poll(async () => (await micrographs(page, dieId)).every((m) => m.status === "ready"), { timeout: 120_000 }).toBe(true);
  const darkId = (await micrographs(page, dieId)).find((m) => /dark field/.test(m.label))!.id;
  const pairs = NV24R_LAYOUT.pads.slice(0, 8).map((p) => ({ imagePx: applyAffine(dark.dieToImage, p.centreUm[0], p.centreUm[1]), dieUm: p.centreUm }));
  const res = await page.request.put(`/api/micrographs/${darkId}/alignment`, { data: { model: "similarity", pairs } });
  expect(res.status(), await res.text()).toBe(200);
  await page.reload();
}

/** Opens a comparison from the micrographs tab: first = top/left, second = below/right. */
async function openCompare(page: Page, mode: "Side by side" | "Overlay" | "Split", first: RegExp) {
  await page.getByRole("tab", { name: "Die & micrographs" }).click();
  const firstSelect = page.getByLabel("First micrograph");
  await expect(firstSelect.locator("option", { hasText: first })).toHaveCount(1);
  const options = await firstSelect.locator("option").allTextContents();
  const want = options.find((o) => first.test(o))!;
  const other = options.find((o) => o !== want)!;
  await firstSelect.selectOption({ label: want });
  await page.getByLabel("Second micrograph").selectOption({ label: other });
  await expect(firstSelect.locator("option:checked")).toHaveText(want);
  await page.getByRole("tabpanel").getByRole("button", { name: mode, exact: true }).click();
  await expect(page.getByTestId("compare-view")).toBeVisible();
}

/** The die → screen matrix of the markup layer inside one compare pane. */
async function dieToScreen(page: Page, pane: "compare-top" | "compare-bottom"): Promise<Matrix> {
  return JSON.parse((await page.getByTestId(pane).getByTestId("markup-overlay").getAttribute("data-die-to-screen"))!) as Matrix;
}
const scaleOf = (m: Matrix) => Math.hypot(m[0][0], m[1][0]);

/** RGB of one CSS px of a full-page screenshot (device scale 1); saved to `file` when given, for a person to look at. */
async function pixels(page: Page, file?: string) {
  const png = await page.screenshot(file ? { path: file } : {});
  const { data, info } = await sharp(png).removeAlpha().raw().toBuffer({ resolveWithObject: true });
  return (x: number, y: number) => {
    const i = (Math.round(y) * info.width + Math.round(x)) * 3;
    return [data[i], data[i + 1], data[i + 2]];
  };
}

test.describe.serial("comparing the demo micrographs", () => {
  test("the mouse wheel zooms side by side and overlaid, both views stay locked, no page error", async ({ page }) => {
    test.setTimeout(240_000); // the seeded micrographs are still being tiled
    const errors: string[] = [];
    page.on("pageerror", (e) => errors.push(`${e.message} ${e.stack?.split("\n").slice(1, 6).join(" ")}`));
    const dieId = await openDie(page);
    await alignDarkByTruth(page, dieId);
    for (const mode of ["Side by side", "Overlay"] as const) {
      await openCompare(page, mode, /dark field/);
      await waitForStillView(page);
      const before = await dieToScreen(page, "compare-top");
      const box = (await page.getByTestId("compare-top").boundingBox())!;
      await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
      for (let i = 0; i < 4; i++) {
        await page.mouse.wheel(0, -120);
        await page.waitForTimeout(150);
      }
      await waitForStillView(page);
      const after = await dieToScreen(page, "compare-top");
      expect(scaleOf(after) / scaleOf(before), `${mode}; page errors: ${errors.slice(0, 2).join(" / ")}`).toBeGreaterThan(1.3);
      if (mode === "Side by side") {
        // Locked in die coordinates: the same µm per screen px and the same die-frame turn.
        const other = await dieToScreen(page, "compare-bottom");
        expect(scaleOf(other) / scaleOf(after)).toBeCloseTo(1, 2);
        expect(Math.atan2(other[1][0], other[0][0])).toBeCloseTo(Math.atan2(after[1][0], after[0][0]), 3);
      }
      await page.getByRole("button", { name: "Back to one micrograph" }).click();
    }
    expect(errors).toEqual([]);
  });

  test("the bright field drawn turned below the dark field shows every tile, each in its place", async ({ page }) => {
    test.setTimeout(150_000);
    // Ground truth: the bright field rendered again by the seed's renderer at a quarter of its
    // width (same placement, so image px / 4), read back as raw RGB.
    const file = path.join(os.tmpdir(), `kerf-compare-truth-${process.pid}.jpg`);
    await renderDemoMicrograph(file, demoMicrographOptions("bright_field", 3000));
    const truth = await sharp(file).removeAlpha().raw().toBuffer({ resolveWithObject: true });
    fs.rmSync(file, { force: true });
    const bright = placementOf("bright_field");
    const k = truth.info.width / bright.widthPx;
    const truthAt = (x: number, y: number) => {
      const i = (Math.floor(y * k) * truth.info.width + Math.floor(x * k)) * 3;
      return [truth.data[i], truth.data[i + 1], truth.data[i + 2]];
    };

    await openDie(page);
    // Dark field on top (it leads, unturned), so the reference bright field is the one drawn
    // turned by the 1.5° between them; the overlay at 0 % shows the bright field alone.
    await openCompare(page, "Overlay", /dark field/);
    await page.getByLabel("Overlay opacity").fill("0");
    const view = (await page.getByTestId("compare-bottom").boundingBox())!;
    const topViewer = page.getByTestId("compare-top").getByRole("application", { name: "Micrograph viewer" });
    for (const [step, zoomIns] of [0, 2, 2].entries()) {
      await topViewer.focus();
      for (let i = 0; i < zoomIns; i++) await page.keyboard.press("=");
      await waitForStillView(page);
      const get = await pixels(page, `test-results/compare-turned-reference-${step}.png`);
      const m = await dieToScreen(page, "compare-top");
      const o = (await page.getByTestId("compare-top").getByTestId("markup-overlay").boundingBox())!;
      const screenToImage = invertAffine(
        composeAffine(
          [
            [m[0][0], m[0][1], m[0][2] + o.x],
            [m[1][0], m[1][1], m[1][2] + o.y],
          ],
          bright.imageToDie,
        ),
      );
      // Every sampled screen px inside the image must show what the rendering has there. Only
      // spots where every truth px within ±4 screen px is the same colour count (edges blur), and the
      // viewer's own controls are left out: toolbar (left), scale bar and readout (bottom
      // strip), navigator (bottom right).
      let wrong = 0;
      let samples = 0;
      const bad: string[] = [];
      for (let y = view.y + 10; y < view.y + view.height - 45; y += 5) {
        for (let x = view.x + 50; x < view.x + view.width - 10; x += 5) {
          if (x > view.x + view.width * 0.78 && y > view.y + view.height * 0.72) continue;
          const [ix, iy] = applyAffine(screenToImage, x, y);
          const r = 4 / scaleOf(m) / bright.imageToDie[0][0] + 2 / k;
          if (ix < r || iy < r || ix > bright.widthPx - r || iy > bright.heightPx - r) continue;
          const want = truthAt(ix, iy);
          let flat = true;
          for (let ty = Math.floor((iy - r) * k); flat && ty <= Math.floor((iy + r) * k); ty++) {
            for (let tx = Math.floor((ix - r) * k); flat && tx <= Math.floor((ix + r) * k); tx++) {
              const i = (ty * truth.info.width + tx) * 3;
              flat = Math.abs(truth.data[i] - want[0]) < 10 && Math.abs(truth.data[i + 1] - want[1]) < 10 && Math.abs(truth.data[i + 2] - want[2]) < 10;
            }
          }
          if (!flat) continue;
          samples++;
          const got = get(x, y);
          if (got.some((v, c) => Math.abs(v - want[c]) > 40)) {
            wrong++;
            if (bad.length < 5) bad.push(`(${Math.round(x)}, ${Math.round(y)}) shows ${got} where the image has ${want}`);
          }
        }
      }
      expect(samples, `step ${step}`).toBeGreaterThan(3000);
      expect(wrong, `step ${step}: ${wrong} of ${samples} samples wrong, e.g. ${bad.join("; ")}`).toBe(0);
    }
  });

  test("a refinement that does not lower the RMS on the control points is not offered for acceptance", async ({ page }) => {
    await openDie(page);
    await page.getByRole("tab", { name: "Die & micrographs" }).click();
    await page.locator('[data-testid^="manage-"]', { hasText: "dark field" }).getByRole("button", { name: /align/i }).click();
    // The stored control points are the pads' true positions: the fit is exact (RMS near 0),
    // so correlation cannot lower it by the 0.01 µm that counts as an improvement.
    await expect(page.getByTestId("alignment-rms")).toBeVisible();
    await page.getByRole("button", { name: "Refine automatically" }).click();
    await expect(page.getByTestId("refinement")).toHaveAttribute("data-proposed", "false", { timeout: 60_000 });
    await expect(page.getByTestId("refinement-verdict")).toContainText("does not improve the fit");
    await expect(page.getByTestId("refinement")).toContainText("phase-correlation peak");
    await expect(page.getByRole("button", { name: "Accept refined" })).toHaveCount(0);
    await page.getByRole("button", { name: "Keep the control-point fit" }).click();
    await expect(page.getByTestId("refinement")).toHaveCount(0);
  });

  test("an alignment session survives reload, Back and Forward with its clicked points", async ({ page }) => {
    await openDie(page);
    await page.getByRole("tab", { name: "Die & micrographs" }).click();
    await page.locator('[data-testid^="manage-"]', { hasText: "dark field" }).getByRole("button", { name: /align/i }).click();
    await expect(page.getByTestId("alignment-workspace")).toBeVisible();
    const rows = page.getByRole("table", { name: "Control-point pairs" }).locator("tbody tr");
    await expect(rows).toHaveCount(8); // the control points stored by the first test
    await waitForStillView(page);
    for (const [side, dx] of [
      ["align-left", 0],
      ["align-right", 0],
      ["align-left", 40],
      ["align-right", 40],
    ] as const) {
      const box = (await page.getByTestId(side).boundingBox())!;
      await page.mouse.click(box.x + box.width / 2 + dx, box.y + box.height / 2);
    }
    await expect(rows).toHaveCount(10);
    const pxCell = page.getByTestId("pair-row-10").locator("td").nth(1);
    const clicked = (await pxCell.textContent())!;
    await page.getByLabel("Model").selectOption("affine");

    await page.reload();
    await expect(page.getByTestId("alignment-workspace")).toBeVisible();
    await expect(rows).toHaveCount(10);
    await expect(pxCell).toHaveText(clicked);
    await expect(page.getByLabel("Model")).toHaveValue("affine");
    await expect(page.getByTestId("pair-marker-left-10")).toBeVisible();

    // Back leaves the session for the single view of the same die; Forward brings it back.
    await page.goBack();
    await expect(page.getByRole("heading", { name: "NV-24R die A" })).toBeVisible();
    await expect(page.getByTestId("alignment-workspace")).toHaveCount(0);
    await page.goForward();
    await expect(page.getByTestId("alignment-workspace")).toBeVisible();
    await expect(rows).toHaveCount(10);
    await expect(pxCell).toHaveText(clicked);
  });

  test("screenshots of the three modes with the reference drawn turned, for a person to look at", async ({ page }) => {
    await openDie(page);
    for (const mode of ["Side by side", "Overlay", "Split"] as const) {
      await openCompare(page, mode, /dark field/);
      await waitForStillView(page);
      await page.screenshot({ path: `test-results/compare-mode-${mode.replace(/ /g, "-").toLowerCase()}.png` });
      await page.getByRole("button", { name: "Back to one micrograph" }).click();
    }
  });
});
