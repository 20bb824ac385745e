import { expect, test } from "@playwright/test";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { gotoLive, signInAs, waitForStillView } from "./helpers";
import { cutMosaic } from "../support/mosaic-frames";

const shots = "test-results/mosaic-shots";

// The analyst uploads a 3 × 3 mosaic through the dialog (frames cut by the test from a synthetic
// image at known offsets), watches the stages, opens the stitched micrograph, shows the frame
// outlines and the pair table, and draws a pad on it.
test("the analyst uploads a 3 × 3 mosaic, watches the stages, shows the frame outlines and draws a pad on it", async ({ page }) => {
  test.setTimeout(180_000);
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "kerfline-e2e-mosaic-"));
  // The overlap of frames 1 and 2 is made featureless (flat grey): that pair cannot register.
  const blank = { x: 290, y: 0, width: 130, height: 330 };
  const frames = await cutMosaic({ rows: 3, cols: 3, frameWidth: 400, frameHeight: 300, overlap: 0.25, jitter: 6, order: "serpentine", seed: 11, blank });
  // Named so that only a numeric sort puts them in capture order (frame-2 before frame-10).
  const files = frames.map((f) => {
    const p = path.join(dir, `frame-${[1, 2, 3, 4, 5, 6, 7, 8, 10][f.index]}.jpg`);
    fs.writeFileSync(p, f.bytes);
    return p;
  });

  await signInAs(page, "analyst");
  // A die of its own, so the mosaic is its first micrograph and defines the die frame.
  const dieId = await page.evaluate(async () => {
    const me = (await (await fetch("/api/me")).json()) as { teams: { id: string; name: string }[] };
    const team = me.teams.find((t) => t.name === "Fjordlight Failure Lab")!;
    const post = (url: string, body: unknown) =>
      fetch(url, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) }).then((r) => r.json());
    const c = (await post(`/api/teams/${team.id}/cases`, { title: `Mosaic case ${Date.now()}` })) as { id: string };
    const d = (await post(`/api/cases/${c.id}/dies`, { name: "Stitched die" })) as { id: string };
    return d.id;
  });
  await gotoLive(page, `/dies/${dieId}`);
  await page.getByRole("tab", { name: "Die & micrographs" }).click();
  await page.getByRole("button", { name: "Upload mosaic" }).click();
  const dialog = page.getByRole("dialog", { name: "Upload a mosaic" });
  await dialog.getByLabel("Mosaic frames", { exact: true }).setInputFiles([...files].reverse());
  const list = dialog.getByRole("list", { name: "Frames in capture order" });
  await expect(list.getByRole("listitem")).toHaveCount(9);
  await expect(list.getByRole("listitem").first()).toHaveAccessibleName("Frame 1: frame-1.jpg");
  await expect(list.getByRole("listitem").last()).toHaveAccessibleName("Frame 9: frame-10.jpg");
  // Reorder by keyboard and by button, back to the capture order.
  await list.getByRole("listitem").nth(1).focus();
  await page.keyboard.press("Alt+ArrowDown");
  await expect(list.getByRole("listitem").nth(2)).toHaveAccessibleName("Frame 3: frame-2.jpg");
  await dialog.getByRole("button", { name: "Move frame-2.jpg up" }).click();
  await expect(list.getByRole("listitem").nth(1)).toHaveAccessibleName("Frame 2: frame-2.jpg");

  await dialog.getByLabel("Rows", { exact: true }).fill("3");
  await dialog.getByLabel("Columns", { exact: true }).fill("3");
  await dialog.getByLabel("Capture order", { exact: true }).selectOption("serpentine");
  await dialog.getByLabel("Nominal overlap (%)", { exact: true }).fill("25");
  await dialog.getByLabel("Label", { exact: true }).fill("Mosaic 3 × 3 bright field");
  await dialog.getByLabel("Scale (µm per pixel)", { exact: true }).fill("0.2");
  await expect(dialog.getByRole("img", { name: /Capture path: 3 rows by 3 columns, serpentine/ })).toBeVisible();
  await expect(dialog.getByText("9 of 9 frames chosen")).toBeVisible();
  fs.mkdirSync(shots, { recursive: true });
  await dialog.screenshot({ path: `${shots}/1-dialog.png` });

  // Slow the upload so the per-frame progress shows (Chromium's network emulation).
  const cdp = await page.context().newCDPSession(page);
  await cdp.send("Network.enable");
  await cdp.send("Network.emulateNetworkConditions", { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: 200 * 1024 });
  await dialog.getByRole("button", { name: "Upload mosaic" }).click();
  await expect(dialog.getByRole("progressbar", { name: "Upload of frame 1" })).toBeVisible();
  await dialog.screenshot({ path: `${shots}/2-sending.png` });
  const stages = dialog.getByRole("list", { name: "Stitching stages" });
  await expect(stages).toBeVisible({ timeout: 60_000 });
  await cdp.send("Network.emulateNetworkConditions", { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: -1 });
  await dialog.screenshot({ path: `${shots}/3-stages.png` });
  // Done: the dialog closes and the mosaic is the shown micrograph.
  await expect(dialog).toBeHidden({ timeout: 120_000 });
  const item = page.getByRole("list", { name: "Micrographs" }).getByRole("button", { name: /Mosaic 3 × 3 bright field/ });
  await expect(item.getByText("Ready")).toBeVisible();

  const viewer = page.getByRole("application", { name: "Micrograph viewer" });
  await expect(viewer).toBeVisible();
  await page.getByRole("button", { name: "Fit die" }).click();
  await waitForStillView(page);
  await page.getByRole("checkbox", { name: "Frame outlines" }).check();
  const outlines = page.getByTestId("frame-outlines");
  await expect(outlines).toBeVisible();
  // A 3 × 3 grid has 12 neighbour pairs: 6 across, 6 down.
  await expect(outlines.locator("[data-pair]")).toHaveCount(12);
  // The blank pair is flagged in its own style, its peak in its title (shown on hover).
  const weak = outlines.locator('[data-weak="true"]');
  await expect(weak).toHaveCount(1);
  await expect(weak).toHaveAttribute("data-pair", "0-1");
  await expect(weak.locator("title")).toHaveText(/^Frames 1–2: peak \d\.\d{3}, weak — stage model used/);
  const mosaic = page.getByRole("region", { name: "Mosaic" });
  await expect(mosaic.getByRole("row")).toHaveCount(13);
  await expect(mosaic.getByText("One pair did not register and used the stage model.")).toBeVisible();
  await expect(mosaic.getByRole("row", { name: /1–2/ }).getByText("stage model")).toBeVisible();
  await page.screenshot({ path: `${shots}/4-outlines.png` });

  // Draw a pad in the middle of the stitched image.
  await page.getByRole("checkbox", { name: "Frame outlines" }).uncheck();
  const box = (await viewer.boundingBox())!;
  await page.getByRole("toolbar", { name: "Markup tools" }).getByRole("button", { name: /^Pad/ }).click();
  await page.mouse.move(box.x + box.width / 2 - 30, box.y + box.height / 2 - 20);
  await page.mouse.down();
  await page.mouse.move(box.x + box.width / 2 + 30, box.y + box.height / 2 + 20, { steps: 6 });
  await page.mouse.up();
  await expect(page.getByTestId("save-state")).toHaveAttribute("data-status", "saved");
  const shapes = await page.evaluate(async (id) => (await (await fetch(`/api/dies/${id}/markup`)).json()) as { kind: string }[], dieId);
  expect(shapes.map((s) => s.kind)).toEqual(["pad"]);
  await page.screenshot({ path: `${shots}/5-pad.png` });
});
