#!/usr/bin/env bash
# `npm start`: install what is missing, start PostgreSQL on loopback, migrate, seed the demo, build and serve.
set -euo pipefail
source "$(dirname "$0")/lib.sh"
cd "$ROOT"

npm_ensure
if [ -z "${DATABASE_URL:-}" ]; then
  DATABASE_URL="$(bash scripts/pg-up.sh loomwright | tail -n 1 | cut -d= -f2-)"
fi
export DATABASE_URL
PORT="${PORT:-3000}"
export PUBLIC_BASE_URL="${PUBLIC_BASE_URL:-http://127.0.0.1:$PORT}"

npx tsx scripts/db.ts migrate >&2
npx tsx scripts/db.ts seed >&2
build_ensure

cat >&2 <<MSG

  Loomwright is starting on $PUBLIC_BASE_URL
  Demo sign-in (password for all three: harrow-bench-24)
    lead@example.test        lead: runs, imports, stock, plans, team
    builder@example.test     builder: bench progress and printing
    technician@example.test  technician: scans and test results

MSG
exec npx next start -H 127.0.0.1 -p "$PORT"
