import { execFileSync } from "node:child_process";
import fs from "node:fs";
import { expect, test, type Browser, type Page } from "@playwright/test";
import { closeExtraContexts, signInAs, gotoLive } from "./helpers";

// Sign-off that holds, in Chromium: the analyst sends a die to the checker, the reviewer
// raises a remark and returns it, the analyst fixes and sends it again, the reviewer closes the
// remark and signs off; the tools show disabled with the reason while checked and signed off;
// the analyst opens revision 2; the PDF (read back by pdftotext) and the PNG (its text chunk)
// state the revision.
const run = () => `run ${test.info().repeatEachIndex + 1}`;
const CHECK_TAB = "Check & remarks";

async function as(browser: Browser, who: "analyst" | "reviewer") {
  const page = await (await browser.newContext({ viewport: { width: 1400, height: 900 } })).newPage();
  await signInAs(page, who);
  return page;
}

async function api<T>(page: Page, method: string, path: string, body?: unknown): Promise<{ status: number; body: T }> {
  return page.evaluate(
    async ({ method, path, body }) => {
      const r = await fetch(path, { method, headers: body ? { "content-type": "application/json" } : {}, body: body ? JSON.stringify(body) : undefined });
      return { status: r.status, body: r.status === 204 ? null : await r.json() };
    },
    { method, path, body },
  ) as Promise<{ status: number; body: T }>;
}

async function openCheck(page: Page, dieId: string, load = true) {
  if (load) await gotoLive(page, `/dies/${dieId}`);
  await page.getByRole("tab", { name: CHECK_TAB }).click();
  return page.getByRole("region", { name: "Check status" });
}

/** The report as text, read back by pdftotext (poppler), an independent PDF reader. */
async function reportText(page: Page, dieId: string): Promise<string> {
  const res = await page.request.get(`/api/dies/${dieId}/report.pdf`);
  expect(res.status()).toBe(200);
  const file = test.info().outputPath(`report-${Date.now()}.pdf`);
  fs.writeFileSync(file, await res.body());
  return execFileSync("pdftotext", ["-enc", "UTF-8", file, "-"], { encoding: "utf8" }).replace(/\s+/g, " ");
}

/** The tEXt/iTXt chunks of a PNG (PNG specification §11.3.3), keyword → text. */
function pngText(png: Buffer): Record<string, string> {
  const out: Record<string, string> = {};
  for (let at = 8; at < png.length;) {
    const length = png.readUInt32BE(at);
    const type = png.toString("latin1", at + 4, at + 8);
    const data = png.subarray(at + 8, at + 8 + length);
    const nul = data.indexOf(0);
    if (type === "tEXt") out[data.toString("latin1", 0, nul)] = data.toString("latin1", nul + 1);
    if (type === "iTXt") {
      // keyword NUL, compression flag, method, language NUL, translated keyword NUL, text
      let p = nul + 3;
      p = data.indexOf(0, p) + 1;
      p = data.indexOf(0, p) + 1;
      out[data.toString("latin1", 0, nul)] = data.toString("utf8", p);
    }
    at += 12 + length;
  }
  return out;
}

test.describe.serial("sign-off that holds", () => {
  test.afterEach(closeExtraContexts);

  test("send, remark, return, fix, send, close the remark, sign off, tools fixed, revision 2, the PDF states it", async ({ browser }) => {
    test.setTimeout(240_000);
    const analyst = await as(browser, "analyst");
    await analyst.getByRole("link", { name: "NV-24R receiver teardown" }).click();
    await analyst.waitForURL(/\/cases\/[0-9a-f-]{36}$/);
    const caseId = analyst.url().split("/").pop()!;
    const made = await api<{ id: string }>(analyst, "POST", `/api/cases/${caseId}/dies`, {
      name: `NV-24R die for sign-off ${run()}`,
      widthUm: 2400,
      heightUm: 1600,
    });
    expect(made.status, JSON.stringify(made.body)).toBe(201);
    const dieId = made.body.id;
    const ring = [
      [100, 100],
      [180, 100],
      [180, 180],
      [100, 180],
      [100, 100],
    ];
    const pad = await api<{ id: string }>(analyst, "POST", `/api/dies/${dieId}/markup`, {
      kind: "pad",
      geometry: { type: "Polygon", coordinates: [ring] },
      properties: { label: "P1" },
    });
    expect(pad.status, JSON.stringify(pad.body)).toBe(201);

    // The analyst sends it: the drawing tools stay in view, disabled, with the reason.
    let check = await openCheck(analyst, dieId);
    await check.getByLabel("Message").fill("Pad map ready.");
    await analyst.getByRole("button", { name: "Send to checker" }).click();
    await expect(check.getByText("With checker").first()).toBeVisible();
    const tools = analyst.getByRole("toolbar", { name: "Markup tools" });
    await expect(tools.getByRole("button", { name: /^Pad/ })).toBeDisabled();
    await expect(analyst.getByTestId("markup-lock")).toHaveText(/with the checker/);

    // The reviewer picks the pad in the markup table (the die has no photo yet), raises a
    // remark on it and returns the die.
    const reviewer = await as(browser, "reviewer");
    await gotoLive(reviewer, `/dies/${dieId}`);
    await reviewer.getByRole("tab", { name: "Markup" }).click();
    await reviewer.getByRole("region", { name: "Markup table" }).getByRole("button", { name: "Pad", exact: true }).click();
    check = await openCheck(reviewer, dieId, false);
    await reviewer.getByRole("button", { name: "Raise remark on selection" }).click();
    const remarkText = `Pad has no label (${run()}).`;
    await reviewer.getByLabel("Remark on the selected shape").fill(remarkText);
    await reviewer.getByRole("button", { name: "Raise remark", exact: true }).click();
    await expect(reviewer.getByRole("heading", { name: /Remark \d+ on a shape/ })).toBeVisible();
    await reviewer.getByRole("button", { name: "← All remarks" }).click();
    await check.getByLabel("Message").fill("One remark on the pad labels.");
    await reviewer.getByRole("button", { name: "Return with remarks" }).click();
    await expect(check.getByText("Returned with remarks").first()).toBeVisible();

    // The analyst may draw again, fixes the label and sends it back.
    check = await openCheck(analyst, dieId);
    await expect(tools.getByRole("button", { name: /^Pad/ })).toBeEnabled();
    await expect(analyst.getByTestId("markup-lock")).toHaveCount(0);
    const fixed = await api(analyst, "PATCH", `/api/markup/${pad.body.id}`, { version: 1, properties: { label: "VB1" } });
    expect(fixed.status).toBe(200);
    await check.getByLabel("Message").fill("Label added.");
    await analyst.getByRole("button", { name: "Send to checker" }).click();
    await expect(check.getByText("With checker").first()).toBeVisible();

    // The reviewer closes the remark and signs off.
    check = await openCheck(reviewer, dieId);
    await reviewer.getByText(remarkText).first().click();
    await reviewer.getByRole("button", { name: "Close remark" }).click();
    await expect(reviewer.getByText(/Closed by Demo Reviewer/)).toBeVisible();
    await reviewer.getByRole("button", { name: "← All remarks" }).click();
    await check.getByLabel("Message").fill("Checked against the bond diagram.");
    await reviewer.getByRole("button", { name: "Sign off" }).click();
    await expect(check.getByText("Signed off").first()).toBeVisible();

    // Signed off: the tools say why they are off; revision 1 is listed with who, when and its hash.
    check = await openCheck(analyst, dieId);
    await expect(analyst.getByTestId("markup-lock")).toHaveText(/signed off/);
    await expect(tools.getByRole("button", { name: /^Pad/ })).toBeDisabled();
    const revisions = analyst.getByRole("region", { name: "Revisions" });
    await expect(revisions.getByText(/Revision 1 · Signed off by Demo Reviewer/)).toBeVisible();
    await expect(revisions.getByText(/SHA-256 [0-9a-f]{64}/)).toBeVisible();
    expect(await reportText(analyst, dieId)).toContain("Revision 1 · signed off by Demo Reviewer");

    // Revision 2 opens in draft with the markup carried forward, and the report says so.
    await analyst.getByRole("button", { name: "Open revision 2" }).click();
    await expect(check.getByRole("heading", { name: "Check · revision 2" })).toBeVisible();
    await expect(tools.getByRole("button", { name: /^Pad/ })).toBeEnabled();
    await expect(revisions.getByText(/Revision 2 · Draft · 1 shapes/)).toBeVisible();
    expect(await reportText(analyst, dieId)).toContain("Revision 2 · draft, not signed off");
    expect((await api(analyst, "DELETE", `/api/dies/${dieId}`)).status).toBe(204);
  });

  test("die B of the demo is signed off as revision 1, and its PNG export says so", async ({ page }) => {
    test.setTimeout(180_000);
    await signInAs(page, "viewer");
    await page.getByRole("link", { name: "NV-24R receiver teardown" }).click();
    await page.getByRole("link", { name: "NV-24R die B" }).click();
    await expect(page.locator("header").getByText("Signed off")).toBeVisible();
    await page.getByRole("tab", { name: "Export" }).click();
    await page.getByRole("button", { name: "Render PNG" }).click({ timeout: 60_000 });
    const link = page.getByTestId("export-status").getByRole("link", { name: /^Download / });
    await expect(link).toBeVisible({ timeout: 120_000 });
    const [download] = await Promise.all([page.waitForEvent("download"), link.click()]);
    const text = pngText(fs.readFileSync(await download.path()));
    expect(text.Revision).toMatch(/^Revision 1 · signed off by Demo Reviewer, \d{4}-\d\d-\d\d \d\d:\d\d UTC$/);
  });
});
