import { describe, expect, it } from "vitest";
import { createSaveQueue, type SaveState } from "./save-queue";

/** A save the test finishes by hand, so two can be in the queue at once. */
function deferred() {
  let finish: (s: SaveState) => void = () => {};
  const done = new Promise<SaveState>((resolve) => (finish = resolve));
  return { task: () => done, finish };
}

const settle = () => new Promise((r) => setTimeout(r, 0));

describe("the save queue", () => {
  it("says saved only once the last queued change has been sent", async () => {
    const states: string[] = [];
    const queue = createSaveQueue((s) => states.push(s.status));
    const pad = deferred();
    const ruler = deferred();
    const order: string[] = [];
    void queue.add(async () => (order.push("pad"), pad.task()));
    void queue.add(async () => (order.push("ruler"), ruler.task()));
    await settle();
    expect(order).toEqual(["pad"]); // one at a time, in order
    pad.finish({ status: "saved" });
    await settle();
    expect(states.at(-1)).toBe("saving");
    expect(order).toEqual(["pad", "ruler"]);
    ruler.finish({ status: "saved" });
    await settle();
    expect(states).toEqual(["saving", "saving", "saving", "saved"]);
  });

  it("reports a failure with its reason and goes on with the next save", async () => {
    const states: SaveState[] = [];
    const queue = createSaveQueue((s) => states.push(s));
    void queue.add(() => Promise.reject(new Error("Someone else changed this shape.")));
    await queue.add(() => Promise.resolve<SaveState>({ status: "saved" }));
    expect(states.slice(2)).toEqual([{ status: "failed", message: "Someone else changed this shape." }, { status: "saved" }]);
  });
});
