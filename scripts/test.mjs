// `npm test`: every test tier, then each tier's time and one summary line.
//   1. lint (ESLint, Prettier, knip) ∥ type check ∥ production build (if stale)
//   2. vitest: unit + integration on PGlite ∥ the integration suite on a PostgreSQL 15 server
//      ∥ Playwright e2e in Chromium
// Tiers in one step run side by side: each starts its own server on a free port and spends
// much of its time waiting on it (jobs, restarts, animations), so they share two cores well;
// the e2e tests wait for states, not times, so a busy machine slows them without failing them.
// Output lines of a tier that runs beside another carry its name.
import { spawn } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import readline from "node:readline";

const ROOT = path.resolve(import.meta.dirname, "..");
const RESULTS = path.join(ROOT, "test-results");
fs.mkdirSync(RESULTS, { recursive: true });
const node = process.execPath;
const bin = (p) => path.join(ROOT, "node_modules", p);
const env = { ...process.env, NEXT_TELEMETRY_DISABLED: "1" };

/** Runs one tier; resolves to { ok, seconds }. */
function run(tier, prefixed) {
  const started = Date.now();
  console.log(`\n[kerfline test] ${tier.label}`);
  const child = spawn(node, tier.args, { cwd: ROOT, env: { ...env, ...tier.env }, stdio: prefixed ? ["ignore", "pipe", "pipe"] : "inherit" });
  if (prefixed) {
    for (const stream of [child.stdout, child.stderr]) {
      readline.createInterface({ input: stream }).on("line", (line) => console.log(`[${tier.short}] ${line}`));
    }
  }
  return new Promise((resolve) => {
    child.on("close", (code) => resolve({ tier, ok: code === 0, seconds: (Date.now() - started) / 1000 }));
  });
}

async function step(...tiers) {
  return Promise.all(tiers.map((t) => run(t, tiers.length > 1)));
}

function vitestCounts(file) {
  try {
    const j = JSON.parse(fs.readFileSync(file, "utf8"));
    // A file whose hook or import failed has no failed test, only a failed suite: count it too.
    const failedSuitesWithoutFailedTests = (j.testResults ?? []).filter(
      (r) => r.status === "failed" && !(r.assertionResults ?? []).some((a) => a.status === "failed"),
    ).length;
    return {
      passed: j.numPassedTests ?? 0,
      failed: (j.numFailedTests ?? 0) + failedSuitesWithoutFailedTests,
      skipped: (j.numPendingTests ?? 0) + (j.numTodoTests ?? 0),
    };
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

const vitestJson = path.join(RESULTS, "vitest.json");
const pgJson = path.join(RESULTS, "vitest-postgres.json");
const e2eJson = path.join(RESULTS, "e2e.json");
for (const f of [vitestJson, pgJson, e2eJson]) fs.rmSync(f, { force: true });

const vitest = (json) => [bin("vitest/vitest.mjs"), "run", "--reporter=default", "--reporter=json", `--outputFile.json=${json}`];
const TIERS = {
  lint: { label: "lint (ESLint, Prettier, knip)", short: "lint", args: [path.join(ROOT, "scripts/lint.mjs")] },
  types: { label: "type check (tsc --noEmit)", short: "types", args: [bin("typescript/bin/tsc"), "--noEmit"] },
  build: { label: "production build", short: "build", args: [path.join(ROOT, "scripts/build-if-stale.mjs")] },
  pglite: { label: "unit and integration tests (vitest, PGlite)", short: "pglite", args: vitest(vitestJson) },
  postgres: {
    label: "integration tests on PostgreSQL 15 (DATABASE_URL)",
    short: "postgres",
    args: [path.join(ROOT, "scripts/with-postgres.mjs"), node, ...vitest(pgJson), "--project", "integration"],
  },
  e2e: { label: "end-to-end tests (Playwright, Debian Chromium)", short: "e2e", args: [bin("@playwright/test/cli.js"), "test"] },
};

const started = Date.now();
const done = [];
done.push(...(await step(TIERS.lint, TIERS.types, TIERS.build)));
done.push(...(await step(TIERS.pglite, TIERS.postgres, TIERS.e2e)));

// A failed lint, type check or build counts as one failure each; the test tiers count their tests,
// and a test tier that exited with an error its counts do not show still counts as one failure.
const tierCounts = [vitestCounts(vitestJson), vitestCounts(pgJson), playwrightCounts(e2eJson)].map((c, i) =>
  done[3 + i].ok || c.failed > 0 ? c : { ...c, failed: 1 },
);
const counts = [...done.slice(0, 3).map((d) => (d.ok ? null : { passed: 0, failed: 1, skipped: 0 })), ...tierCounts].filter(Boolean);
const total = counts.reduce((a, r) => ({ passed: a.passed + r.passed, failed: a.failed + r.failed, skipped: a.skipped + r.skipped }), {
  passed: 0,
  failed: 0,
  skipped: 0,
});
console.log("\n[kerfline test] time per tier (tiers of one step ran side by side)");
for (const d of done) console.log(`  ${d.tier.label.padEnd(52)} ${d.seconds.toFixed(0).padStart(5)} s  ${d.ok ? "ok" : "FAILED"}`);
console.log(`  ${"whole run".padEnd(52)} ${((Date.now() - started) / 1000).toFixed(0).padStart(5)} s`);
console.log(`\ntests: ${total.passed} passed, ${total.failed} failed, ${total.skipped} skipped`);
process.exit(total.failed > 0 || total.passed === 0 ? 1 : 0);
