import fs from "node:fs";
import path from "node:path";

/** Thrown when another live process already holds the data directory. */
export class DataDirLockedError extends Error {}

function processAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (e) {
    return (e as NodeJS.ErrnoException).code === "EPERM";
  }
}

/**
 * Takes an exclusive lock on a PGlite data directory: a lock file holding our pid, created with
 * O_EXCL. PGlite itself does not lock, and two processes on one directory silently lose writes.
 * A lock left by a process that is gone (crash, SIGKILL) is taken over at once, so a restart
 * after a crash needs no waiting; a lock held by a live process refuses with a clear message.
 * Returns a release function.
 */
export function lockDataDir(dir: string): () => void {
  fs.mkdirSync(dir, { recursive: true });
  const lockFile = path.join(dir, "kerfline.lock");
  for (let attempt = 0; attempt < 3; attempt++) {
    try {
      fs.writeFileSync(lockFile, JSON.stringify({ pid: process.pid, since: new Date().toISOString() }), { flag: "wx" });
      const release = () => {
        try {
          const held = JSON.parse(fs.readFileSync(lockFile, "utf8")) as { pid: number };
          if (held.pid === process.pid) fs.unlinkSync(lockFile);
        } catch {
          /* already gone */
        }
      };
      process.once("exit", release);
      return release;
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code !== "EEXIST") throw e;
      let holder: { pid?: number; since?: string } = {};
      try {
        holder = JSON.parse(fs.readFileSync(lockFile, "utf8"));
      } catch {
        /* half-written by a crashed process: treat as stale */
      }
      if (holder.pid && holder.pid !== process.pid && processAlive(holder.pid)) {
        throw new DataDirLockedError(
          `The data directory ${dir} is in use by another Kerfline server (pid ${holder.pid}, since ${holder.since}). ` +
            "Two servers on one embedded database lose data: stop the other one, or set KERFLINE_DATA_DIR to another folder.",
        );
      }
      if (holder.pid === process.pid) return () => fs.rmSync(lockFile, { force: true });
      fs.rmSync(lockFile, { force: true });
    }
  }
  throw new DataDirLockedError(`Could not take the lock on ${dir}`);
}
