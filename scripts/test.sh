#!/usr/bin/env bash
# npm test: PostgreSQL on loopback, typecheck, production build, unit + integration tests, browser
# tests; prints one summary line and leaves nothing running that it started.
set -uo pipefail
cd "$(dirname "$0")/.."

results=.test-results
rm -rf "$results" && mkdir -p "$results"
failed_steps=()

pg_was_running=0
./docker-less-pg.sh status >/dev/null 2>&1 && pg_was_running=1
cleanup() {
  if [ "$pg_was_running" = "0" ]; then ./docker-less-pg.sh stop || true; fi
}
trap cleanup EXIT

step() { printf '\n\033[1m== %s\033[0m\n' "$*"; }

step "PostgreSQL"
if ! ./docker-less-pg.sh start; then
  echo "could not start PostgreSQL"
  echo "Summary: 0 passed, 1 failed"
  exit 1
fi

step "Chromium for the browser tests"
chromium_bin="${CHROMIUM_PATH:-/usr/bin/chromium}"
if [ ! -x "$chromium_bin" ]; then
  if [ "$(id -u)" = "0" ] && command -v apt-get >/dev/null 2>&1; then
    echo "installing Debian's chromium (apt-get)"
    { apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium >/dev/null; } ||
      failed_steps+=("chromium")
  else
    echo "Chromium is missing at $chromium_bin: run 'apt-get install chromium' as root (or set CHROMIUM_PATH)"
    failed_steps+=("chromium")
  fi
fi
[ -x "$chromium_bin" ] && "$chromium_bin" --version 2>/dev/null | head -n 1

step "Lint and format (biome)"
npx biome ci --reporter=summary . || failed_steps+=("lint")

step "Typecheck"
npm run -s typecheck || failed_steps+=("typecheck")

# The build comes first: some integration tests drive the built server in process (test/support/built-app.ts).
step "Production build"
built=0
if npx react-router build >"$results/build.log" 2>&1; then
  tail -n 3 "$results/build.log"
  built=1
else
  cat "$results/build.log"
  failed_steps+=("build")
fi

step "Unit and integration tests"
npx vitest run --project unit --project integration \
  --reporter=default --reporter=json --outputFile.json="$results/tests.json" || failed_steps+=("unit/integration")

if [ "$built" = "1" ]; then
  step "Browser tests (Chromium)"
  npx vitest run --project e2e \
    --reporter=default --reporter=json --outputFile.json="$results/e2e.json" || failed_steps+=("browser")
fi

node - "$results" "${failed_steps[@]}" <<'JS'
const fs = require("node:fs");
const [dir, ...failedSteps] = process.argv.slice(2);
let passed = 0, failed = 0, skipped = 0;
// Each test step and the report it should have written.
const reports = { "unit/integration": "tests.json", browser: "e2e.json" };
for (const [step, f] of Object.entries(reports)) {
  const p = `${dir}/${f}`;
  let stepFailed = 0;
  if (fs.existsSync(p)) {
    const r = JSON.parse(fs.readFileSync(p, "utf8"));
    passed += r.numPassedTests; skipped += r.numPendingTests + (r.numTodoTests ?? 0);
    stepFailed += r.numFailedTests;
    // A file that failed to load counts as a failure even when none of its tests ran.
    stepFailed += r.testResults.filter((t) => t.status === "failed" && t.assertionResults.length === 0).length;
  }
  // A step that failed without a failing test to show for it (a crash, a failed setup, no report)
  // still counts once.
  if (failedSteps.includes(step) && stepFailed === 0) stepFailed = 1;
  failed += stepFailed;
}
// Every other failed step (chromium, lint, typecheck, build) counts as one failure of its own.
failed += failedSteps.filter((s) => !(s in reports)).length;
if (failedSteps.length) console.log(`\nFailed steps: ${failedSteps.join(", ")}`);
console.log(`\nSummary: ${passed} passed, ${failed} failed, ${skipped} skipped`);
process.exit(failed > 0 ? 1 : 0);
JS
