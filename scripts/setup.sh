#!/usr/bin/env bash
# Shared first steps of `npm start` and `npm test`: npm packages, .env, the configuration check,
# services.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"
# shellcheck source=scripts/services.sh
source "$ROOT/scripts/services.sh"

ensure_node_modules() {
  # Reinstall when node_modules is missing or older than the lock file.
  if [ ! -d node_modules ] || [ ! -f node_modules/.package-lock.json ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
    log "Installing npm packages (npm ci)"
    npm ci --no-audit --no-fund --loglevel=error
  fi
}

load_env_file() {
  if [ -f .env ]; then set -a; source .env; set +a; fi
}

ensure_env_file() {
  load_env_file
  # A deployment brings its own AUTH_SECRET (the check below names it when it is missing).
  if is_production; then return 0; fi
  if [ ! -f .env ] || ! grep -q '^AUTH_SECRET=' .env; then
    log "Writing a new AUTH_SECRET to .env"
    printf 'AUTH_SECRET=%s\n' "$(node -e 'console.log(require("crypto").randomBytes(32).toString("base64url"))')" >> .env
    load_env_file
  fi
}

ensure_node_modules
ensure_env_file
node --import tsx scripts/check-env.ts
services_up
