import { expect, test, type Page } from "@playwright/test";
import fs from "node:fs";
import { signIn, signInAs } from "./helpers";

// Hand-over in Chromium: the analyst exports an annotated PNG of a typed region and the PDF die
// report; a viewer can export too; an outsider gets 404 for that export's file.
async function openExportTab(page: Page, who: "analyst" | "viewer") {
  await signInAs(page, who);
  await page.getByRole("link", { name: "NV-24R receiver teardown" }).click();
  await page.getByRole("link", { name: "NV-24R die A" }).click();
  await page.getByRole("tab", { name: "Export" }).click();
  await expect(page.getByRole("button", { name: "Render PNG" })).toBeVisible({ timeout: 30_000 });
}

async function renderAndDownload(page: Page) {
  await page.getByRole("button", { name: "Render PNG" }).click();
  const link = page.getByTestId("export-status").getByRole("link", { name: /^Download / });
  await expect(link).toBeVisible({ timeout: 60_000 });
  const [download] = await Promise.all([page.waitForEvent("download"), link.click()]);
  const file = await download.path();
  const head = fs.readFileSync(file).subarray(0, 8);
  // PNG specification §5.2: every PNG starts with these eight bytes.
  expect([...head]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
  return { name: download.suggestedFilename(), href: (await link.getAttribute("href"))! };
}

let viewerExportFile = "";

test.describe.serial("hand-over exports", () => {
  test("the analyst exports a chosen region as an annotated PNG and downloads the PDF report", async ({ page }) => {
    await openExportTab(page, "analyst");
    await page.getByLabel("Rectangle (µm)").check();
    await page.getByLabel("Region x (µm)").fill("200");
    await page.getByLabel("Region y (µm)").fill("200");
    await page.getByLabel("Region width (µm)").fill("1200");
    await page.getByLabel("Region height (µm)").fill("900");
    await page.getByLabel("Output width (px)").fill("900");
    // The preview follows the form: final size by hand, 1200 µm over 900 px and 900 µm tall → 675 px.
    const preview = page.getByRole("figure", { name: "Export preview" });
    await expect(preview.getByTestId("export-preview-size")).toHaveText(/^900 × 675 px at 1\.33 µm\/px/, { timeout: 20_000 });
    const img = preview.getByRole("img", { name: "Preview of the annotated PNG" });
    await expect.poll(() => img.evaluate((el) => (el as HTMLImageElement).naturalWidth)).toBe(640);
    // A refused size shows the server's reason in the preview before anything is queued.
    await page.getByLabel("Output width (px)").fill("20000");
    await expect(preview.getByRole("alert")).toContainText("at most 16384");
    await page.getByLabel("Output width (px)").fill("900");
    await expect(preview.getByRole("alert")).toHaveCount(0);
    const { name } = await renderAndDownload(page);
    expect(name).toMatch(/^NV-24R-receiver-teardown-NV-24R-die-A-.+-\d{4}-\d{2}-\d{2}\.png$/);

    const [pdf] = await Promise.all([page.waitForEvent("download"), page.getByRole("link", { name: "Die report (PDF)" }).click()]);
    // ISO 32000-1 §7.5.2: the file header.
    expect(
      fs
        .readFileSync(await pdf.path())
        .subarray(0, 5)
        .toString("latin1"),
    ).toBe("%PDF-");
    expect(pdf.suggestedFilename()).toMatch(/report-\d{4}-\d{2}-\d{2}\.pdf$/);
  });

  test("a viewer can export the whole die", async ({ page }) => {
    await openExportTab(page, "viewer");
    await page.getByLabel("Output width (px)").fill("600");
    const { href } = await renderAndDownload(page);
    viewerExportFile = href;
  });

  test("an outsider gets 404 for that export's file", async ({ page }) => {
    expect(viewerExportFile).toMatch(/^\/api\/exports\/[0-9a-f-]{36}\/file$/);
    await signIn(page, "outsider@elsewhere.test");
    await expect(page.getByRole("heading", { name: "Cases" })).toBeVisible();
    expect((await page.request.get(viewerExportFile)).status()).toBe(404);
    expect((await page.request.get(viewerExportFile.replace(/\/file$/, ""))).status()).toBe(404);
  });
});
