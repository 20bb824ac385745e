import { expect, test, type Page } from "@playwright/test";
import { signInAs, gotoLive } from "./helpers";

// Rosa 1908; Grover, Inductance Calculations, 1946: L = 2e-7·l·[ln(2l/r) − 0.75] H for a round
// wire in free space, computed here from the published formula, independent of the app.
const rosaNh = (lengthUm: number, diameterUm: number) => 2e-7 * (lengthUm * 1e-6) * (Math.log((2 * lengthUm) / (diameterUm / 2)) - 0.75) * 1e9;

async function openDemoDie(page: Page) {
  await signInAs(page, "analyst");
  await page.getByRole("link", { name: "NV-24R receiver teardown" }).click();
  await page.getByRole("link", { name: "NV-24R die A" }).click();
  await expect(page.getByTestId("markup-overlay")).toBeVisible();
}

/** Creates a wire bond through the API from inside the page (the analyst's session), returns its id. */
async function createBond(page: Page, label: string): Promise<string> {
  return page.evaluate(async (label) => {
    const dieId = location.pathname.split("/").pop();
    // 600 × 800 µm run inside the die: 1000 µm long (3-4-5 triangle).
    const body = {
      kind: "wire_bond",
      geometry: {
        type: "LineString",
        coordinates: [
          [1000, 300],
          [1600, 1100],
        ],
      },
      properties: { label, diameterUm: 25 },
    };
    const res = await fetch(`/api/dies/${dieId}/markup`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
    if (res.status !== 201) throw new Error(`POST markup answered ${res.status}`);
    return ((await res.json()) as { id: string }).id;
  }, label);
}

test("the analyst reads a wire bond's inductance, saves it on the shape and finds it in the markup table", async ({ page }) => {
  await openDemoDie(page);
  // Other suites may have drawn on this die: a label of our own keeps this test to its shape.
  const label = `Estimate bond ${Date.now().toString(36)}`;
  const id = await createBond(page, label);
  await page.reload();
  await expect(page.getByTestId("markup-overlay")).toBeVisible();

  // Select the bond from the markup table.
  await page.getByRole("tab", { name: "Markup" }).click();
  const table = page.getByRole("region", { name: "Markup table" });
  await table.getByRole("searchbox", { name: "Filter markup" }).fill(label);
  await table.getByRole("button", { name: "Wire bond" }).click();

  await page.getByRole("tab", { name: "Estimates" }).click();
  const panel = page.getByRole("region", { name: "Estimates" });
  await expect(panel.getByText("First-order estimates for reading a layout, not a substitute for electromagnetic simulation or measurement.")).toBeVisible();
  await expect(panel.getByTestId("bond-length")).toHaveText("1000.0 µm");
  const value = panel.getByTestId("bond-wire-inductanceNh");
  const expected = rosaNh(1000, 25); // 0.86503 nH
  await expect(value).toHaveText(`${expected.toFixed(3)} nH`);
  expect(Math.abs(Number(await value.getAttribute("data-value")) - expected)).toBeLessThan(1e-9);
  await expect(panel.getByText(/Rosa/)).toBeVisible();

  // Two bonds in parallel at 100 µm pitch: less than one, never below half (Grover: (L + M)/2).
  await panel.getByLabel("Bonds in parallel").fill("2");
  await expect(value).not.toHaveText(`${expected.toFixed(3)} nH`);
  const pair = Number(await value.getAttribute("data-value"));
  expect(pair).toBeLessThan(expected);
  expect(pair).toBeGreaterThan(expected / 2);
  await panel.getByLabel("Bonds in parallel").fill("1");
  await expect(value).toHaveText(`${expected.toFixed(3)} nH`);

  await panel.getByRole("button", { name: "Save bond-wire estimate on shape" }).click();
  await expect(page.getByTestId("save-state")).toHaveAttribute("data-status", "saved");

  await page.getByRole("tab", { name: "Markup" }).click();
  await table.getByRole("searchbox", { name: "Filter markup" }).fill(label);
  await expect(table.getByRole("row").filter({ hasText: "L 0.865 nH" })).toHaveCount(1);

  // Stored on the server too, and it survives a reload.
  await page.reload();
  await page.getByRole("tab", { name: "Markup" }).click();
  await table.getByRole("searchbox", { name: "Filter markup" }).fill(label);
  await expect(table.getByRole("row").filter({ hasText: "L 0.865 nH" })).toHaveCount(1);
  await page.getByRole("tab", { name: "Summary" }).click();
  await expect(page.getByRole("region", { name: "Saved estimates" }).getByRole("button", { name: label })).toBeVisible();

  // Leave the demo die as it was for the suites after this one.
  const status = await page.evaluate(async (id) => (await fetch(`/api/markup/${id}`, { method: "DELETE" })).status, id);
  expect(status).toBe(204);
});

test("the analyst reads the symmetry report of a die with an axis and one pad moved off its mirror place", async ({ page }) => {
  await signInAs(page, "analyst");
  // A die of its own, so no other suite's markup is paired here.
  const dieId = await page.evaluate(async () => {
    const post = async (path: string, body: unknown) => {
      const res = await fetch(path, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
      if (res.status !== 201) throw new Error(`${path} answered ${res.status}`);
      return res.json() as Promise<{ id: string }>;
    };
    const me = (await (await fetch("/api/me")).json()) as { teams: { id: string; name: string }[] };
    const team = me.teams.find((t) => t.name === "Fjordlight Failure Lab")!;
    const c = await post(`/api/teams/${team.id}/cases`, {
      title: `Symmetry check ${Date.now().toString(36)}`,
      partMarking: "NV-24R",
      package: "QFN-24",
      sampleId: "S-7",
      notes: "",
    });
    const d = await post(`/api/cases/${c.id}/dies`, { name: "NV-24R die S", widthUm: 2400, heightUm: 1600, notes: "" });
    const pad = (label: string, cx: number, cy: number) => ({
      kind: "pad",
      geometry: {
        type: "Polygon",
        coordinates: [
          [
            [cx - 40, cy - 40],
            [cx + 40, cy - 40],
            [cx + 40, cy + 40],
            [cx - 40, cy + 40],
            [cx - 40, cy - 40],
          ],
        ],
      },
      properties: { label, state: "bonded" },
    });
    // VB1 at (650, 1530) and its mirror VB1S at (650, 70) across y = 800, but VB1S drawn 4 µm to the right;
    // VCC1/VEE1 mirrored exactly (positions from the demo layout).
    await post(`/api/dies/${d.id}/markup`, [
      {
        kind: "symmetry_axis",
        geometry: {
          type: "LineString",
          coordinates: [
            [0, 800],
            [2400, 800],
          ],
        },
        properties: { name: "Differential axis" },
      },
      pad("VCC1", 350, 1530),
      pad("VEE1", 350, 70),
      pad("VB1", 650, 1530),
      pad("VB1S", 654, 70),
      pad("NC1", 1650, 70),
      // G2 straddles the axis: its own mirror image, listed apart and not counted as a pair.
      pad("G2", 1200, 800),
    ]);
    return d.id;
  });
  await gotoLive(page, `/dies/${dieId}`);
  await page.getByRole("tab", { name: "Symmetry" }).click();
  const report = page.getByRole("region", { name: "Symmetry report" });
  await page.getByLabel("Tolerance (µm)").fill("1");
  // By hand: two pairs, VB1–VB1S 4 µm apart (in x), VCC1–VEE1 exact; G2 on the axis; NC1 has no partner.
  await expect(report.getByTestId("symmetry-summary")).toHaveText(
    "2 pairs, 1 within tolerance · largest offset 4.00 µm · mean 2.00 µm · 1 on the axis · 1 without a partner",
  );
  await expect(report.getByTestId("symmetry-on-axis")).toContainText("G2");
  // The histogram's axis ends read as different numbers (0.0 … 4.0 µm here).
  await expect(report.getByRole("img", { name: /Histogram of 2 pair deviations from 0\.0 to 4\.0 µm/ })).toBeVisible();
  const rows = report.getByRole("row");
  await expect(rows.nth(1)).toContainText("4.00"); // sorted by offset, largest first
  await expect(rows.nth(1)).toContainText("no");
  await expect(report.getByRole("button", { name: "NC1" })).toBeVisible();
  // A looser tolerance takes the moved pad in.
  await page.getByLabel("Tolerance (µm)").fill("5");
  await expect(report.getByTestId("symmetry-summary")).toContainText("2 within tolerance");
});
