#!/usr/bin/env bash
# npm start: set everything up on a fresh clone, then serve Turnstone with its worker. On the
# project's own cluster that is the demo network; on a configured database (DATABASE_URL, and
# always in production) an empty network, whose first organiser `npm run setup:organiser` creates.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
# shellcheck source=scripts/services.sh
source "$ROOT/scripts/services.sh"

# A second start would rebuild .next under the running server and lose track of its processes.
if report_running_instance; then exit 0; fi

source "$ROOT/scripts/setup.sh"

PORT="${PORT:-3000}"
export PORT
if port_open "$PORT"; then die "port $PORT is in use by another program: choose another with PORT=<port> npm start"; fi

if [ -z "${DATABASE_URL:-}" ]; then ensure_database turnstone; fi
node --import tsx scripts/migrate.ts
# Seeds the demo only into the project's own cluster; elsewhere says how to create the first organiser.
node --import tsx scripts/seed.ts
log "Building the app"
npm run --silent build

mkdir -p "$DATA_DIR"
start_marked worker nohup node --import tsx workers/index.ts >"$DATA_DIR/worker.log" 2>&1
echo $! > "$DATA_DIR/worker.pid"
log "Worker started (log: $DATA_DIR/worker.log)"
trap 'stop_marked worker' EXIT
start_marked app node scripts/serve.mjs -p "$PORT"
echo $! > "$DATA_DIR/app.pid"
echo "http://localhost:$PORT" > "$DATA_DIR/app.url"
log "Serving Turnstone on http://localhost:$PORT (stop with Ctrl+C or npm run stop)"
wait "$(cat "$DATA_DIR/app.pid")"
