export type SaveState = { status: "idle" | "saving" | "saved" | "failed"; message?: string };

/**
 * Runs saves one after another, in the order the user made the changes, and reports the save
 * state. "saved" is reported only once nothing is left to send: a later change still queued
 * behind the one that just finished is not saved yet, and saying so would invite the user to
 * leave the page and lose it.
 */
export function createSaveQueue(report: (state: SaveState) => void) {
  let tail: Promise<void> = Promise.resolve();
  let left = 0;
  return {
    /** Queues a save; the task resolves to the state it ends in (saved, or failed with why). */
    add(task: () => Promise<SaveState>): Promise<void> {
      left++;
      report({ status: "saving" });
      tail = tail.then(async () => {
        const state = await task().catch((e: Error): SaveState => ({ status: "failed", message: e.message }));
        left--;
        report(state.status === "saved" && left > 0 ? { status: "saving" } : state);
      });
      return tail;
    },
  };
}
