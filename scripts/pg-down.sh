#!/usr/bin/env bash
# Stops the project-local PostgreSQL cluster started by pg-up.sh (no-op when it is not running).
set -euo pipefail
ROOT="$(cd "$(dirname "$0")/.." && pwd)"
[ -f "$ROOT/.pgdata.path" ] || { echo "pg-down: no cluster recorded"; exit 0; }
PGDATA="$(cat "$ROOT/.pgdata.path")"
BIN=$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1)
AS_PG=()
if [ "$(id -u)" -eq 0 ]; then AS_PG=(runuser -u postgres --); fi
if "${AS_PG[@]}" "$BIN/pg_ctl" -D "$PGDATA" status >/dev/null 2>&1; then
  "${AS_PG[@]}" "$BIN/pg_ctl" -D "$PGDATA" -m fast -w stop >/dev/null
  echo "pg-down: stopped"
else
  echo "pg-down: not running"
fi
