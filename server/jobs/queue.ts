import "server-only";
import { startedBoss, type JobKind } from "@/server/access/job-queue";

const g = globalThis as unknown as { __kerflineLocalWorkers?: Map<string, JobKind> };

/** This process's pg-boss workers by id, so a new job can wake them at once. */
export function localWorkers(): Map<string, JobKind> {
  return (g.__kerflineLocalWorkers ??= new Map());
}

/**
 * Wakes this process's idle workers after a commit that queued jobs (pg-boss `notifyWorker`);
 * workers in other processes find them by polling within a second.
 */
export function notifyJobs(): void {
  if (localWorkers().size === 0) return;
  void startedBoss().then(
    (boss) => {
      for (const id of localWorkers().keys()) boss.notifyWorker(id);
    },
    () => {},
  );
}
