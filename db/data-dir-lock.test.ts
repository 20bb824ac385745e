import { describe, expect, it } from "vitest";
import { spawn } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { DataDirLockedError, lockDataDir } from "./data-dir-lock";

const tmp = () => fs.mkdtempSync(path.join(os.tmpdir(), "kerfline-lock-"));

describe("data dir lock", () => {
  it("refuses while another live process holds the lock", async () => {
    const dir = tmp();
    const other = spawn(process.execPath, ["-e", "setTimeout(() => {}, 20000)"]);
    try {
      fs.writeFileSync(path.join(dir, "kerfline.lock"), JSON.stringify({ pid: other.pid, since: "x" }));
      expect(() => lockDataDir(dir)).toThrow(DataDirLockedError);
      expect(() => lockDataDir(dir)).toThrow(/in use by another Kerfline server/);
    } finally {
      other.kill();
    }
  });

  it("takes over a lock left by a process that is gone", () => {
    const dir = tmp();
    fs.writeFileSync(path.join(dir, "kerfline.lock"), JSON.stringify({ pid: 2 ** 22 + 12345, since: "x" }));
    const release = lockDataDir(dir);
    expect(JSON.parse(fs.readFileSync(path.join(dir, "kerfline.lock"), "utf8")).pid).toBe(process.pid);
    release();
    expect(fs.existsSync(path.join(dir, "kerfline.lock"))).toBe(false);
  });

  it("takes over a half-written lock file", () => {
    const dir = tmp();
    fs.writeFileSync(path.join(dir, "kerfline.lock"), "{");
    lockDataDir(dir)();
  });
});
