import { expect, test, type Page } from "@playwright/test";
import { signInAs, waitForStillView } from "./helpers";
import { NV24R_LAYOUT, padByLabel } from "../../lib/demo-die/layout";
import { demoMicrographOptions } from "../../lib/demo-die/render";
import { placeDie, pxPerUmForWidth } from "../../lib/demo-die/placement";
import { applyAffine } from "../../lib/geometry/affine";

// The seeded bright-field micrograph's ground truth, from the renderer's own placement.
const opts = demoMicrographOptions("bright_field");
const placement = placeDie(NV24R_LAYOUT, { pxPerUm: pxPerUmForWidth(NV24R_LAYOUT, opts.widthPx!, 300), marginUm: 300 });

async function openDie(page: Page, who: "analyst" | "reviewer") {
  await signInAs(page, who);
  await page.getByRole("link", { name: "NV-24R receiver teardown" }).click();
  await page.getByRole("link", { name: "NV-24R die A" }).click();
  await expect(page.getByTestId("markup-overlay")).toBeVisible();
  await page.getByRole("button", { name: "Fit die" }).click();
  await waitForStillView(page);
}

/**
 * Screen position of a die point at the "fit" view, computed without the app: OpenSeadragon
 * centres the whole image and fits its limiting side, so image px map by one scale and offset.
 */
async function fitScreen(page: Page, [x, y]: readonly [number, number]) {
  const box = (await page.getByRole("application", { name: "Micrograph viewer" }).boundingBox())!;
  const s = Math.min(box.width / placement.widthPx, box.height / placement.heightPx);
  const [ix, iy] = applyAffine(placement.dieToImage, x, y);
  return { x: box.x + (box.width - placement.widthPx * s) / 2 + ix * s, y: box.y + (box.height - placement.heightPx * s) / 2 + iy * s, box };
}

const markup = (page: Page) => page.evaluate(async () => {
  const id = location.pathname.split("/").pop();
  return (await (await fetch(`/api/dies/${id}/markup`)).json()) as { id: string; kind: string; properties: Record<string, unknown>; geometry: { coordinates: unknown } }[];
});

// Shapes this suite creates on the shared demo die; removed at the end so later suites see the die as seeded.
let dieUrl = "";
let createdIds: string[] = [];

test.describe.serial("markup on the demo die", () => {
  test.afterAll(async ({ browser }) => {
    if (!dieUrl || createdIds.length === 0) return;
    const page = await browser.newPage();
    await signInAs(page, "analyst");
    await page.evaluate(async (ids) => {
      for (const id of ids) await fetch(`/api/markup/${id}`, { method: "DELETE" });
    }, createdIds);
    await page.close();
  });

  test("the analyst draws a pad, labels it, bonds it, adds a block and a ruler, undoes and redoes, reloads", async ({ page }) => {
    await openDie(page, "analyst");
    dieUrl = page.url();
    // Other suites share the demo die: only what this test adds is checked.
    const before = new Set((await markup(page)).map((s) => s.id));
    const mine = async () => (await markup(page)).filter((s) => !before.has(s.id));
    const vcc1 = padByLabel(NV24R_LAYOUT, "VCC1");
    const [cx, cy] = vcc1.centreUm;
    // Pad: drag over the VCC1 pad (its size from the layout), then label it VCC.
    await page.keyboard.press("p");
    const a = await fitScreen(page, [cx - vcc1.sizeUm[0] / 2, cy + vcc1.sizeUm[1] / 2]);
    const b = await fitScreen(page, [cx + vcc1.sizeUm[0] / 2, cy - vcc1.sizeUm[1] / 2]);
    await page.mouse.move(a.x, a.y);
    await page.mouse.down();
    await page.mouse.move(b.x, b.y, { steps: 6 });
    await page.mouse.up();
    const label = page.getByRole("region", { name: "Inspector" }).getByLabel("Label");
    await label.fill("VCC");
    await label.press("Enter");
    await page.getByRole("region", { name: "Inspector" }).getByLabel("Net").fill("VCC");
    await page.getByRole("region", { name: "Inspector" }).getByLabel("Net").press("Enter");
    await expect(page.getByTestId("save-state")).toHaveAttribute("data-status", "saved");

    // Wire bond from the pad outward, beyond the top edge of the die.
    // Focus is still in the inspector, so pick the tool on the tool bar (typing "w" would edit the field).
    const tools = page.getByRole("toolbar", { name: "Markup tools" });
    await tools.getByRole("button", { name: /^Wire bond/ }).click();
    const c = await fitScreen(page, [cx, cy]);
    const out = await fitScreen(page, [cx, cy + 250]);
    await page.mouse.move(c.x, c.y);
    await page.mouse.down();
    await page.mouse.move(out.x, out.y, { steps: 6 });
    await page.mouse.up();

    // A block around the LNA region: four corners and Enter.
    await tools.getByRole("button", { name: /^Block/ }).click();
    for (const p of [[200, 500], [700, 500], [700, 1100], [200, 1100]] as const) {
      const s = await fitScreen(page, p);
      await page.mouse.click(s.x, s.y);
    }
    await page.keyboard.press("Enter");

    // A ruler from the centre of VCC1 to the centre of VCC2: 1650 µm in the layout.
    const vcc2 = padByLabel(NV24R_LAYOUT, "VCC2").centreUm;
    const truth = Math.hypot(vcc2[0] - cx, vcc2[1] - cy);
    await tools.getByRole("button", { name: /^Ruler/ }).click();
    const r1 = await fitScreen(page, [cx, cy]);
    const r2 = await fitScreen(page, vcc2);
    await page.mouse.click(r1.x, r1.y);
    await page.mouse.dblclick(r2.x, r2.y);
    await expect(page.getByTestId("save-state")).toHaveAttribute("data-status", "saved");

    let shapes = await mine();
    createdIds = shapes.map((s) => s.id);
    expect(shapes.map((s) => s.kind).sort()).toEqual(["block", "pad", "ruler", "wire_bond"]);
    const pad = shapes.find((s) => s.kind === "pad")!;
    expect(pad.properties).toMatchObject({ label: "VCC", net: "VCC" });
    expect(shapes.find((s) => s.kind === "wire_bond")!.properties.padId).toBeTruthy();
    const ruler = shapes.find((s) => s.kind === "ruler")!.geometry.coordinates as [number, number][];
    const measured = ruler.slice(1).reduce((sum, p, i) => sum + Math.hypot(p[0] - ruler[i][0], p[1] - ruler[i][1]), 0);
    expect(Math.abs(measured / truth - 1)).toBeLessThan(0.01);

    // Undo the ruler and redo it.
    await page.keyboard.press("Control+z");
    await expect.poll(async () => (await mine()).length).toBe(3);
    await page.keyboard.press("Control+Shift+z");
    await expect.poll(async () => (await mine()).length).toBe(4);

    await page.reload();
    await expect(page.getByTestId("markup-overlay")).toBeVisible();
    await page.getByRole("tab", { name: "Markup" }).click();
    const table = page.getByRole("region", { name: "Markup table" });
    await expect(table.getByRole("textbox", { name: /Rename Pad VCC/ })).toBeVisible();
    await expect(table.getByRole("button", { name: "Ruler" })).toBeVisible();
    await expect(table.getByRole("button", { name: "Block" })).toBeVisible();
    await expect(table.getByRole("button", { name: "Wire bond" })).toBeVisible();
    await page.getByRole("tab", { name: "Pad table" }).click();
    await expect(page.getByRole("region", { name: "Pad table" }).getByRole("button", { name: "VCC" })).toBeVisible();
    shapes = await mine();
    expect(shapes).toHaveLength(4);
    createdIds = shapes.map((s) => s.id);
  });

  test("markup stays on the same image feature after zooming in about 8×", async ({ page }) => {
    await openDie(page, "analyst");
    const centre = padByLabel(NV24R_LAYOUT, "VB3").centreUm;
    const at = async () => {
      const m = JSON.parse((await page.getByTestId("markup-overlay").getAttribute("data-die-to-screen"))!) as [[number, number, number], [number, number, number]];
      const [x, y] = applyAffine(m, centre[0], centre[1]);
      const o = (await page.getByTestId("markup-overlay").boundingBox())!;
      return { x: o.x + x, y: o.y + y };
    };
    const fit = await fitScreen(page, centre);
    let got = await at();
    expect(Math.abs(got.x - fit.x)).toBeLessThan(1);
    expect(Math.abs(got.y - fit.y)).toBeLessThan(1);
    // Keyboard zoom steps of 1.5 about the view centre: after n steps a point sits n-fold
    // farther from the centre. Five steps give 7.6×, six give 11.4×.
    const viewer = page.getByRole("application", { name: "Micrograph viewer" });
    const cx = fit.box.x + fit.box.width / 2;
    const cy = fit.box.y + fit.box.height / 2;
    for (const [steps, total] of [[5, 5], [1, 6]] as const) {
      await viewer.focus();
      for (let i = 0; i < steps; i++) await page.keyboard.press("+");
      await waitForStillView(page);
      const k = 1.5 ** total;
      got = await at();
      // Only points inside the view are checked; VB3 may leave it at high zoom, so check the
      // view centre's die point instead when it does.
      const expected = { x: cx + (fit.x - cx) * k, y: cy + (fit.y - cy) * k };
      expect(Math.abs(got.x - expected.x)).toBeLessThan(1);
      expect(Math.abs(got.y - expected.y)).toBeLessThan(1);
    }
  });

  test("a reviewer sees the markup but no drawing tools", async ({ page }) => {
    await openDie(page, "reviewer");
    const tools = page.getByRole("toolbar", { name: "Markup tools" });
    await expect(tools.getByRole("button", { name: /^Select/ })).toBeVisible();
    await expect(tools.getByRole("button", { name: /^Pad/ })).toHaveCount(0);
    await expect(tools.getByRole("button", { name: /^Undo/ })).toHaveCount(0);
    const legend = page.getByRole("region", { name: "Layers and legend" });
    for (const kind of ["Pad", "Wire bond", "Block", "Ruler"]) await expect(legend.getByRole("listitem").filter({ hasText: kind }).first()).toContainText(/[1-9]/);
    await page.getByRole("tab", { name: "Markup" }).click();
    await expect(page.getByRole("region", { name: "Markup table" }).getByRole("textbox")).toHaveCount(0);
    await expect(page.getByRole("region", { name: "Markup table" }).getByText("VCC")).toBeVisible();
    await page.keyboard.press("p");
    expect(await page.getByTestId("markup-overlay").getAttribute("data-tool")).toBe("select");
  });
});
