// `npm test`: every test tier, in order, then one summary line.
//   1. type check   2. production build (if stale)   3. vitest: unit + integration (PGlite)
//   4. the integration suite again on a PostgreSQL 15 server   5. Playwright e2e in Chromium
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";

const ROOT = path.resolve(import.meta.dirname, "..");
const RESULTS = path.join(ROOT, "test-results");
fs.mkdirSync(RESULTS, { recursive: true });
const node = process.execPath;
const bin = (p) => path.join(ROOT, "node_modules", p);
const env = { ...process.env, NEXT_TELEMETRY_DISABLED: "1" };

function run(label, cmd, args, extraEnv = {}) {
  console.log(`\n[kerfline test] ${label}`);
  const r = spawnSync(cmd, args, { cwd: ROOT, stdio: "inherit", env: { ...env, ...extraEnv } });
  return r.status === 0;
}

function vitestCounts(file) {
  try {
    const j = JSON.parse(fs.readFileSync(file, "utf8"));
    return { passed: j.numPassedTests ?? 0, failed: j.numFailedTests ?? 0, skipped: (j.numPendingTests ?? 0) + (j.numTodoTests ?? 0) };
  } catch {
    return { passed: 0, failed: 1, skipped: 0 };
  }
}

function playwrightCounts(file) {
  try {
    const s = JSON.parse(fs.readFileSync(file, "utf8")).stats;
    return { passed: s.expected ?? 0, failed: (s.unexpected ?? 0) + (s.flaky ?? 0), skipped: s.skipped ?? 0 };
  } catch {
    return { passed: 0, failed: 1, skipped: 0 };
  }
}

const results = [];
let ok = run("type check (tsc --noEmit)", node, [bin("typescript/bin/tsc"), "--noEmit"]);
if (!ok) results.push({ passed: 0, failed: 1, skipped: 0 });
ok = run("production build", node, [path.join(ROOT, "scripts/build-if-stale.mjs")]) && ok;

const vitestJson = path.join(RESULTS, "vitest.json");
fs.rmSync(vitestJson, { force: true });
run("unit and integration tests (vitest, PGlite)", node, [bin("vitest/vitest.mjs"), "run", "--reporter=default", "--reporter=json", `--outputFile.json=${vitestJson}`]);
results.push(vitestCounts(vitestJson));

const pgJson = path.join(RESULTS, "vitest-postgres.json");
fs.rmSync(pgJson, { force: true });
run("integration tests on PostgreSQL 15 (DATABASE_URL)", node, [
  path.join(ROOT, "scripts/with-postgres.mjs"),
  node,
  bin("vitest/vitest.mjs"),
  "run",
  "--project",
  "integration",
  "--reporter=default",
  "--reporter=json",
  `--outputFile.json=${pgJson}`,
]);
results.push(vitestCounts(pgJson));

const e2eJson = path.join(RESULTS, "e2e.json");
fs.rmSync(e2eJson, { force: true });
run("end-to-end tests (Playwright, Debian Chromium)", node, [bin("@playwright/test/cli.js"), "test"]);
results.push(playwrightCounts(e2eJson));

const total = results.reduce((a, r) => ({ passed: a.passed + r.passed, failed: a.failed + r.failed, skipped: a.skipped + r.skipped }), { passed: 0, failed: 0, skipped: 0 });
console.log(`\ntests: ${total.passed} passed, ${total.failed} failed, ${total.skipped} skipped`);
process.exit(total.failed > 0 || total.passed === 0 ? 1 : 0);
