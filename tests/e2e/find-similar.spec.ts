import { expect, test, type Page } from "@playwright/test";
import { signInAs, waitForStillView } from "./helpers";
import { NV24R_LAYOUT, padByLabel } from "../../lib/demo-die/layout";
import { demoMicrographOptions } from "../../server/images/demo-die";
import { placeDie, pxPerUmForWidth } from "../../lib/demo-die/placement";
import { applyAffine } from "../../lib/geometry/affine";

// The seeded die A's bright-field micrograph and its ground truth, from the renderer's own
// placement (lib/demo-die/placement.ts) and the layout (lib/demo-die/layout.ts): 22 pads, 18
// bonded (a ball on each), 3 probed and 1 open (no ball).
const opts = demoMicrographOptions("bright_field");
const placement = placeDie(NV24R_LAYOUT, { pxPerUm: pxPerUmForWidth(NV24R_LAYOUT, opts.widthPx!, 300), marginUm: 300 });
const shots = "test-results/find-similar-shots";

/** Screen position of a die point at the "fit" view: OpenSeadragon centres the image and fits its limiting side. */
async function fitScreen(page: Page, [x, y]: readonly [number, number]) {
  const box = (await page.getByRole("application", { name: "Micrograph viewer" }).boundingBox())!;
  const s = Math.min(box.width / placement.widthPx, box.height / placement.heightPx);
  const [ix, iy] = applyAffine(placement.dieToImage, x, y);
  return { x: box.x + (box.width - placement.widthPx * s) / 2 + ix * s, y: box.y + (box.height - placement.heightPx * s) / 2 + iy * s };
}

type Shape = { id: string; kind: string };
const dieId = (page: Page) => page.url().split("/").pop()!.split("?")[0];
const markup = (page: Page) => page.evaluate(async (id) => (await (await fetch(`/api/dies/${id}/markup`)).json()) as Shape[], dieId(page));

/** Drags a pad over a layout pad with the Pad tool (P); it is selected afterwards. */
async function markPad(page: Page, label: string) {
  const pad = padByLabel(NV24R_LAYOUT, label);
  const [cx, cy] = pad.centreUm;
  await page.keyboard.press("p");
  const a = await fitScreen(page, [cx - pad.sizeUm[0] / 2, cy + pad.sizeUm[1] / 2]);
  const b = await fitScreen(page, [cx + pad.sizeUm[0] / 2, cy - pad.sizeUm[1] / 2]);
  await page.mouse.move(a.x, a.y);
  await page.mouse.down();
  await page.mouse.move(b.x, b.y, { steps: 6 });
  await page.mouse.up();
  await expect(page.getByTestId("save-state")).toHaveAttribute("data-status", "saved");
}

let createdIds: string[] = [];
let known = new Set<string>();

test.describe.serial("find similar on the demo die", () => {
  // The demo die is shared with other suites: what this one adds is removed at the end.
  test.afterAll(async ({ browser }) => {
    if (createdIds.length === 0) return;
    const page = await browser.newPage();
    await signInAs(page, "analyst");
    await page.evaluate(async (ids) => {
      for (const id of ids) await fetch(`/api/markup/${id}`, { method: "DELETE" });
    }, createdIds);
    await page.close();
  });

  test("the analyst marks one bonded and one open pad, finds the others, keeps them, and the pad table numbers all 22 counter-clockwise", async ({ page }) => {
    test.setTimeout(420_000);
    await signInAs(page, "analyst");
    await page.getByRole("link", { name: "NV-24R receiver teardown" }).click();
    await page.getByRole("link", { name: "NV-24R die A" }).click();
    await expect(page.getByTestId("markup-overlay")).toBeVisible();
    await page.getByRole("button", { name: "Fit die" }).click();
    await waitForStillView(page);
    // The seed tiles die A's micrographs in the background: a search waits for them as a person would.
    await expect
      .poll(
        () =>
          page.evaluate(
            async (id) => ((await (await fetch(`/api/dies/${id}/micrographs`)).json()) as { status: string }[]).every((m) => m.status === "ready"),
            dieId(page),
          ),
        { timeout: 240_000 },
      )
      .toBe(true);
    known = new Set((await markup(page)).map((s) => s.id));
    const mine = async () => (await markup(page)).filter((s) => !known.has(s.id));
    const panel = page.getByRole("region", { name: "Find similar" });
    const count = panel.getByTestId("similar-count");

    // 1. A bonded pad (VCC1), then Find similar from the Selection tab.
    await markPad(page, "VCC1");
    await page.getByRole("button", { name: "Find similar" }).click();
    await expect(panel.getByRole("progressbar", { name: "Search progress" })).toBeVisible();
    await expect(count).toContainText(/\d+ found, \d+ kept/, { timeout: 300_000 });
    await page.screenshot({ path: `${shots}/1-bonded-candidates.png` });
    // The slider filters live: at its top nothing of a rendered image reaches 0.99 … or only a few do.
    const slider = panel.getByRole("slider", { name: "Lowest score shown" });
    const shownAt = async () => Number((/^(\d+) found/.exec((await count.textContent()) ?? "") ?? [0, 0])[1]);
    const atStart = await shownAt();
    await slider.fill("0.99");
    await expect(panel.getByText(/Score ≥ 0\.99/)).toBeVisible();
    expect(await shownAt()).toBeLessThanOrEqual(atStart);
    await slider.fill("0.7");
    await expect(count).toHaveText(`${atStart} found, ${atStart} kept`);
    // The 17 other bonded pads of the layout.
    expect(atStart).toBe(17);
    // A click on a candidate drops it, a second keeps it again.
    const vcc2 = await fitScreen(page, padByLabel(NV24R_LAYOUT, "VCC2").centreUm);
    await page.mouse.click(vcc2.x, vcc2.y);
    await expect(count).toHaveText(`17 found, 16 kept`);
    await page.screenshot({ path: `${shots}/2-one-dropped.png` });
    await page.mouse.click(vcc2.x, vcc2.y);
    await expect(count).toHaveText(`17 found, 17 kept`);
    await panel.getByRole("button", { name: "Add 17" }).click();
    await expect(panel).toBeHidden();
    await expect(page.getByTestId("save-state")).toHaveAttribute("data-status", "saved");
    await expect.poll(async () => (await mine()).filter((s) => s.kind === "pad").length).toBe(18);
    createdIds = (await mine()).map((s) => s.id);
    await page.screenshot({ path: `${shots}/3-after-add.png` });

    // One undo takes the 17 back, redo brings them again.
    const tools = page.getByRole("toolbar", { name: "Markup tools" });
    await tools.getByRole("button", { name: "Undo" }).click();
    await expect.poll(async () => (await mine()).length).toBe(1);
    await tools.getByRole("button", { name: "Redo" }).click();
    await expect.poll(async () => (await mine()).length).toBe(18);
    await expect(page.getByTestId("save-state")).toHaveAttribute("data-status", "saved");
    createdIds = (await mine()).map((s) => s.id);

    // 2. The open pad (NC1, no ball), searched with the L key; Escape ends a search, L starts it again.
    await page.keyboard.press("Escape");
    await markPad(page, "NC1");
    createdIds = (await mine()).map((s) => s.id);
    await page.keyboard.press("l");
    await expect(panel).toBeVisible();
    await page.keyboard.press("Escape");
    await expect(panel).toBeHidden();
    const nc1 = await fitScreen(page, padByLabel(NV24R_LAYOUT, "NC1").centreUm);
    await page.keyboard.press("s");
    await page.mouse.click(nc1.x, nc1.y);
    await page.keyboard.press("l");
    await expect(count).toContainText(/found|No similar shapes/, { timeout: 300_000 });
    await page.screenshot({ path: `${shots}/4-open-candidates.png` });
    // The three probed pads carry no ball either: the others of this look.
    await expect(count).toHaveText("3 found, 3 kept");
    await panel.getByRole("button", { name: "Add 3" }).click();
    await expect(page.getByTestId("save-state")).toHaveAttribute("data-status", "saved");
    await expect.poll(async () => (await mine()).filter((s) => s.kind === "pad").length).toBe(22);
    createdIds = (await mine()).map((s) => s.id);

    // 3. The pad table: 22 pads, numbered counter-clockwise from pad 1 (by default the topmost on
    // the left edge, G1). Expected order from geometry alone: angle about the die centre, increasing.
    await page.getByRole("tab", { name: "Pad table" }).click();
    const table = page.getByRole("region", { name: "Pad table" });
    await expect(table).toContainText("22 pads");
    await expect(table.locator("tbody tr")).toHaveCount(22);
    await page.screenshot({ path: `${shots}/5-pad-table.png` });
    const rows = await page.evaluate(
      async (id) => ((await (await fetch(`/api/dies/${id}/pads`)).json()) as { rows: { number: number; xUm: number; yUm: number }[] }).rows,
      dieId(page),
    );
    const [w, h] = NV24R_LAYOUT.dieSizeUm;
    const angle = ([x, y]: readonly [number, number]) => Math.atan2(y - h / 2, x - w / 2);
    const g1 = angle(padByLabel(NV24R_LAYOUT, "G1").centreUm);
    const turn = (p: readonly [number, number]) => (angle(p) - g1 + 4 * Math.PI) % (2 * Math.PI);
    const expected = [...NV24R_LAYOUT.pads].sort((a, b) => turn(a.centreUm) - turn(b.centreUm));
    expect(rows.map((r) => r.number)).toEqual(expected.map((_, i) => i + 1));
    rows.forEach((r, i) => expect(Math.hypot(r.xUm - expected[i].centreUm[0], r.yUm - expected[i].centreUm[1]), `pad ${r.number}`).toBeLessThan(3));
  });

  test("on the die outline tool, Detect edge proposes the outline dashed, for the re-framing dialog", async ({ page }) => {
    await signInAs(page, "analyst");
    await page.getByRole("link", { name: "NV-24R receiver teardown" }).click();
    await page.getByRole("link", { name: "NV-24R die A" }).click();
    await expect(page.getByTestId("markup-overlay")).toBeVisible();
    await page.getByRole("button", { name: "Fit die" }).click();
    await waitForStillView(page);
    await page.keyboard.press("o");
    await page.getByRole("region", { name: "Die edge" }).getByRole("button", { name: "Detect edge" }).click();
    const dialog = page.getByRole("dialog", { name: "Set the die frame from this outline?" });
    await expect(dialog).toBeVisible({ timeout: 60_000 });
    // The layout's outline is 2400 × 1600 µm; the proposal is within 5 µm of it.
    await expect(dialog.getByTestId("reframe-effect")).toContainText(/The die size becomes 2\d{3}\.\d × 1\d{3}\.\d µm/);
    const size = /becomes ([\d.]+) × ([\d.]+) µm/.exec((await dialog.getByTestId("reframe-effect").textContent()) ?? "")!;
    expect(Math.abs(Number(size[1]) - 2400)).toBeLessThanOrEqual(10);
    expect(Math.abs(Number(size[2]) - 1600)).toBeLessThanOrEqual(10);
    await page.screenshot({ path: `${shots}/6-edge-proposal.png` });
    // Cancel leaves the die frame as it was: nothing was created.
    await dialog.getByRole("button", { name: "Cancel" }).click();
    await expect(dialog).toBeHidden();
    await expect(page.getByRole("region", { name: "Die edge" }).getByRole("status")).toContainText(/confidence (0\.\d\d|1\.00)/);
    expect((await markup(page)).some((s) => s.kind === "die_outline")).toBe(false);
  });
});
