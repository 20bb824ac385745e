import { expect, test } from "@playwright/test";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { signInAs } from "./helpers";
import { sparseTiff } from "../support/sparse-tiff";

// A dropped connection during a resumable (tus) upload: the dialog says it is resuming, sends on
// from the offset the server holds (tus 1.0.0 §HEAD, https://tus.io/protocols/resumable-upload),
// and the micrograph arrives.
const MIB = 1024 ** 2;
const label = () => `E2E resumed upload, run ${test.info().repeatEachIndex + 1}`;

test("a connection lost part way resumes from the server's offset and the micrograph arrives", async ({ page }) => {
  test.setTimeout(180_000);
  // 24 MiB: three 8 MiB PATCHes. A valid TIFF whose image is small, so tiling is quick.
  const tiff = sparseTiff(24 * MIB);
  const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), "kerfline-e2e-tus-")), "nv24r-df-mosaic.tif");
  fs.writeFileSync(file, tiff.slice(0, tiff.size));

  const patchOffsets: number[] = [];
  let cut = false;
  // The second PATCH is dropped as if the network went away; the HEAD that follows is held back
  // two seconds so the "resuming" state stays on screen long enough to be read.
  await page.route("**/api/uploads/*", async (route) => {
    const req = route.request();
    if (req.method() === "PATCH") {
      const offset = Number(req.headers()["upload-offset"]);
      patchOffsets.push(offset);
      if (!cut && offset > 0) {
        cut = true;
        return route.abort("connectionreset");
      }
    }
    if (req.method() === "HEAD" && cut) await new Promise((r) => setTimeout(r, 2000));
    return route.continue();
  });

  await signInAs(page, "analyst");
  await page.getByRole("link", { name: "NV-24R receiver teardown" }).click();
  await page.getByRole("link", { name: "NV-24R die A" }).click();
  await page.getByRole("tab", { name: "Die & micrographs" }).click();
  await page.getByRole("button", { name: "Upload micrograph" }).click();
  const dialog = page.getByRole("dialog", { name: "Upload a micrograph" });
  await dialog.getByLabel(/Micrograph file/).setInputFiles(file);
  await dialog.getByLabel("Label").fill(label());
  await dialog.getByLabel("Illumination").selectOption("dark_field");
  await dialog.getByRole("button", { name: "Upload" }).click();

  await expect(dialog.getByRole("status")).toContainText(/Connection lost — resuming from 33 %/);
  await expect(dialog.getByRole("progressbar", { name: "Upload progress" })).toBeVisible();
  await expect(dialog).toBeHidden({ timeout: 60_000 });
  // Resumed at 8 MiB (what the server held), not from the start: no byte of the first chunk twice.
  expect(patchOffsets).toEqual([0, 8 * MIB, 8 * MIB, 16 * MIB]);

  const item = page.getByRole("list", { name: "Micrographs" }).getByRole("button", { name: new RegExp(`${label()}\\b`) });
  await expect(item.getByText("Ready")).toBeVisible({ timeout: 90_000 });
});

test("closing the dialog part way and choosing the same file again resumes the earlier upload", async ({ page }) => {
  test.setTimeout(180_000);
  const tiff = sparseTiff(24 * MIB);
  const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), "kerfline-e2e-tus-")), "nv24r-bf-reopened.tif");
  fs.writeFileSync(file, tiff.slice(0, tiff.size));
  const name = `E2E reopened upload, run ${test.info().repeatEachIndex + 1}`;
  const patchOffsets: number[] = [];
  page.on("request", (r) => r.method() === "PATCH" && r.url().includes("/api/uploads/") && patchOffsets.push(Number(r.headers()["upload-offset"])));

  await signInAs(page, "analyst");
  await page.getByRole("link", { name: "NV-24R receiver teardown" }).click();
  await page.getByRole("link", { name: "NV-24R die A" }).click();
  await page.getByRole("tab", { name: "Die & micrographs" }).click();
  // Slow uploads (Chromium's network emulation) so the dialog can be closed part way.
  const cdp = await page.context().newCDPSession(page);
  await cdp.send("Network.enable");
  await cdp.send("Network.emulateNetworkConditions", { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: 4 * MIB });

  const dialog = page.getByRole("dialog", { name: "Upload a micrograph" });
  const start = async () => {
    await page.getByRole("button", { name: "Upload micrograph" }).click();
    await dialog.getByLabel(/Micrograph file/).setInputFiles(file);
    await dialog.getByLabel("Label").fill(name);
    await dialog.getByRole("button", { name: "Upload" }).click();
  };
  await start();
  // The first 8 MiB chunk is acknowledged (tus §PATCH: 204), then the dialog is closed.
  await page.waitForResponse((r) => r.request().method() === "PATCH" && r.status() === 204);
  await page.keyboard.press("Escape");
  await expect(dialog).toBeHidden();

  await cdp.send("Network.emulateNetworkConditions", { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: -1 });
  const before = patchOffsets.length;
  await start();
  await expect(dialog.getByRole("status")).toContainText("Resuming the earlier upload of this file");
  await expect(dialog).toBeHidden({ timeout: 60_000 });
  // The reopened upload went on from what the server held, not from byte 0.
  expect(patchOffsets[before]).toBeGreaterThanOrEqual(8 * MIB);
  const item = page.getByRole("list", { name: "Micrographs" }).getByRole("button", { name: new RegExp(`${name}\\b`) });
  await expect(item.getByText("Ready")).toBeVisible({ timeout: 90_000 });
});
