import { expect, test } from "@playwright/test";
import { signInAs, waitForStillView } from "./helpers";

// Issue #13 item 7: under the nonce Content-Security-Policy the pages still hydrate and the
// die page's viewer (OpenSeadragon tiles, the Konva markup canvas) still draws; Chromium
// reports no policy violation on the way.
test("the die page hydrates and draws under the Content-Security-Policy", async ({ page }) => {
  const violations: string[] = [];
  page.on("console", (m) => {
    if (/Content Security Policy|Refused to|Permissions-Policy/i.test(m.text())) violations.push(m.text());
  });
  await page.addInitScript(() => {
    document.addEventListener("securitypolicyviolation", (e) => console.error(`Refused to load (CSP): ${e.violatedDirective} ${e.blockedURI}`));
  });
  await signInAs(page, "analyst");
  await page.getByRole("link", { name: "NV-24R receiver teardown" }).click();
  await page.getByRole("link", { name: "NV-24R die A" }).click();
  await expect(page.getByTestId("markup-overlay")).toBeVisible();
  // Hydrated: a client-side button answers.
  await page.getByRole("button", { name: "Fit die" }).click();
  await waitForStillView(page);
  const viewer = page.getByRole("application", { name: "Micrograph viewer" });
  const drawn = await viewer.evaluate((root) => {
    const canvases = [...root.querySelectorAll("canvas")] as HTMLCanvasElement[];
    // Any canvas with non-transparent pixels in its middle: the tiles have arrived.
    return canvases.some((c) => {
      const ctx = c.getContext("2d");
      if (!ctx || c.width === 0) return false;
      const d = ctx.getImageData(Math.floor(c.width / 2) - 20, Math.floor(c.height / 2) - 20, 40, 40).data;
      for (let i = 3; i < d.length; i += 4) if (d[i] > 0) return true;
      return false;
    });
  });
  expect(drawn).toBe(true);
  await page.screenshot({ path: "test-results/e2e-artifacts/die-page-under-csp.png" });
  const headers = (await page.request.get(page.url())).headers();
  expect(headers["content-security-policy"]).toMatch(/frame-ancestors 'none'/);
  expect(violations).toEqual([]);
});
