// `npm run lint`: ESLint (Next.js rules, the one-way layers, no import cycles, file size),
// Prettier's format check, and knip (unused files, exports and dependencies). All three run;
// the exit code says whether any failed.
import { spawnSync } from "node:child_process";
import path from "node:path";

const ROOT = path.resolve(import.meta.dirname, "..");
const bin = (p) => path.join(ROOT, "node_modules", p);
const checks = [
  ["eslint", [bin("eslint/bin/eslint.js"), "--max-warnings", "0", "."]],
  ["prettier", [bin("prettier/bin/prettier.cjs"), "--check", "--log-level", "warn", "."]],
  ["knip", [bin("knip/bin/knip.js")]],
];
let failed = 0;
for (const [name, args] of checks) {
  const t0 = Date.now();
  const r = spawnSync(process.execPath, args, { cwd: ROOT, stdio: "inherit" });
  console.log(`[lint] ${name}: ${r.status === 0 ? "ok" : "FAILED"} (${((Date.now() - t0) / 1000).toFixed(0)} s)`);
  if (r.status !== 0) failed++;
}
process.exit(failed ? 1 : 0);
