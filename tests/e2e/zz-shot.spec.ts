import { test } from "@playwright/test";
import { signInAs } from "./helpers";
test("shot", async ({ page }) => {
  page.on("console", (m) => m.type() === "error" && console.log("console:", m.text()));
  page.on("pageerror", (e) => console.log("pageerror:", e.message));
  await signInAs(page, "analyst");
  await page.getByRole("link", { name: "NV-24R receiver teardown" }).click();
  await page.getByRole("link", { name: "NV-24R die A" }).click();
  await page.waitForTimeout(3000);
  await page.keyboard.press("p");
  const box = (await page.getByTestId("markup-overlay").boundingBox())!;
  await page.mouse.move(box.x + 300, box.y + 300);
  await page.mouse.down();
  await page.mouse.move(box.x + 340, box.y + 330, { steps: 5 });
  await page.mouse.up();
  await page.waitForTimeout(1000);
  await page.screenshot({ path: "/tmp/bench2.png" });
});
