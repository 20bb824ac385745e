import "server-only";
import { openDatabase } from "@/db/client";
import { DataDirLockedError } from "@/db/data-dir-lock";
import { env } from "./env";

/**
 * Runs once per server process before the first request: opens the database (taking the data
 * dir lock and applying migrations) and seeds the demo scenario into an empty database.
 * A second server on a locked data dir exits here with a clear message.
 */
export async function startServer(): Promise<void> {
  const g = globalThis as unknown as { __kerflineDb?: ReturnType<typeof openDatabase> };
  try {
    g.__kerflineDb ??= openDatabase();
    const opened = await g.__kerflineDb;
    if (env().KERFLINE_SEED === "demo") {
      const { seedDemo } = await import("@/db/seed");
      if (await seedDemo(opened.db)) console.log("[kerfline] seeded the demo scenario");
    }
    console.log(`[kerfline] database ready (${opened.kind}), data dir ${env().dataDir}`);
  } catch (e) {
    if (e instanceof DataDirLockedError) {
      console.error(`[kerfline] refusing to start: ${e.message}`);
      process.exit(1);
    }
    console.error("[kerfline] start-up failed:", e);
    process.exit(1);
  }
}
