import { expect, test } from "@playwright/test";
import { signInAs, waitForStillView, gotoLive } from "./helpers";

// A link to a thread (`/dies/{id}?thread=…`, as mailed with a mention) opens that thread. The
// page must render the same on the server and in the browser (no hydration error), and a click
// the user makes as soon as the remark shows (back to the list) must not be undone by the link's
// delayed jump to the remark once the viewer and markup are in.
test("a remark link renders without hydration errors and the first click back to the list holds", async ({ page }) => {
  const errors: string[] = [];
  page.on("pageerror", (e) => errors.push(e.message));
  page.on("console", (m) => {
    if (m.type() === "error") errors.push(m.text());
  });
  await page.setViewportSize({ width: 1400, height: 900 });
  await signInAs(page, "reviewer");
  await page.getByRole("link", { name: "NV-24R receiver teardown" }).click();
  await page.getByRole("link", { name: "NV-24R die A" }).click();
  await expect(page.getByTestId("markup-overlay")).toBeVisible();
  const dieId = page.url().split("/").pop()!;
  const threadId = await page.evaluate(async (dieId) => {
    const ring = [
      [100, 100],
      [300, 100],
      [300, 300],
      [100, 300],
      [100, 100],
    ];
    const res = await fetch(`/api/dies/${dieId}/threads`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ region: { type: "Polygon", coordinates: [ring] }, body: "Corner region: check the seal ring." }),
    });
    return ((await res.json()) as { id: string }).id;
  }, dieId);

  // Hold the markup back for a while, as a slow network would: the remark is on screen at once,
  // the link's jump only once the markup is in, so the user's click comes first.
  await page.route(`**/api/dies/${dieId}/markup`, async (route) => {
    if (route.request().method() === "GET") await new Promise((r) => setTimeout(r, 2500));
    await route.continue();
  });
  errors.length = 0;
  await gotoLive(page, `/dies/${dieId}?thread=${threadId}`);
  const heading = page.getByRole("heading", { name: /Remark \d+ on a region/ });
  await expect(heading).toBeVisible();
  await page.getByRole("button", { name: "← All remarks" }).click();
  await expect(page.getByRole("button", { name: "Raise remark on a region" })).toBeVisible();
  // The link's jump waits for the viewer, the markup and the remark list; let all of it arrive.
  await waitForStillView(page);
  await page.waitForTimeout(1000);
  await expect(heading).toBeHidden();
  await expect(page.getByRole("button", { name: "Raise remark on a region" })).toBeVisible();
  expect(errors.filter((e) => /hydrat|#418|did not match/i.test(e))).toEqual([]);
});
