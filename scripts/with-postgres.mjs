// Runs a command against a throw-away PostgreSQL 15 server (Debian's binaries), so the
// DATABASE_URL code path is tested on every run: `node scripts/with-postgres.mjs CMD ARGS…`.
// The command gets KERFLINE_TEST_DATABASE_URL. PostgreSQL refuses to run as root, so as root
// the server runs as the `postgres` user.
import { spawnSync, execFileSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import net from "node:net";

const BIN = process.env.PG_BIN ?? "/usr/lib/postgresql/15/bin";
if (!fs.existsSync(path.join(BIN, "pg_ctl"))) {
  console.error(`[kerfline] PostgreSQL binaries not found in ${BIN}; install Debian's postgresql package.`);
  process.exit(1);
}
const port = await new Promise((resolve) => {
  const s = net.createServer().listen(0, "127.0.0.1", () => {
    const p = s.address().port;
    s.close(() => resolve(p));
  });
});
const dir = fs.mkdtempSync(path.join(os.tmpdir(), "kerfline-pg-"));
const asRoot = process.getuid?.() === 0;
const pg = (cmd, args) => {
  const full = [path.join(BIN, cmd), ...args];
  const [file, argv] = asRoot ? ["runuser", ["-u", "postgres", "--", ...full]] : [full[0], full.slice(1)];
  return execFileSync(file, argv, { stdio: ["ignore", "pipe", "pipe"] }).toString();
};
if (asRoot) execFileSync("chown", ["postgres:postgres", dir]);
let code = 1;
try {
  pg("initdb", ["-D", dir, "-A", "trust", "-U", "kerf", "--no-sync"]);
  pg("pg_ctl", ["-D", dir, "-o", `-p ${port} -k ${dir} -c listen_addresses=127.0.0.1 -c fsync=off`, "-l", path.join(dir, "log"), "-w", "start"]);
  const url = `postgres://kerf@127.0.0.1:${port}/postgres`;
  console.log(`[kerfline] PostgreSQL 15 test server on port ${port}`);
  const [cmd, ...args] = process.argv.slice(2);
  code = spawnSync(cmd, args, { stdio: "inherit", env: { ...process.env, KERFLINE_TEST_DATABASE_URL: url } }).status ?? 1;
} finally {
  try {
    pg("pg_ctl", ["-D", dir, "-m", "fast", "-w", "stop"]);
  } catch (e) {
    console.error("[kerfline] could not stop the test PostgreSQL server:", e.message);
  }
  fs.rmSync(dir, { recursive: true, force: true });
}
process.exit(code);
