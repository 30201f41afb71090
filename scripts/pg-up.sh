#!/usr/bin/env bash
# Starts a project-local PostgreSQL cluster on 127.0.0.1 (installing Debian's package when missing). Idempotent.
# Usage: scripts/pg-up.sh [dbname ...]   Prints DATABASE_URL lines for the databases it made sure exist.
# Env: PGPORT_LOOMWRIGHT (default 54329), PGDATA_LOOMWRIGHT (data dir override), PGDATA_RECORD=0 (do not record the
# data dir in .pgdata.path, for a throwaway second cluster that pg-down.sh must not stop).
set -euo pipefail
ROOT="$(cd "$(dirname "$0")/.." && pwd)"
PORT="${PGPORT_LOOMWRIGHT:-54329}"

pg_bin() {
  local d
  d=$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1 || true)
  [ -n "$d" ] && [ -x "$d/initdb" ] && echo "$d"
}

BIN="$(pg_bin || true)"
if [ -z "$BIN" ]; then
  echo "pg-up: PostgreSQL server binaries not found; installing Debian's postgresql package" >&2
  if [ "$(id -u)" -ne 0 ]; then echo "pg-up: need root to apt-get install postgresql" >&2; exit 1; fi
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq >&2
  apt-get install -y -qq postgresql >&2
  BIN="$(pg_bin)"
fi

# postgres refuses to run as root: run the server as the postgres system user.
AS_PG=()
if [ "$(id -u)" -eq 0 ]; then AS_PG=(runuser -u postgres --); fi

if [ -n "${PGDATA_LOOMWRIGHT:-}" ]; then
  PGDATA="$PGDATA_LOOMWRIGHT"
elif [ "$(id -u)" -ne 0 ] || runuser -u postgres -- test -x "$ROOT" 2>/dev/null; then
  PGDATA="$ROOT/.pgdata"
else
  # A repo under a 0700 directory cannot be reached by the postgres user; keep the data in the temp dir.
  HASH=$(printf '%s' "$ROOT" | sha1sum | cut -c1-12)
  PGDATA="${TMPDIR:-/tmp}/loomwright-pgdata-$HASH"
fi
[ "${PGDATA_RECORD:-1}" = "0" ] || echo "$PGDATA" > "$ROOT/.pgdata.path"

if [ ! -f "$PGDATA/PG_VERSION" ]; then
  mkdir -p "$PGDATA"
  chmod 700 "$PGDATA"
  [ "$(id -u)" -eq 0 ] && chown postgres: "$PGDATA"
  "${AS_PG[@]}" "$BIN/initdb" -D "$PGDATA" -U postgres --auth=trust -E UTF8 --no-locale >/dev/null
fi

if ! "${AS_PG[@]}" "$BIN/pg_ctl" -D "$PGDATA" status >/dev/null 2>&1; then
  # Loopback only; trust auth is acceptable only because nothing else can reach it.
  "${AS_PG[@]}" "$BIN/pg_ctl" -D "$PGDATA" -l "$PGDATA/server.log" -w -t 60 \
    -o "-c listen_addresses=127.0.0.1 -p $PORT -k $PGDATA -c max_connections=200" start >/dev/null
fi

for db in "${@:-loomwright}"; do
  if ! psql -h 127.0.0.1 -p "$PORT" -U postgres -d postgres -tAc "select 1 from pg_database where datname='$db'" | grep -q 1; then
    createdb -h 127.0.0.1 -p "$PORT" -U postgres "$db"
  fi
  echo "DATABASE_URL=postgres://postgres@127.0.0.1:$PORT/$db"
done
