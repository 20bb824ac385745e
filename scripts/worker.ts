// `npm run worker`: a process that runs jobs (tiling, exports, mail, housekeeping) and serves no
// HTTP, beside web servers started with KERFLINE_JOBS=off on the same PostgreSQL and storage.
// SIGTERM or SIGINT stops fetching, gives running jobs time to finish, and fails the rest back
// to the queue for another worker.
import { openedDatabase } from "@/server/database";
import { env } from "@/server/env";
import { stopBoss } from "@/server/jobs/boss";
import { assertProcessLayout, ProcessLayoutError, startJobs } from "@/server/jobs/run";
import { tilingWorkerCount } from "@/server/jobs/tiling";

/** How long running jobs get to finish on SIGTERM before they are handed back. */
const STOP_GRACE_MS = 20_000;

try {
  assertProcessLayout("worker");
} catch (e) {
  if (!(e instanceof ProcessLayoutError)) throw e;
  console.error(`[kerfline] refusing to start the worker: ${e.message}`);
  process.exit(1);
}

const opened = await openedDatabase();
const stopAsking = await startJobs(opened, "worker");
console.log(`[kerfline] worker ready (${opened.kind}, pid ${process.pid}): ${tilingWorkerCount()} tiling, 1 export, 1 mail; data dir ${env().dataDir}`);

let stopping = false;
async function shutdown(signal: string) {
  if (stopping) return;
  stopping = true;
  console.log(`[kerfline] worker stopping (${signal}): no new jobs, ${STOP_GRACE_MS / 1000} s for running ones`);
  stopAsking();
  try {
    await stopBoss(STOP_GRACE_MS);
    await opened.close();
  } finally {
    console.log("[kerfline] worker stopped");
    process.exit(0);
  }
}
process.on("SIGTERM", () => void shutdown("SIGTERM"));
process.on("SIGINT", () => void shutdown("SIGINT"));
