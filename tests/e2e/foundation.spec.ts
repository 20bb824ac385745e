import { expect, test } from "@playwright/test";
import { signIn, signInAs } from "./helpers";

test.describe("sign-in and roles", () => {
  test("a wrong password shows an error and keeps the visitor signed out", async ({ page }) => {
    await signIn(page, "analyst@fjordlight.test", "not-the-password");
    await expect(page.getByText("That e-mail and password do not match an account.")).toBeVisible();
    await page.goto("/cases");
    await expect(page).toHaveURL(/\/sign-in/);
  });

  test("the owner signs in, sees the demo case and the team page with role controls, and signs out", async ({ page }) => {
    await signInAs(page, "owner");
    await expect(page.getByTestId("signed-in-as")).toContainText("owner@fjordlight.test");
    await expect(page.getByRole("link", { name: "NV-24R receiver teardown" })).toBeVisible();
    await expect(page.getByRole("button", { name: "New case" })).toBeVisible();
    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Fjordlight Failure Lab" }).click();
    await expect(page.getByLabel("Role of Demo Viewer")).toHaveValue("viewer");
    await page.getByRole("link", { name: "Sign out" }).click();
    await page.getByRole("button", { name: "Sign out" }).click();
    await expect(page).toHaveURL(/\/sign-in/);
    await page.goto("/cases");
    await expect(page).toHaveURL(/\/sign-in/);
  });

  test("the analyst creates a case and a die, edits and deletes them", async ({ page }) => {
    await signInAs(page, "analyst");
    await page.getByRole("button", { name: "New case" }).click();
    const dialog = page.getByRole("dialog", { name: "New case" });
    await dialog.getByRole("button", { name: "Create case" }).click();
    await expect(dialog.getByText("a title is required")).toBeVisible();
    await dialog.getByLabel("Title").fill("x".repeat(201));
    await dialog.getByRole("button", { name: "Create case" }).click();
    await expect(dialog.getByText("must be at most 200 characters")).toBeVisible();
    await dialog.getByLabel("Title").fill("E2E bias block check");
    await dialog.getByLabel("Part marking").fill("NV24R-A1");
    await dialog.getByRole("button", { name: "Create case" }).click();
    await expect(dialog).toBeHidden();
    // Creating a case goes straight into it.
    await expect(page).toHaveURL(/\/cases\/[0-9a-f-]{36}$/);
    await expect(page.getByRole("heading", { name: "E2E bias block check" })).toBeVisible();
    await expect(page.getByText("No dies yet.")).toBeVisible();

    await page.getByRole("button", { name: "New die" }).click();
    const dieDialog = page.getByRole("dialog", { name: "New die" });
    await dieDialog.getByLabel("Name").fill("die B");
    await dieDialog.getByLabel("Width (µm)").fill("-3");
    await dieDialog.getByRole("button", { name: "Add die" }).click();
    await expect(dieDialog.getByText("must be positive")).toBeVisible();
    await dieDialog.getByLabel("Width (µm)").fill("2400");
    await dieDialog.getByLabel("Height (µm)").fill("1600");
    await dieDialog.getByRole("button", { name: "Add die" }).click();
    await expect(page.getByRole("link", { name: "die B" })).toBeVisible();
    await expect(page.getByRole("cell", { name: "2400 × 1600" })).toBeVisible();

    await page.getByRole("button", { name: "Edit case" }).click();
    await page.getByRole("dialog", { name: "Edit case" }).getByLabel("Package").fill("CERDIP-16");
    await page.getByRole("dialog", { name: "Edit case" }).getByRole("button", { name: "Save" }).click();
    await expect(page.getByText("CERDIP-16")).toBeVisible();

    await page.getByRole("link", { name: "die B" }).click();
    await expect(page.getByRole("heading", { name: "die B" })).toBeVisible();
    await expect(page.getByText("Draft")).toBeVisible();
    await page.getByRole("button", { name: "Delete die" }).click();
    await page.getByRole("dialog", { name: "Delete this die?" }).getByRole("button", { name: "Delete die" }).click();
    await expect(page.getByRole("heading", { name: "E2E bias block check" })).toBeVisible();
    await expect(page.getByText("No dies yet.")).toBeVisible();

    await page.getByRole("button", { name: "Delete case" }).click();
    await page.getByRole("dialog", { name: "Delete this case?" }).getByRole("button", { name: "Delete case" }).click();
    await expect(page.getByRole("heading", { name: "Cases" })).toBeVisible();
    await expect(page.getByRole("link", { name: "E2E bias block check" })).toHaveCount(0);
  });

  test("a reviewer cannot create a case, and sees no edit buttons on it", async ({ page }) => {
    await signInAs(page, "reviewer");
    await expect(page.getByRole("link", { name: "NV-24R receiver teardown" })).toBeVisible();
    await expect(page.getByRole("button", { name: "New case" })).toHaveCount(0);
    await page.getByRole("link", { name: "NV-24R receiver teardown" }).click();
    await expect(page.getByRole("link", { name: "NV-24R die A" })).toBeVisible();
    await expect(page.getByRole("button", { name: "New die" })).toHaveCount(0);
    await expect(page.getByRole("button", { name: "Edit case" })).toHaveCount(0);
  });

  test("a viewer sees the case and die but no edit buttons anywhere", async ({ page }) => {
    await signInAs(page, "viewer");
    await expect(page.getByRole("button", { name: "New case" })).toHaveCount(0);
    await page.getByRole("link", { name: "NV-24R receiver teardown" }).click();
    await expect(page.getByRole("button", { name: /Edit|Delete|New/ })).toHaveCount(0);
    await page.getByRole("link", { name: "NV-24R die A" }).click();
    await expect(page.getByRole("heading", { name: "NV-24R die A" })).toBeVisible();
    await expect(page.getByRole("button", { name: /Edit|Delete/ })).toHaveCount(0);
    await page.getByRole("navigation", { name: "Breadcrumb" }).getByRole("link", { name: "Cases" }).click();
    await page.goto("/teams/" + (await page.evaluate(async () => (await (await fetch("/api/me")).json()).teams[0].id)));
    await expect(page.getByText("Your role: Viewer")).toBeVisible();
    await expect(page.getByRole("button", { name: "Remove" })).toHaveCount(0);
  });

  test("the outsider gets the 404 page for the demo case and die by URL", async ({ page, browser }) => {
    const insider = await browser.newPage();
    await signInAs(insider, "analyst");
    const ids = await insider.evaluate(async () => {
      const cases = await (await fetch("/api/cases")).json();
      const c = cases.find((x: { title: string }) => x.title === "NV-24R receiver teardown");
      const dies = await (await fetch(`/api/cases/${c.id}/dies`)).json();
      return { caseId: c.id as string, dieId: dies[0].id as string };
    });
    await insider.close();
    await signIn(page, "outsider@elsewhere.test");
    await expect(page.getByRole("heading", { name: "Cases" })).toBeVisible();
    await expect(page.getByText("No cases yet.")).toBeVisible();
    for (const url of [`/cases/${ids.caseId}`, `/dies/${ids.dieId}`]) {
      const res = await page.goto(url);
      expect(res?.status()).toBe(404);
      await expect(page.getByRole("heading", { name: "Not found" })).toBeVisible();
    }
  });
});

test("sign-in refuses after 10 failed attempts with the minutes to wait", async ({ page }) => {
  // An address with no account: attempts are limited whether or not the account exists. One of
  // this run's own, so a repeated run starts with no failures counted for it.
  const nobody = `nobody.${Date.now().toString(36)}@fjordlight.test`;
  // From an address of this repetition's own (TEST-NET-2, RFC 5737): the server counts failures
  // per address too (30), and earlier repetitions' wrong passwords from 127.0.0.1 add up to that.
  await page.setExtraHTTPHeaders({ "x-forwarded-for": `198.51.100.${10 + test.info().repeatEachIndex}` });
  for (let i = 0; i < 10; i++) {
    await signIn(page, nobody, "wrong");
    await expect(page.getByText("That e-mail and password do not match an account.")).toBeVisible();
  }
  await signIn(page, nobody, "wrong");
  await expect(page.getByText(/Too many attempts, try again in 1[0-5] minutes\./)).toBeVisible();
});
