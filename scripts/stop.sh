#!/usr/bin/env bash
# npm run stop: stops what npm start started (app, worker, local fakes, PostgreSQL).
set -euo pipefail
source "$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)/services.sh"
services_down
log "Stopped"
