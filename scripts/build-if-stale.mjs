// Builds the app unless .next holds a production build newer than every source file,
// so `npm start` and the test harnesses do not rebuild what is already built.
import fs from "node:fs";
import path from "node:path";
import { spawnSync } from "node:child_process";

const ROOT = path.resolve(import.meta.dirname, "..");
const SOURCES = [
  "app",
  "components",
  "lib",
  "server",
  "db",
  "auth.ts",
  "auth.config.ts",
  "proxy.ts",
  "instrumentation.ts",
  "next.config.ts",
  "postcss.config.mjs",
  "package-lock.json",
  "types",
];

function newest(p) {
  let st;
  try {
    st = fs.statSync(p);
  } catch {
    return 0;
  }
  if (!st.isDirectory()) return st.mtimeMs;
  let m = st.mtimeMs;
  for (const e of fs.readdirSync(p)) if (e !== "node_modules") m = Math.max(m, newest(path.join(p, e)));
  return m;
}

export function buildIfStale(env = process.env) {
  const dist = path.join(ROOT, env.KERFLINE_DIST_DIR || ".next");
  // The stamp holds the newest source time seen when the last build STARTED, so an edit made
  // while a build runs still counts as newer than that build.
  const stamp = path.join(dist, "kerfline-sources-mtime");
  const built = fs.existsSync(path.join(dist, "BUILD_ID")) && fs.existsSync(stamp) ? Number(fs.readFileSync(stamp, "utf8")) : 0;
  const src = Math.max(...SOURCES.map((s) => newest(path.join(ROOT, s))));
  if (built >= src && env.KERFLINE_FORCE_BUILD !== "1") return;
  console.log("[kerfline] building the app (next build)…");
  const r = spawnSync(process.execPath, [path.join(ROOT, "node_modules/next/dist/bin/next"), "build"], {
    cwd: ROOT,
    stdio: "inherit",
    env: { ...env, NEXT_TELEMETRY_DISABLED: "1" },
  });
  if (r.status !== 0) process.exit(r.status ?? 1);
  fs.writeFileSync(stamp, String(src));
}

if (import.meta.url === `file://${process.argv[1]}`) buildIfStale();
