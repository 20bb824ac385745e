import os from "node:os";
import { describe, expect, it, vi } from "vitest";
import { tilingWorkerCount } from "./tiling";

describe("tilingWorkerCount", () => {
  // os.availableParallelism is Node's count of the cores this process may use; stand-ins of
  // 3 and 0 show the count follows it and never drops below one worker.
  it("starts one tiling worker per core, at least one", () => {
    const spy = vi.spyOn(os, "availableParallelism");
    try {
      spy.mockReturnValue(3);
      expect(tilingWorkerCount()).toBe(3);
      spy.mockReturnValue(0);
      expect(tilingWorkerCount()).toBe(1);
    } finally {
      spy.mockRestore();
    }
  });
});
