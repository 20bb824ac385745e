import { expect, test } from "@playwright/test";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { signInAs, waitForStillView } from "./helpers";
import { demoMicrographOptions, renderDemoMicrograph } from "../../server/images/demo-die";

// Each repetition of the suite on one server (--repeat-each) uploads a micrograph of its own.
const uploadLabel = () => `E2E upload 6000 px, run ${test.info().repeatEachIndex + 1}`;
const uploadedItem = (page: import("@playwright/test").Page) =>
  page.getByRole("list", { name: "Micrographs" }).getByRole("button", { name: new RegExp(`${uploadLabel()}\\b`) });

// The analyst uploads a rendered demo micrograph through the form, watches the upload and
// tiling progress, opens it, zooms, and the scale bar keeps a round length that matches the zoom.
test("the analyst uploads a micrograph, sees both progress bars, zooms, and the scale bar is right", async ({ page }) => {
  test.setTimeout(180_000);
  const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), "kerfline-e2e-upload-")), "nv24r-bf-6000.jpg");
  const render = await renderDemoMicrograph(file, demoMicrographOptions("bright_field", 6000));
  await signInAs(page, "analyst");
  await page.getByRole("link", { name: "NV-24R receiver teardown" }).click();
  await page.getByRole("link", { name: "NV-24R die A" }).click();
  await expect(page.getByRole("heading", { name: "NV-24R die A" })).toBeVisible();

  // Slow the upload down so its progress bar can be seen (Chromium's network emulation).
  const cdp = await page.context().newCDPSession(page);
  await cdp.send("Network.enable");
  await cdp.send("Network.emulateNetworkConditions", { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: 1.5 * 1024 * 1024 });

  await page.getByRole("tab", { name: "Die & micrographs" }).click();
  await page.getByRole("button", { name: "Upload micrograph" }).click();
  const dialog = page.getByRole("dialog", { name: "Upload a micrograph" });
  await dialog.getByLabel(/Micrograph file/).setInputFiles(file);
  await dialog.getByLabel("Label").fill(uploadLabel());
  await dialog.getByLabel("Objective magnification").fill("10");
  await dialog.getByLabel("Numerical aperture").fill("0.3");
  // 0.5 µm/px: this rendering is 6000 px wide, half the size of the seeded ones.
  await dialog.getByLabel("Or scale directly (µm per pixel)").fill(String(render.umPerPx));
  await dialog.getByRole("button", { name: "Upload" }).click();
  await expect(dialog.getByRole("progressbar", { name: "Upload progress" })).toBeVisible();
  await expect(dialog).toBeHidden({ timeout: 60_000 });
  await cdp.send("Network.emulateNetworkConditions", { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: -1 });

  const item = uploadedItem(page);
  // The tiling bar shows while the pyramid is built; on a quiet machine a 6000 px image can be
  // tiled before the list's first refresh, and then the item is simply ready.
  await expect(item.getByRole("progressbar", { name: /Tiling progress/ }).or(item.getByText("Ready"))).toBeVisible();
  await expect(item.getByText("Ready")).toBeVisible({ timeout: 90_000 });
  await item.click();

  const viewer = page.getByRole("application", { name: "Micrograph viewer" });
  await expect(viewer).toBeVisible();
  const bar = page.getByTestId("scale-bar");
  await expect(bar).toHaveAttribute("data-scale-set", "true");
  await page.getByRole("button", { name: "Fit die" }).click();
  await waitForStillView(page);

  // Independent of the viewer's own numbers: at "fit", the whole image fills the viewer's
  // limiting dimension, so µm per screen px = image extent in µm / viewer extent in px.
  const box = (await viewer.boundingBox())!;
  const imageAspect = render.widthPx / render.heightPx;
  const fitUmPerPx = box.width / box.height > imageAspect ? (render.heightPx * render.umPerPx) / box.height : (render.widthPx * render.umPerPx) / box.width;
  const read = async () => ({
    umPerScreenPx: Number(await bar.getAttribute("data-um-per-screen-px")),
    lengthUm: Number(await bar.getAttribute("data-length-um")),
    barPx: Number(await bar.getAttribute("data-bar-px")),
    label: (await page.getByTestId("scale-bar-label").textContent())!.trim(),
  });
  let s = await read();
  expect(s.umPerScreenPx / fitUmPerPx).toBeGreaterThan(0.99);
  expect(s.umPerScreenPx / fitUmPerPx).toBeLessThan(1.01);

  // Zoom in three steps of 1.5 with the keyboard: 3.375× finer.
  await viewer.focus();
  for (let i = 0; i < 3; i++) await page.keyboard.press("+");
  await waitForStillView(page);
  s = await read();
  const expected = fitUmPerPx / 1.5 ** 3;
  expect(Math.abs(s.umPerScreenPx / expected - 1)).toBeLessThan(0.01);
  // A round length (1, 2 or 5 × 10^n µm) whose bar is its length over the zoom, to a pixel.
  const mantissa = s.lengthUm / 10 ** Math.floor(Math.log10(s.lengthUm));
  expect([1, 2, 5]).toContain(Math.round(mantissa));
  expect(Math.abs(s.barPx - s.lengthUm / expected)).toBeLessThan(1);
  expect(s.label).toMatch(new RegExp(`^${s.lengthUm >= 1000 ? s.lengthUm / 1000 : s.lengthUm} ?(µm|mm)$`));
  const barBox = (await page.getByTestId("scale-bar-bar").boundingBox())!;
  expect(Math.abs(barBox.width - s.barPx)).toBeLessThan(1.5);
  await expect(page.getByTestId("cursor-readout")).toBeVisible();
});

// Two-point calibration on the micrograph the test above uploaded (0.5 µm/px): two clicks on
// the image, a known length typed, and the list shows the scale that length implies.
test("the analyst recalibrates a micrograph from two clicks and a known length; Esc cancels", async ({ page }) => {
  await signInAs(page, "analyst");
  await page.getByRole("link", { name: "NV-24R receiver teardown" }).click();
  await page.getByRole("link", { name: "NV-24R die A" }).click();
  await page.getByRole("tab", { name: "Die & micrographs" }).click();
  const item = uploadedItem(page);
  await item.click();
  const viewer = page.getByRole("application", { name: "Micrograph viewer" });
  await expect(viewer).toBeVisible();
  await page.getByRole("button", { name: "Fit die" }).click();
  await waitForStillView(page);

  await page.getByRole("button", { name: "Recalibrate scale" }).click();
  await expect(page.getByTestId("calibration-tool")).toBeVisible();
  await page.keyboard.press("Escape");
  await expect(page.getByTestId("calibration-tool")).toHaveCount(0);

  await page.getByRole("button", { name: "Recalibrate scale" }).click();
  await expect(page.getByText("Click one end of a feature of known length.")).toBeVisible();
  const box = (await viewer.boundingBox())!;
  await page.mouse.click(box.x + box.width * 0.3, box.y + box.height * 0.5);
  await expect(page.getByText("Click the other end.")).toBeVisible();
  await page.mouse.click(box.x + box.width * 0.6, box.y + box.height * 0.5);
  const form = page.getByRole("form", { name: "Two-point calibration" });
  await expect(form).toBeVisible();
  const distancePx = Number((await form.getByText(/ px$/).textContent())!.replace(" px", ""));
  // A click is a click: 30 % of the viewer's width at "fit" is about 30 % of the image's 6000 px.
  expect(distancePx).toBeGreaterThan(100);
  // Say the feature is 0.8 µm per image px long: the scale becomes 0.8 µm/px.
  await form.getByLabel("Known length (µm)").fill((distancePx * 0.8).toFixed(1));
  await form.getByRole("button", { name: "Set scale" }).click();
  await expect(page.getByTestId("calibration-tool")).toHaveCount(0);
  await expect(item).toContainText(/0\.8\d{3} µm\/px/);
});

test("the seeded demo micrographs are listed with illumination and scale, and a viewer sees no upload button", async ({ page }) => {
  await signInAs(page, "viewer");
  await page.getByRole("link", { name: "NV-24R receiver teardown" }).click();
  await page.getByRole("link", { name: "NV-24R die A" }).click();
  await page.getByRole("tab", { name: "Die & micrographs" }).click();
  const list = page.getByRole("list", { name: "Micrographs" });
  await expect(list.getByText(/NV-24R 10x bright field/)).toBeVisible();
  await expect(list.getByText(/Dark field · 12000×/)).toBeVisible();
  await expect(list.getByText(/0\.2500 µm\/px/)).toBeVisible();
  await expect(page.getByRole("button", { name: "Upload micrograph" })).toHaveCount(0);
  await expect(page.getByRole("button", { name: /Calibrate/ })).toHaveCount(0);
});
