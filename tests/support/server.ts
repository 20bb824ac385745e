// Starts a real Kerfline server (the production build, `scripts/serve.mjs`) on a free port with its
// own data dir, for integration tests and benchmarks. No mocks: real PGlite on disk or a real
// PostgreSQL server, real HTTP.
import { spawn, type ChildProcess } from "node:child_process";
import fs from "node:fs";
import net from "node:net";
import os from "node:os";
import path from "node:path";
// @ts-expect-error plain ESM helper shared with the start script
import { serverEnv } from "../../scripts/server-env.mjs";

const ROOT = path.resolve(import.meta.dirname, "../..");

export type RunningServer = {
  url: string;
  dataDir: string;
  proc: ChildProcess;
  logs: () => string;
  stop: () => Promise<void>;
  kill: () => Promise<void>;
};

export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.listen(0, "127.0.0.1", () => {
      const port = (s.address() as net.AddressInfo).port;
      s.close(() => resolve(port));
    });
    s.on("error", reject);
  });
}

export function tempDataDir(prefix = "kerfline-test-"): string {
  return fs.mkdtempSync(path.join(os.tmpdir(), prefix));
}

/** Spawns a server; resolves once /api/health answers, or rejects with its logs if it exits. */
export async function startServer(opts: { dataDir?: string; env?: Record<string, string>; timeoutMs?: number } = {}): Promise<RunningServer> {
  const dataDir = opts.dataDir ?? tempDataDir();
  const port = await freePort();
  const env = serverEnv({ ...process.env, KERFLINE_DATA_DIR: dataDir, PORT: String(port), ...opts.env });
  // The same server as `npm start` (scripts/serve.mjs: Next.js with the tile fast path, 65 s keep-alive).
  const proc = spawn(process.execPath, [path.join(ROOT, "scripts/serve.mjs")], {
    cwd: ROOT,
    env,
    stdio: ["ignore", "pipe", "pipe"],
  });
  let out = "";
  proc.stdout!.on("data", (d) => (out += d));
  proc.stderr!.on("data", (d) => (out += d));
  const url = `http://localhost:${port}`;
  const exited = new Promise<number>((resolve) => proc.once("exit", (code) => resolve(code ?? 1)));
  const deadline = Date.now() + (opts.timeoutMs ?? 90_000);
  const server: RunningServer = {
    url,
    dataDir,
    proc,
    logs: () => out,
    stop: async () => {
      if (proc.exitCode !== null) return;
      proc.kill("SIGTERM");
      await exited;
    },
    kill: async () => {
      if (proc.exitCode !== null) return;
      proc.kill("SIGKILL");
      await exited;
    },
  };
  for (;;) {
    if (proc.exitCode !== null) throw Object.assign(new Error(`server exited with code ${proc.exitCode}:\n${out}`), { exitCode: proc.exitCode, logs: out });
    if (Date.now() > deadline) {
      await server.kill();
      throw new Error(`server did not become ready:\n${out}`);
    }
    try {
      const res = await fetch(`${url}/api/health`);
      if (res.ok) return server;
    } catch {
      /* not listening yet */
    }
    await Promise.race([new Promise((r) => setTimeout(r, 250)), exited]);
  }
}
