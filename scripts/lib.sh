# Shared shell helpers for start.sh and test.sh (sourced, not run).
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
export NEXT_TELEMETRY_DISABLED=1

log() { printf '\033[1;33m[loomwright]\033[0m %s\n' "$*" >&2; }

# Installs Debian packages that are missing (by the command they provide).
apt_ensure() {
  local missing=()
  while [ $# -gt 0 ]; do
    command -v "$1" >/dev/null 2>&1 || missing+=("$2")
    shift 2
  done
  [ ${#missing[@]} -eq 0 ] && return 0
  if [ "$(id -u)" -ne 0 ]; then log "missing Debian packages: ${missing[*]} (run as root to install them)"; return 1; fi
  log "installing Debian packages: ${missing[*]}"
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq >&2
  apt-get install -y -qq "${missing[@]}" >&2
}

# Installs node_modules from the lock when it is missing or older than the lock.
npm_ensure() {
  cd "$ROOT"
  if [ ! -f node_modules/.package-lock.json ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
    log "installing npm packages from the lock (npm ci)"
    npm ci --no-audit --no-fund >&2
  fi
}

# Builds the app when there is no build or a source file is newer than it.
build_ensure() {
  cd "$ROOT"
  if [ -f .next/BUILD_ID ] && [ -z "$(find app components lib fonts public tailwind.config.ts next.config.mjs package-lock.json -newer .next/BUILD_ID -print -quit 2>/dev/null)" ]; then
    return 0
  fi
  log "building the app (next build)"
  npx next build >&2
}
