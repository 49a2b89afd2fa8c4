#!/usr/bin/env bash
# npm start: set everything up on a fresh clone, then serve the demo with its worker.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
source "$ROOT/scripts/setup.sh"

if [ -z "${DATABASE_URL:-}" ]; then ensure_database turnstone; fi
node_modules/.bin/tsx scripts/migrate.ts
node_modules/.bin/tsx scripts/seed.ts
log "Building the app"
npm run --silent build

PORT="${PORT:-3000}"
export PORT
nohup node_modules/.bin/tsx workers/index.ts >"$DATA_DIR/worker.log" 2>&1 &
echo $! > "$DATA_DIR/worker.pid"
log "Worker started (log: .data/worker.log)"
log "Serving Turnstone on http://localhost:$PORT (stop with Ctrl+C or npm run stop)"
trap 'stop_pidfile "$DATA_DIR/worker.pid" "the worker"' EXIT
node scripts/serve.mjs -p "$PORT" &
echo $! > "$DATA_DIR/app.pid"
wait "$(cat "$DATA_DIR/app.pid")"
