import { defineConfig } from "vitest/config";
import os from "node:os";
import path from "node:path";

const alias = {
  "@": path.resolve(import.meta.dirname),
  // The marker package throws outside React Server Components; tests are server code.
  "server-only": path.resolve(import.meta.dirname, "node_modules/server-only/empty.js"),
};

export default defineConfig({
  resolve: { alias },
  test: {
    testTimeout: 60_000,
    hookTimeout: 180_000,
    pool: "forks",
    maxWorkers: os.availableParallelism(),
    projects: [
      {
        resolve: { alias },
        test: {
          name: "unit",
          include: ["lib/**/*.test.ts", "db/**/*.test.ts", "server/**/*.test.ts", "components/**/*.test.ts", "tests/lint/**/*.test.ts"],
          environment: "node",
          testTimeout: 60_000,
          // Fixtures built in beforeAll (images for the tiler) take over 10 s on a loaded machine.
          hookTimeout: 120_000,
        },
      },
      {
        resolve: { alias },
        test: {
          name: "integration",
          include: ["tests/integration/**/*.test.ts"],
          environment: "node",
          globalSetup: ["tests/integration/global-setup.ts"],
          testTimeout: 120_000,
          hookTimeout: 180_000,
          // One shared server; files run one after another so they do not race for the CPU.
          fileParallelism: false,
        },
      },
    ],
  },
});
