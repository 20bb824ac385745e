import { expect, test } from "@playwright/test";
import { signInAs } from "./helpers";
import { NV24R_LAYOUT } from "../../lib/demo-die/layout";

// The seeded die B is the invented NV-24R layout (lib/demo-die/layout.ts) marked completely:
// what its tabs show is checked against that layout, counted by hand.
const probed = NV24R_LAYOUT.pads.filter((p) => p.state === "probed").map((p) => p.label);

test("a newcomer finds die B of the demo case read completely: pads, symmetry, summary and a closed remark", async ({ page }) => {
  await signInAs(page, "viewer");
  await page.getByRole("link", { name: "NV-24R receiver teardown" }).click();
  await expect(page.getByRole("link", { name: "NV-24R die A" })).toBeVisible();
  await page.getByRole("link", { name: "NV-24R die B" }).click();
  await expect(page.getByRole("heading", { name: "NV-24R die B" })).toBeVisible();
  await expect(page.getByTestId("markup-overlay")).toBeVisible({ timeout: 30_000 });

  await page.getByRole("tab", { name: "Pad table" }).click();
  const pads = page.getByRole("region", { name: "Pad table" });
  await expect(pads).toContainText(`${NV24R_LAYOUT.pads.length} pads`);
  await expect(pads.locator("tbody tr")).toHaveCount(NV24R_LAYOUT.pads.length);
  for (const label of probed) await expect(pads.getByText(/Probed, not bonded:/)).toContainText(label);

  await page.getByRole("tab", { name: "Symmetry" }).click();
  // By hand: 10 pad pairs, LO buffer and bias pairs, peaking and RF input line pairs; G2, G5 and the three stages on the axis.
  await expect(page.getByRole("region", { name: "Symmetry report" }).getByTestId("symmetry-summary")).toHaveText(
    "14 pairs, 14 within tolerance · largest offset 0.00 µm · mean 0.00 µm · 5 on the axis · 0 without a partner",
  );

  await page.getByRole("tab", { name: "Summary" }).click();
  await expect(page.getByTestId("summary-states")).toContainText("18 / 3 / 1");

  await page.getByRole("tab", { name: "Check & remarks" }).click();
  await expect(page.getByText("#1 · closed · 1 reply")).toBeVisible();
  // Checked and signed off as revision 1, its hash listed.
  await expect(page.getByRole("region", { name: "Check status" }).getByText("Signed off").first()).toBeVisible();
  await expect(page.getByRole("region", { name: "Revisions" }).getByText(/Revision 1 · Signed off by Demo Reviewer/)).toBeVisible();
});
