#!/usr/bin/env bash
# npm run stop: stops everything npm start started for this checkout (the app and all its
# processes, the worker, the local fakes: found by their marks even when a pid file was lost,
# scripts/instance.sh) and the project's PostgreSQL cluster.
set -euo pipefail
source "$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)/services.sh"
services_down
log "Stopped"
