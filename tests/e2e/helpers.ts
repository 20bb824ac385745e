import { expect, type Page } from "@playwright/test";

export const PASSWORD = "fjordlight-demo";

/** Signs in through the form, as a person would. */
export async function signIn(page: Page, email: string, password = PASSWORD) {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
}

export async function signInAs(page: Page, who: "owner" | "analyst" | "reviewer" | "viewer") {
  await signIn(page, `${who}@fjordlight.test`);
  await expect(page.getByRole("heading", { name: "Cases" })).toBeVisible();
}
