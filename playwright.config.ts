import { defineConfig } from "@playwright/test";
import os from "node:os";
import path from "node:path";
import fs from "node:fs";

// End-to-end tests drive Debian's Chromium (never a downloaded browser) against the production
// build, started on its own port with a fresh data dir seeded with the demo scenario.
const PORT = Number(process.env.KERFLINE_E2E_PORT ?? 3211);
const dataDir = process.env.KERFLINE_E2E_DATA_DIR ?? fs.mkdtempSync(path.join(os.tmpdir(), "kerfline-e2e-"));
process.env.KERFLINE_E2E_DATA_DIR = dataDir;

export default defineConfig({
  testDir: "tests/e2e",
  timeout: 90_000,
  expect: { timeout: 15_000 },
  fullyParallel: false,
  workers: 1,
  retries: 0,
  outputDir: "test-results/e2e-artifacts",
  reporter: [["list"], ["json", { outputFile: "test-results/e2e.json" }]],
  use: {
    baseURL: `http://localhost:${PORT}`,
    trace: "retain-on-failure",
    screenshot: "only-on-failure",
    launchOptions: {
      executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
      args: [
        "--no-sandbox",
        "--disable-gpu",
        "--disable-background-networking",
        "--disable-component-update",
        "--disable-sync",
        "--no-first-run",
        "--disable-quic",
      ],
    },
  },
  webServer: {
    command: `node scripts/run.mjs start`,
    url: `http://localhost:${PORT}/api/health`,
    reuseExistingServer: false,
    timeout: 180_000,
    env: { PORT: String(PORT), KERFLINE_DATA_DIR: dataDir },
    stdout: "pipe",
  },
});
