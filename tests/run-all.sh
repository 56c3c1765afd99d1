#!/usr/bin/env bash
# `npm test`: everything, in the order a failure is cheapest to find.
#   lint → typecheck → unit and API tests (vitest) → production build → browser tests (Chromium)
# Installs Debian's Chromium and PostgreSQL when missing (needs root, as on the project's machines):
# the API tests run once on SQLite and once on a PostgreSQL server they start (tests/support/postgres.ts).
set -euo pipefail
cd "$(dirname "$0")/.."
export NEXT_TELEMETRY_DISABLED=1
# Playwright empties test-results/ when it starts, so the runners' JSON reports live apart.
mkdir -p .test-reports

step() { printf '\n=== %s\n' "$*"; }
t0=$(date +%s)

if ! command -v chromium >/dev/null 2>&1; then
  step "installing Debian chromium for the browser tests"
  if [ "$(id -u)" = 0 ]; then
    apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium >/dev/null
  else
    echo "chromium is missing and this user cannot apt-get install it; run: sudo apt-get install -y chromium" >&2
    exit 1
  fi
fi

if ! ls /usr/lib/postgresql/*/bin/initdb >/dev/null 2>&1; then
  step "installing Debian postgresql for the API tests on PostgreSQL"
  if [ "$(id -u)" = 0 ]; then
    apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq postgresql >/dev/null
  else
    echo "postgresql is missing and this user cannot apt-get install it; run: sudo apt-get install -y postgresql" >&2
    exit 1
  fi
fi

step "lint"
npx eslint .
npx prettier --check . >/dev/null || { npx prettier --check . ; echo "run: npm run format" >&2; exit 1; }
# No import circle anywhere, type-only imports included.
npm run -s lint:circles
step "typecheck"
npx tsc --noEmit -p tsconfig.json
step "unit and API tests (vitest; the API suite on SQLite and on PostgreSQL)"
npx vitest run --reporter=default --reporter=json --outputFile.json=.test-reports/vitest.json
step "production build"
npx next build
step "browser tests (Playwright + Debian Chromium)"
PLAYWRIGHT_JSON_OUTPUT_NAME=.test-reports/playwright.json npx playwright test --reporter=list,json

node -e '
const fs = require("fs");
const v = JSON.parse(fs.readFileSync(".test-reports/vitest.json", "utf8"));
const p = JSON.parse(fs.readFileSync(".test-reports/playwright.json", "utf8"));
const passed = v.numPassedTests + (p.stats.expected ?? 0);
const failed = v.numFailedTests + (p.stats.unexpected ?? 0) + (p.stats.flaky ?? 0);
const skipped = v.numPendingTests + v.numTodoTests + (p.stats.skipped ?? 0);
console.log(`\nvitest: ${v.numPassedTests} passed, ${v.numFailedTests} failed; playwright: ${p.stats.expected} passed, ${p.stats.unexpected} failed`);
console.log(`${passed} passed, ${failed} failed, ${skipped} skipped`);
process.exit(failed ? 1 : 0);
'
echo "total time: $(( $(date +%s) - t0 )) s"
