import { expect, test, type Page } from "@playwright/test";
import { signInAs } from "./helpers";

// The sample record and chain of custody on the demo case's page. Each repetition writes texts
// of its own and removes the step it added, so the seeded record stays as it was.
async function openDemoCase(page: Page, who: "analyst" | "viewer") {
  await signInAs(page, who);
  await page.getByRole("link", { name: "NV-24R receiver teardown" }).click();
  await expect(page.getByRole("heading", { name: "Sample record" })).toBeVisible();
}

const stepItem = (page: Page, n: number) => page.getByRole("listitem").filter({ has: page.getByRole("group", { name: `Step ${n}`, exact: true }) });

test.describe("sample record and chain of custody", () => {
  test("the analyst sees the seeded record, adds a laser step with its caution, saves, and appends a custody entry", async ({ page }) => {
    const tag = `r${test.info().repeatEachIndex}-${Date.now().toString(36)}`;
    await openDemoCase(page, "analyst");
    await expect(page.getByLabel("Received from")).toHaveValue("Nordvik Semiconductor field returns desk");
    await expect(page.getByLabel("Storage location")).toHaveValue(/Dry cabinet/);
    const first = stepItem(page, 1);
    await expect(first.getByLabel("Method")).toHaveValue("acid_decap");
    await expect(first.getByLabel("Chemicals")).toHaveValue("Fuming nitric acid");
    await expect(first.getByRole("note")).toContainText("fume hood");
    const custody = page.getByRole("table", { name: "Chain of custody" });
    for (const action of ["Received", "Stored", "Checked out", "Returned"])
      await expect(custody.getByRole("cell", { name: action, exact: true }).first()).toBeVisible();

    await page.getByRole("button", { name: "Add step" }).click();
    const added = stepItem(page, 2);
    await added.getByLabel("Method").selectOption("laser_decap");
    await expect(added.getByRole("note")).toContainText("Caution: Laser decapsulation");
    await expect(added.getByRole("note")).toContainText("interlocks");
    await added.getByLabel("Equipment").fill("Laser decapsulation cell");
    await added.getByLabel("Notes").fill(`window over the die ${tag}`);
    await page.getByRole("button", { name: "Save sample record" }).click();
    await expect(page.getByRole("status").filter({ hasText: "Saved." })).toBeVisible();

    await page.reload();
    await expect(stepItem(page, 2).getByLabel("Notes")).toHaveValue(`window over the die ${tag}`);
    await expect(stepItem(page, 2).getByRole("note")).toContainText("Laser decapsulation");
    await page.getByRole("button", { name: "Remove step 2" }).click();
    await page.getByRole("button", { name: "Save sample record" }).click();
    await expect(page.getByRole("status").filter({ hasText: "Saved." })).toBeVisible();
    await expect(page.getByRole("group", { name: "Step 2", exact: true })).toHaveCount(0);

    const form = page.getByRole("form", { name: "Add a custody entry" });
    await form.getByLabel("Action").selectOption("transferred");
    await form.getByLabel("To (person or place)").fill(`Imaging bench ${tag}`);
    await form.getByLabel("Note").fill(`for bright-field imaging ${tag}`);
    await form.getByRole("button", { name: "Add custody entry" }).click();
    const row = custody.getByRole("row").filter({ hasText: `for bright-field imaging ${tag}` });
    await expect(row).toContainText("Transferred");
    await expect(row).toContainText("Demo Analyst");
    await expect(form.getByLabel("Note")).toHaveValue("");
  });

  test("the viewer sees the record and the log read-only", async ({ page }) => {
    await openDemoCase(page, "viewer");
    await expect(page.getByText("Read only: owners and analysts keep this record.")).toBeVisible();
    await expect(page.getByLabel("Received from")).toHaveValue("Nordvik Semiconductor field returns desk");
    await expect(page.getByLabel("Received from")).toBeDisabled();
    await expect(stepItem(page, 1).getByLabel("Method")).toBeDisabled();
    await expect(stepItem(page, 1).getByRole("note")).toContainText("Caution: Acid decapsulation");
    await expect(page.getByRole("table", { name: "Chain of custody" }).getByRole("cell", { name: "Received", exact: true }).first()).toBeVisible();
    for (const name of ["Save sample record", "Add step", "Add custody entry"]) await expect(page.getByRole("button", { name })).toHaveCount(0);
  });
});
