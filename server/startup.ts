import "server-only";
import { openedDatabase } from "./database";
import { DataDirLockedError } from "@/db/data-dir-lock";
import { env } from "./env";
import { assertProcessLayout, ProcessLayoutError, startJobs, webRole } from "./jobs/run";

/**
 * Runs once per server process before the first request: opens the database (taking the data
 * dir lock and applying migrations), makes the object store ready (the bucket created when
 * missing), starts the job queue (workers too unless KERFLINE_JOBS=off) and seeds the demo
 * scenario into an empty database. A second server on a locked data dir, or a layout of several
 * processes missing what they share, exits here with a clear message.
 */
export async function startServer(): Promise<void> {
  try {
    const role = webRole();
    assertProcessLayout(role);
    const opened = await openedDatabase();
    // The bucket (created when missing) before anything removes or stores an object.
    const { ensureStorageReady, incomingDir, sweepScratch } = await import("./storage");
    const packed = await ensureStorageReady();
    if (packed) console.log(`[kerfline] packed ${packed} pyramid folder(s) of the earlier data-dir layout into tile packs`);
    // On the embedded database this process is the only one on the data dir: all of scratch is
    // an earlier run's leftovers. Beside other processes, only what is an hour old. Before the
    // workers start, so no running job's folder is swept.
    const olderThanMs = opened.kind === "pglite" ? 0 : 3600_000;
    const { sweepIncoming } = await import("./files/upload");
    const swept = await sweepIncoming(incomingDir(), olderThanMs);
    if (swept) console.log(`[kerfline] removed ${swept} unfinished upload part(s) left by an earlier stop`);
    const scratch = await sweepScratch(olderThanMs);
    if (scratch) console.log(`[kerfline] removed ${scratch} scratch folder(s) left by an earlier stop`);
    const { startMail } = await import("./mail/start-mail");
    if (role === "embedded") await startMail();
    // Before anything that queues (seeding renders micrographs): a job is sent in its row's transaction.
    await startJobs(opened, role);
    const { freezeUnfrozenSignOffs } = await import("./access/revisions");
    const frozen = await freezeUnfrozenSignOffs(opened.db);
    if (frozen) console.log(`[kerfline] froze the signed-off revision of ${frozen} die(s) signed off before revisions existed`);
    const { installFastTiles } = await import("./http/fast-tiles");
    installFastTiles();
    const seed = env().KERFLINE_SEED;
    if (seed !== "none") {
      const { seedDemo } = await import("@/db/seed");
      if (await seedDemo(opened.db)) {
        console.log("[kerfline] seeded the demo scenario");
        if (seed === "demo") {
          const { seedDemoMicrographs } = await import("./seed-micrographs");
          await seedDemoMicrographs(opened.db);
          console.log("[kerfline] rendered and uploaded the demo micrographs (tiling in the background)");
        }
      }
      const { signOffDemoDieB } = await import("./seed-sign-off");
      if (await signOffDemoDieB(opened.db)) console.log("[kerfline] signed off the demo's die B as revision 1");
    }
    console.log(
      `[kerfline] database ready (${opened.kind}), data dir ${env().dataDir}, storage ${env().KERFLINE_STORAGE}; jobs ${role === "web" ? "queued for worker processes" : "run in this process"}`,
    );
    const { describeLinkOrigin } = await import("./http/origin");
    console.log(`[kerfline] ${describeLinkOrigin()}`);
  } catch (e) {
    if (e instanceof DataDirLockedError || e instanceof ProcessLayoutError) {
      console.error(`[kerfline] refusing to start: ${e.message}`);
      process.exit(1);
    }
    console.error("[kerfline] start-up failed:", e);
    process.exit(1);
  }
}
