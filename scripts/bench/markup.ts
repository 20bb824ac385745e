// Markup benchmark: frame times of a scripted pan/zoom over the demo die in headless Chromium
// with 5,000 shapes against the same with none (same server, same page, same script), and the
// time to load 5,000 shapes from the API.
import { chromium, type Page } from "playwright-core";
import { startServer } from "../../tests/support/server";
import { demoClients, DEMO_PASSWORD } from "../../tests/support/client";

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const p95 = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length * 0.95)];

/** 5,000 pads and traces spread over the 2400 × 1600 µm die. */
function shapes(n: number) {
  const out = [];
  for (let i = 0; i < n; i++) {
    const x = 60 + (i % 100) * 23;
    const y = 60 + Math.floor(i / 100) * 30;
    if (i % 5 === 4)
      out.push({
        kind: "trace",
        geometry: {
          type: "LineString",
          coordinates: [
            [x, y],
            [x + 15, y + 10],
            [x + 20, y],
          ],
        },
        properties: { widthUm: 2 },
      });
    else
      out.push({
        kind: "pad",
        geometry: {
          type: "Polygon",
          coordinates: [
            [
              [x, y],
              [x + 12, y],
              [x + 12, y + 12],
              [x, y + 12],
              [x, y],
            ],
          ],
        },
        properties: { label: `B${i}`, net: "", state: "bonded" },
      });
  }
  return out;
}

/** Frame intervals (ms) while the viewer is panned and zoomed by keyboard for a few seconds. */
async function scriptedPanZoom(page: Page): Promise<number[]> {
  await page.getByRole("application", { name: "Micrograph viewer" }).focus();
  // Plain strings: tsx would wrap functions with a helper the page does not have.
  await page.evaluate(`(() => {
    window.__frames = [];
    window.__stop = false;
    let last = performance.now();
    const tick = (t) => { window.__frames.push(t - last); last = t; if (!window.__stop) requestAnimationFrame(tick); };
    requestAnimationFrame(tick);
  })()`);
  const keys = ["+", "ArrowRight", "ArrowRight", "ArrowDown", "+", "ArrowLeft", "ArrowUp", "-", "ArrowRight", "-", "ArrowDown", "ArrowLeft"];
  for (let round = 0; round < 3; round++)
    for (const k of keys) {
      await page.keyboard.press(k);
      await page.waitForTimeout(120);
    }
  return page.evaluate(`(() => { window.__stop = true; return window.__frames.slice(5); })()`) as Promise<number[]>;
}

async function openDie(page: Page, url: string) {
  page.on("pageerror", (e) => console.error("page error:", e.message));
  await page.goto(`${url}/sign-in`);
  await page.getByLabel("E-mail").fill("analyst@fjordlight.test");
  await page.getByLabel("Password").fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.getByRole("link", { name: "NV-24R receiver teardown" }).click();
  await page.getByRole("link", { name: "NV-24R die A" }).click();
  await page.getByTestId("markup-overlay").waitFor();
  await page.waitForTimeout(1500);
}

/** Prints frame-time ratio (target ≤ 1.5) and 5,000-shape load time (target < 300 ms). */
export async function benchMarkup() {
  const server = await startServer();
  const browser = await chromium.launch({
    executablePath: "/usr/bin/chromium",
    args: ["--no-sandbox", "--disable-gpu", "--disable-background-networking", "--disable-component-update", "--disable-sync", "--no-first-run"],
  });
  try {
    const { analyst } = await demoClients(server.url);
    const cases = await analyst.get<{ id: string; title: string }[]>("/api/cases");
    const caseId = cases.body.find((c) => c.title === "NV-24R receiver teardown")!.id;
    const dieId = (await analyst.get<{ id: string }[]>(`/api/cases/${caseId}/dies`)).body[0].id;
    // Wait for the seeded micrographs to be tiled.
    for (;;) {
      const ms = (await analyst.get<{ status: string }[]>(`/api/dies/${dieId}/micrographs`)).body;
      if (ms.every((m) => m.status === "ready")) break;
      await new Promise((r) => setTimeout(r, 500));
    }
    const page = await (await browser.newContext({ viewport: { width: 1440, height: 900 } })).newPage();
    await openDie(page, server.url);
    const empty = [...(await scriptedPanZoom(page)), ...(await scriptedPanZoom(page))];
    const created = await analyst.request("POST", `/api/dies/${dieId}/markup`, shapes(5000));
    if (created.status !== 201) throw new Error(`could not create shapes: ${created.status}`);
    const loads: number[] = [];
    for (let i = 0; i < 7; i++) {
      const t0 = performance.now();
      const res = await analyst.get<unknown[]>(`/api/dies/${dieId}/markup`);
      loads.push(performance.now() - t0);
      if (res.body.length !== 5000) throw new Error("expected 5000 shapes");
    }
    await openDie(page, server.url);
    const full = [...(await scriptedPanZoom(page)), ...(await scriptedPanZoom(page))];
    console.log("markup over the viewer, scripted keyboard pan/zoom in headless Chromium (software rendering), 1440×900:");
    console.log(`  no shapes:    median frame ${median(empty).toFixed(1)} ms, p95 ${p95(empty).toFixed(1)} ms (${empty.length} frames)`);
    console.log(`  5,000 shapes: median frame ${median(full).toFixed(1)} ms, p95 ${p95(full).toFixed(1)} ms (${full.length} frames)`);
    const ratio = median(full) / median(empty);
    const ratio95 = p95(full) / p95(empty);
    console.log(`  ratio median ${ratio.toFixed(2)}, p95 ${ratio95.toFixed(2)}  (target ≤ 1.5) ${ratio <= 1.5 && ratio95 <= 1.5 ? "MET" : "NOT MET"}`);
    console.log(`  GET 5,000 shapes from the API: median ${median(loads).toFixed(0)} ms of 7  (target < 300 ms) ${median(loads) < 300 ? "MET" : "NOT MET"}`);
  } finally {
    await browser.close();
    await server.stop();
  }
}
