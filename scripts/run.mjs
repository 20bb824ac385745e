// `npm start` / `npm run dev`: prepares the environment, builds when needed, and runs Next.
// Migrations and the demo seed run inside the server at start (instrumentation.ts), so
// there is one path to a ready database whatever starts the server.
import path from "node:path";
import { spawn } from "node:child_process";
import { serverEnv } from "./server-env.mjs";
import { buildIfStale } from "./build-if-stale.mjs";

const ROOT = path.resolve(import.meta.dirname, "..");
const mode = process.argv[2] ?? "start";
const env = serverEnv();
const port = env.PORT || "3000";
if (mode === "start") buildIfStale(env);
// Production runs our own HTTP server around Next.js's handler (scripts/serve.mjs: the tile fast path).
const args = mode === "dev" ? [path.join(ROOT, "node_modules/next/dist/bin/next"), "dev", "-p", port] : [path.join(ROOT, "scripts/serve.mjs")];
console.log(`[kerfline] ${mode === "dev" ? "development server" : "server"} on http://localhost:${port} (data dir ${env.KERFLINE_DATA_DIR})`);
const child = spawn(process.execPath, args, { cwd: ROOT, stdio: "inherit", env: { ...env, PORT: port } });
for (const sig of ["SIGINT", "SIGTERM"]) process.on(sig, () => child.kill(sig));
child.on("exit", (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
