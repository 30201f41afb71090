#!/usr/bin/env bash
# `npm test`: install what is missing, start a test database on loopback, then typecheck, lint, unit, integration
# and end-to-end tests; ends with one line "N passed, N failed".
set -uo pipefail
source "$(dirname "$0")/lib.sh"
cd "$ROOT"

apt_ensure chromium chromium pdftoppm poppler-utils zbarimg zbar-tools dmtxread dmtx-utils || exit 1
if ! ls /usr/lib/postgresql/*/bin/initdb >/dev/null 2>&1; then apt_ensure __none__ postgresql || exit 1; fi
npm_ensure || exit 1

for db in loomwright_test loomwright_e2e; do bash scripts/pg-up.sh "$db" >/dev/null || exit 1; done
PGPORT="${PGPORT_LOOMWRIGHT:-54329}"
export TEST_DATABASE_URL="${TEST_DATABASE_URL:-postgres://postgres@127.0.0.1:$PGPORT/loomwright_test}"
export E2E_DATABASE_URL="${E2E_DATABASE_URL:-postgres://postgres@127.0.0.1:$PGPORT/loomwright_e2e}"
export DATABASE_URL="$TEST_DATABASE_URL"
export CHROMIUM_PATH="${CHROMIUM_PATH:-$(command -v chromium)}"

mkdir -p .cache
PASSED=0
FAILED=0
step() { # name, command...
  local name="$1"; shift
  log "── $name"
  if "$@"; then PASSED=$((PASSED + 1)); else FAILED=$((FAILED + 1)); log "$name FAILED"; fi
}
vitest_step() { # project
  local p="$1" out=".cache/vitest-$1.json"
  rm -f "$out"
  log "── $p tests"
  npx vitest run --project "$p" --reporter=default --reporter=json --outputFile.json="$out"
  local rc=$?
  if [ -f "$out" ]; then
    local np nf
    read -r np nf < <(node -e 'const r=require(process.argv[1]);console.log(r.numPassedTests, r.numFailedTests)' "$ROOT/$out")
    PASSED=$((PASSED + np)); FAILED=$((FAILED + nf))
    log "$p: $np passed, $nf failed"
    # A suite that fails to load or a failing hook fails no single test: count it once.
    if [ $rc -ne 0 ] && [ "$nf" -eq 0 ]; then FAILED=$((FAILED + 1)); log "$p exited $rc without a failing test"; fi
  else
    FAILED=$((FAILED + 1)); log "$p: no report (exit $rc)"
  fi
}

step "typecheck" npx tsc --noEmit
step "lint" npm run --silent lint
vitest_step unit
# Integration and end-to-end tests run against the built app, each on its own database and port.
step "build" npx next build
vitest_step integration
vitest_step e2e

echo "$PASSED passed, $FAILED failed"
[ "$FAILED" -eq 0 ]
