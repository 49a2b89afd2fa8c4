#!/usr/bin/env bash
# npm run db:backup: the database as one consistent snapshot (pg_dump --format=custom, read by
# pg_restore) and, beside it, the photo store's object list (JSON: key, size, etag, last
# modified), both named with the UTC time. TURNSTONE_BACKUP_DIR picks the folder (default
# <data folder>/backups). The photos themselves stay in the store: back them up there.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"
source "$ROOT/scripts/services.sh"
source "$ROOT/scripts/pg-client.sh"

if [ $# -gt 0 ]; then echo "usage: npm run db:backup" >&2; exit 2; fi

BACKUP_DIR="$(realpath -m "${TURNSTONE_BACKUP_DIR:-$DATA_DIR/backups}")"
PG_DUMP="$(pg_tool pg_dump)"
use_database_environment

# Dumps hold people's names and e-mail addresses: readable by this user only.
umask 077
mkdir -p "$BACKUP_DIR"
stamp="$(date -u +%Y-%m-%dT%H%M%SZ)"
dump="$BACKUP_DIR/turnstone-$stamp.dump"
objects="$BACKUP_DIR/turnstone-$stamp.objects.json"
if [ -e "$dump" ] || [ -e "$objects" ]; then die "$dump already exists: try again in a second"; fi

log "Dumping database $PGDATABASE on $PGHOST:$PGPORT"
# Written under a temporary name first, so a failed run never leaves a file that looks complete.
"$PG_DUMP" --format=custom --file="$dump.partial" || { rm -f "$dump.partial"; die "pg_dump failed: no backup written"; }
mv "$dump.partial" "$dump"

log "Listing the photo store's objects"
if ! node --import tsx --conditions=react-server scripts/list-photo-objects.ts > "$objects.partial"; then
  rm -f "$objects.partial"
  die "listing the photo store failed (the database dump $dump is complete)"
fi
mv "$objects.partial" "$objects"

log "Database dump: $dump"
log "Photo store's object list: $objects"
