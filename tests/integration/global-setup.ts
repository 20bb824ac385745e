// Starts one real server for the integration suite: the production build on a fresh data dir
// (PGlite), or on a fresh database of a PostgreSQL server when KERFLINE_TEST_DATABASE_URL is set.
import type { TestProject } from "vitest/node";
import { startServer, type RunningServer } from "../support/server";
// @ts-expect-error plain ESM helper shared with the start script
import { buildIfStale } from "../../scripts/build-if-stale.mjs";

declare module "vitest" {
  export interface ProvidedContext {
    baseUrl: string;
    databaseKind: "pglite" | "postgres";
    dataDir: string;
  }
}

let server: RunningServer | undefined;

export async function setup(project: TestProject) {
  buildIfStale();
  const databaseUrl = process.env.KERFLINE_TEST_DATABASE_URL;
  server = await startServer({ env: { KERFLINE_SEED: "demo-records", ...(databaseUrl ? { DATABASE_URL: databaseUrl } : {}) } });
  project.provide("baseUrl", server.url);
  project.provide("dataDir", server.dataDir);
  project.provide("databaseKind", databaseUrl ? "postgres" : "pglite");
}

export async function teardown() {
  await server?.stop();
}
