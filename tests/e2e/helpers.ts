import { expect, type Browser, type BrowserContext, type Page } from "@playwright/test";

const PASSWORD = "fjordlight-demo";

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

/**
 * Waits until every micrograph viewer on the page has stopped moving and has the tiles for its
 * view (`data-view-idle`, kept by the viewer), seen twice 300 ms apart so that an animation
 * the last action starts on the next frame is not missed.
 */
export async function waitForStillView(page: Page, timeout = 30_000) {
  const idle = async () =>
    page.locator("[data-view-idle]").evaluateAll((els) => els.length > 0 && els.every((e) => (e as HTMLElement).dataset.viewIdle === "true"));
  await expect(async () => {
    expect(await idle()).toBe(true);
    await page.waitForTimeout(300);
    expect(await idle()).toBe(true);
  }).toPass({ timeout, intervals: [100, 200, 300] });
}

/**
 * Closes the browser contexts a test opened for other people (`browser.newContext()`), which
 * Playwright leaves open for the rest of the worker: each is a live app page that keeps polling,
 * and a dozen of them slow every later test. Use as `test.afterEach(closeExtraContexts)`.
 */
export async function closeExtraContexts({ browser, context }: { browser: Browser; context: BrowserContext }) {
  await Promise.all(
    browser
      .contexts()
      .filter((c) => c !== context)
      .map((c) => c.close()),
  );
}

/** A full page load, then the moment its controls are live (html[data-hydrated], set by the root provider). */
export async function gotoLive(page: Page, url: string) {
  await page.goto(url);
  await page.locator("html[data-hydrated]").waitFor({ state: "attached" });
}
