#!/usr/bin/env bash
# `npm start`: install what is missing, start PostgreSQL on loopback, migrate, seed the demo, build, start the local
# fake mail server (the demo's Mailbox) and serve.
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
# The demo catches all mail in the local fake mail server and shows it on the Mailbox page. A real deployment sets
# SMTP_URL to its mail service and leaves DEV_MAILBOX unset (off under NODE_ENV=production).
export SMTP_URL="${SMTP_URL:-smtp://127.0.0.1:2525}"
export DEV_MAILBOX="${DEV_MAILBOX:-1}"

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

SMTP_PID=""
if [ "$DEV_MAILBOX" = "1" ]; then
  node --import tsx scripts/fake-smtp.ts >&2 &
  SMTP_PID=$!
  log "fake mail server on $SMTP_URL; caught mail at $PUBLIC_BASE_URL/dev/mail"
fi
NEXT_PID=""
stop_all() {
  if [ -n "$NEXT_PID" ]; then kill "$NEXT_PID" 2>/dev/null || true; fi
  if [ -n "$SMTP_PID" ]; then kill "$SMTP_PID" 2>/dev/null || true; fi
  wait 2>/dev/null || true
}
trap stop_all EXIT
trap 'exit 130' INT
trap 'exit 143' TERM
node node_modules/next/dist/bin/next start -H 127.0.0.1 -p "$PORT" &
NEXT_PID=$!
wait "$NEXT_PID"
