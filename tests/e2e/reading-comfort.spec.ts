import { expect, test, type Page } from "@playwright/test";
import fs from "node:fs";
import { signInAs, waitForStillView, gotoLive } from "./helpers";
import { NV24R_LAYOUT } from "../../lib/demo-die/layout";

// Deep links without hydration errors, the resizable side panel and its tables, the readable
// keyboard sheet, the upload dialog's hints, going into a new case, and the unsaved-work guard.
const SHOTS = process.env.KERFLINE_E2E_SHOTS; // a folder for screenshots to look at, when set
const shot = async (page: Page, name: string) => {
  if (SHOTS) await page.screenshot({ path: `${SHOTS}/${name}.png` });
};

async function openDemoDie(page: Page) {
  await signInAs(page, "analyst");
  await page.getByRole("link", { name: "NV-24R receiver teardown" }).click();
  await page.getByRole("link", { name: "NV-24R die A" }).click();
  await expect(page.getByTestId("markup-overlay")).toBeVisible({ timeout: 30_000 });
}

type Shape = { kind: string; geometry: unknown; properties: Record<string, unknown> };
const square = (cx: number, cy: number, w: number, h: number) => ({
  type: "Polygon",
  coordinates: [
    [
      [cx - w / 2, cy - h / 2],
      [cx + w / 2, cy - h / 2],
      [cx + w / 2, cy + h / 2],
      [cx - w / 2, cy + h / 2],
      [cx - w / 2, cy - h / 2],
    ],
  ],
});
/** The demo die's pads and bonds as markup, a ruler and a long note (from the invented layout). */
const demoShapes = (): Shape[] => [
  ...NV24R_LAYOUT.pads.map((p) => ({
    kind: "pad",
    geometry: square(p.centreUm[0], p.centreUm[1], p.sizeUm[0], p.sizeUm[1]),
    properties: { label: p.label, net: p.net, state: p.state },
  })),
  ...NV24R_LAYOUT.wireBonds.map((w) => ({ kind: "wire_bond", geometry: { type: "LineString", coordinates: [w.fromUm, w.toUm] }, properties: { label: "" } })),
  {
    kind: "ruler",
    geometry: {
      type: "LineString",
      coordinates: [
        [350, 1530],
        [2000, 1530],
      ],
    },
    properties: { label: "VCC1 to VCC2" },
  },
  {
    kind: "note",
    geometry: { type: "Point", coordinates: [1200, 1150] },
    properties: { text: "Mixer core: the two halves look identical under bright field; compare the dark-field frame before calling the layout symmetric." },
  },
];

/** Adds shapes to the die the page shows; returns their ids (for removing them afterwards). */
const addShapes = (page: Page, dieId: string, shapes: Shape[]) =>
  page.evaluate(
    async ([id, body]) => {
      const res = await fetch(`/api/dies/${id}/markup`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
      if (res.status !== 201) throw new Error(`markup answered ${res.status}`);
      return ((await res.json()) as { id: string }[]).map((x) => x.id);
    },
    [dieId, shapes] as const,
  );
const removeShapes = (page: Page, ids: string[]) =>
  page.evaluate(async (list) => {
    for (const id of list) await fetch(`/api/markup/${id}`, { method: "DELETE" });
  }, ids);
const dieIdOf = (page: Page) => new URL(page.url()).pathname.split("/").pop()!;

/** Page errors and console errors (React reports a hydration mismatch as both). */
function collectErrors(page: Page): string[] {
  const errors: string[] = [];
  page.on("pageerror", (e) => errors.push(`pageerror: ${e.message}`));
  page.on("console", (m) => {
    if (m.type() === "error") errors.push(`console: ${m.text()}`);
  });
  return errors;
}

/** Whether leaving the page now would ask first: a cancelable beforeunload some listener cancels. */
const wouldAsk = (page: Page) =>
  page.evaluate(() => {
    const e = new Event("beforeunload", { cancelable: true });
    window.dispatchEvent(e);
    return e.defaultPrevented;
  });

test("a link to a remark opens it without a hydration error", async ({ page }) => {
  await signInAs(page, "analyst");
  // A die of its own, so the shared demo die keeps its remarks as seeded.
  const { dieId, threadId } = await page.evaluate(async () => {
    const post = async (path: string, body: unknown) =>
      (await (await fetch(path, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) })).json()) as { id: string };
    const me = (await (await fetch("/api/me")).json()) as { teams: { id: string; name: string }[] };
    const team = me.teams.find((t) => t.name === "Fjordlight Failure Lab")!;
    const c = await post(`/api/teams/${team.id}/cases`, {
      title: `Deep link ${Date.now().toString(36)}`,
      partMarking: "NV-24R",
      package: "QFN-24",
      sampleId: "S-9",
      notes: "",
    });
    const d = await post(`/api/cases/${c.id}/dies`, { name: "NV-24R die L", widthUm: 2400, heightUm: 1600, notes: "" });
    const t = await post(`/api/dies/${d.id}/threads`, {
      region: {
        type: "Polygon",
        coordinates: [
          [
            [900, 700],
            [1000, 700],
            [1000, 800],
            [900, 800],
            [900, 700],
          ],
        ],
      },
      body: "Deep-link check: is the mixer core symmetric?",
    });
    return { dieId: d.id, threadId: t.id };
  });
  const errors = collectErrors(page);
  for (let i = 0; i < 2; i++) {
    await gotoLive(page, `/dies/${dieId}?thread=${threadId}`);
    await expect(page.getByText("Deep-link check: is the mixer core symmetric?")).toBeVisible({ timeout: 30_000 });
    // This die has no micrograph, so no viewer to wait for: wait for the page's requests instead.
    await page.waitForLoadState("networkidle");
  }
  expect(errors.filter((e) => /hydrat|#418|did not match/i.test(e))).toEqual([]);
  expect(errors.filter((e) => e.startsWith("pageerror"))).toEqual([]);
  await shot(page, "thread-deep-link");
});

test("the side panel resizes by dragging, is remembered, and its tables scroll with the first column kept", async ({ page }) => {
  await page.setViewportSize({ width: 1600, height: 900 });
  await openDemoDie(page);
  const ids = await addShapes(page, dieIdOf(page), demoShapes());
  await page.evaluate(() => localStorage.removeItem("kerfline.side-panel-width"));
  await page.reload();
  await expect(page.getByTestId("markup-overlay")).toBeVisible({ timeout: 30_000 });
  const panel = page.getByRole("complementary", { name: "Die panel" });
  const handle = page.getByRole("separator", { name: "Side panel width" });
  expect(Math.round((await panel.boundingBox())!.width)).toBe(384);

  // At the default width the pad table is wider than the panel: it scrolls, its first column sticks.
  await page.getByRole("tab", { name: "Pad table" }).click();
  const table = panel.getByTestId("scrolling-table");
  await expect(table).toBeVisible();
  const widths = await table.evaluate((el) => ({ scroll: el.scrollWidth, client: el.clientWidth }));
  expect(widths.scroll).toBeGreaterThan(widths.client);
  const firstCell = table.locator("tbody tr").first().locator("td").first();
  expect(await firstCell.evaluate((el) => getComputedStyle(el).position)).toBe("sticky");
  const before = (await firstCell.boundingBox())!.x;
  await table.evaluate((el) => el.scrollBy({ left: 200 }));
  expect(Math.abs((await firstCell.boundingBox())!.x - before)).toBeLessThan(1);
  await shot(page, "pad-table-narrow");

  // Drag the handle 300 px to the left: the panel grows by 300 px.
  const h = (await handle.boundingBox())!;
  await page.mouse.move(h.x + h.width / 2, h.y + h.height / 2);
  await page.mouse.down();
  await page.mouse.move(h.x + h.width / 2 - 300, h.y + h.height / 2, { steps: 8 });
  await page.mouse.up();
  await expect.poll(async () => Math.round((await panel.boundingBox())!.width)).toBe(684);
  await shot(page, "pad-table-wide");
  // The keyboard works too: ← widens by 16 px.
  await handle.focus();
  await page.keyboard.press("ArrowLeft");
  await expect.poll(async () => Math.round((await panel.boundingBox())!.width)).toBe(700);
  // Remembered across a reload.
  await page.reload();
  await expect(page.getByTestId("markup-overlay")).toBeVisible({ timeout: 30_000 });
  await expect.poll(async () => Math.round((await panel.boundingBox())!.width)).toBe(700);
  await page.getByRole("tab", { name: "Markup" }).click();
  await shot(page, "markup-table-wide");
  await page.getByRole("tab", { name: "Symmetry" }).click();
  await shot(page, "symmetry-wide");
  await page.evaluate(() => localStorage.removeItem("kerfline.side-panel-width"));
  await removeShapes(page, ids);
});

test("the keyboard help sheet is wide enough to read", async ({ page }) => {
  await openDemoDie(page);
  await page.getByTestId("markup-overlay").click({ position: { x: 5, y: 5 } });
  await page.keyboard.press("Escape");
  await page.keyboard.press("?");
  const sheet = page.getByRole("dialog", { name: "Keyboard and mouse" });
  await expect(sheet).toBeVisible();
  expect((await sheet.boundingBox())!.width).toBeGreaterThanOrEqual(700);
  // Every description sits on a line of at least 25 em beside its keys.
  const narrowest = await sheet
    .locator("dd")
    .evaluateAll((els) => Math.min(...els.map((e) => e.getBoundingClientRect().width / parseFloat(getComputedStyle(e).fontSize))));
  expect(narrowest).toBeGreaterThanOrEqual(25);
  await shot(page, "help-sheet");
});

test("a half-drawn block and an uncommitted edit of a selected shape make a reload ask first", async ({ page }) => {
  await openDemoDie(page);
  const ids = await addShapes(page, dieIdOf(page), demoShapes().slice(0, 3));
  await page.reload();
  await expect(page.getByTestId("markup-overlay")).toBeVisible({ timeout: 30_000 });
  await page.getByRole("button", { name: "Fit die" }).click();
  await waitForStillView(page);
  expect(await wouldAsk(page)).toBe(false);
  const box = (await page.getByRole("application", { name: "Micrograph viewer" }).boundingBox())!;
  await page
    .getByRole("toolbar", { name: "Markup tools" })
    .getByRole("button", { name: /^Block/ })
    .click();
  await page.mouse.click(box.x + box.width * 0.4, box.y + box.height * 0.4);
  await page.mouse.click(box.x + box.width * 0.5, box.y + box.height * 0.4);
  expect(await wouldAsk(page)).toBe(true);
  await page.keyboard.press("Escape");
  await expect.poll(() => wouldAsk(page)).toBe(false);

  // Select a shape from the markup table and type a label without committing it.
  await page.getByRole("tab", { name: "Markup" }).click();
  await page.getByLabel("Filter markup").fill("G1");
  await page.getByRole("region", { name: "Markup table" }).getByRole("button", { name: "Pad" }).first().click();
  await page.getByRole("tab", { name: "Selection" }).click();
  const label = page.getByRole("region", { name: "Selected markup" }).getByLabel("Label");
  await label.fill("G1 typed but not committed");
  expect(await wouldAsk(page)).toBe(true);
  await label.fill("G1");
  await expect.poll(() => wouldAsk(page)).toBe(false);
  await removeShapes(page, ids);
});

test("the upload dialog gives examples as hints, and a new case opens at once", async ({ page }) => {
  await openDemoDie(page);
  await page.getByRole("tab", { name: "Die & micrographs" }).click();
  await page.getByRole("button", { name: "Upload micrograph" }).click();
  const dialog = page.getByRole("dialog", { name: "Upload a micrograph" });
  for (const [field, hint] of [
    ["Objective magnification", "e.g. 20"],
    ["Numerical aperture", "e.g. 0.45"],
    ["Camera pixel pitch (µm)", "e.g. 3.45"],
  ] as const) {
    const input = dialog.getByLabel(field);
    await expect(input).toHaveValue("");
    expect(await input.getAttribute("placeholder")).toBeNull();
    await expect(input).toHaveAccessibleDescription(hint);
  }
  await shot(page, "upload-dialog");
  await dialog.getByRole("button", { name: "Cancel" }).click();

  await page.goto("/cases");
  await page.getByRole("button", { name: "New case" }).click();
  const form = page.getByRole("dialog", { name: "New case" });
  const title = `Opened at once ${Date.now().toString(36)}`;
  await form.getByLabel("Title").fill(title);
  await form.getByRole("button", { name: "Create case" }).click();
  await expect(page).toHaveURL(/\/cases\/[0-9a-f-]{36}$/);
  await expect(page.getByRole("heading", { name: title })).toBeVisible();
  const id = new URL(page.url()).pathname.split("/").pop();
  await page.evaluate(async (caseId) => fetch(`/api/cases/${caseId}`, { method: "DELETE" }), id);
});

test("names of micrographs are shown whole in the list", async ({ page }) => {
  await openDemoDie(page);
  await page.getByRole("tab", { name: "Die & micrographs" }).click();
  const names = page.getByRole("complementary", { name: "Die panel" }).locator("[title^='NV-24R'], [title*='field']");
  const n = await names.count();
  expect(n).toBeGreaterThan(0);
  for (let i = 0; i < n; i++) {
    const el = names.nth(i);
    // Not cut: the text fits in its box (no overflow hidden behind an ellipsis).
    expect(await el.evaluate((e) => e.scrollWidth <= e.clientWidth + 1 && getComputedStyle(e).textOverflow !== "ellipsis")).toBe(true);
  }
  if (SHOTS) fs.mkdirSync(SHOTS, { recursive: true });
  await shot(page, "micrograph-list");
});

test("a whole-die export takes in the bond wires with a margin; the PNG and the PDF are kept to look at", async ({ page }) => {
  await openDemoDie(page);
  const dieId = dieIdOf(page);
  const ids = await addShapes(page, dieId, demoShapes());
  // Ground truth from the invented layout: the die and the far ends of its bond wires.
  const [dieW, dieH] = NV24R_LAYOUT.dieSizeUm;
  const xs = [0, dieW, ...NV24R_LAYOUT.wireBonds.flatMap((w) => [w.fromUm[0], w.toUm[0]])];
  const ys = [0, dieH, ...NV24R_LAYOUT.wireBonds.flatMap((w) => [w.fromUm[1], w.toUm[1]])];
  const spanX = Math.max(...xs) - Math.min(...xs);
  const spanY = Math.max(...ys) - Math.min(...ys);
  // By the rule: 10 % of the die's larger side around the die, or the bonds plus 3 % of their larger span.
  const widthUm = Math.max(dieW + 0.2 * Math.max(dieW, dieH), spanX + 0.06 * Math.max(spanX, spanY));
  const done = await page.evaluate(async (id) => {
    const micrographs = (await (await fetch(`/api/dies/${id}/micrographs`)).json()) as { id: string; isReference: boolean }[];
    const ref = micrographs.find((m) => m.isReference)!;
    const post = await fetch(`/api/dies/${id}/exports`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ micrographId: ref.id, widthPx: 1600, labels: true, threads: true }),
    });
    const created = (await post.json()) as { id: string };
    for (let i = 0; i < 120; i++) {
      const s = (await (await fetch(`/api/exports/${created.id}`)).json()) as {
        status: string;
        fileUrl: string | null;
        result: { umPerPx: number; width: number; height: number } | null;
      };
      if (s.status === "done" || s.status === "failed") return s;
      await new Promise((r) => setTimeout(r, 500));
    }
    return null;
  }, dieId);
  expect(done?.status).toBe("done");
  // The die alone would be 2400 µm over 1600 px; the bonds reach 220 µm beyond its edges.
  expect(Math.abs(done!.result!.umPerPx * 1600 - widthUm) / widthUm).toBeLessThan(0.002);
  expect(done!.result!.umPerPx * 1600).toBeGreaterThan(spanX);
  if (SHOTS) {
    fs.writeFileSync(`${SHOTS}/whole-die.png`, await (await page.request.get(done!.fileUrl!)).body());
    fs.writeFileSync(`${SHOTS}/report.pdf`, await (await page.request.get(`/api/dies/${dieId}/report.pdf`)).body());
    await page.reload();
    await expect(page.getByTestId("markup-overlay")).toBeVisible({ timeout: 30_000 });
    await page.getByRole("button", { name: "Fit die" }).click();
    await waitForStillView(page);
    await shot(page, "canvas-ruler-note");
  }
  await removeShapes(page, ids);
});
