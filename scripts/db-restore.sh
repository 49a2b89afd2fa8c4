#!/usr/bin/env bash
# npm run db:restore -- FILE [--yes]: restores a dump from npm run db:backup into the database
# DATABASE_URL names, which must be empty (no tables): never over a network's data. Asks first on
# a terminal; --yes (for scripts) skips the question, and without a terminal it is required.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"
source "$ROOT/scripts/services.sh"
source "$ROOT/scripts/pg-client.sh"

usage() { echo "usage: npm run db:restore -- FILE [--yes]" >&2; exit 2; }
file="" yes=""
for arg in "$@"; do
  case "$arg" in
    --yes) yes=1 ;;
    -*) echo "[turnstone] unknown option $arg" >&2; usage ;;
    *) [ -z "$file" ] || usage; file="$arg" ;;
  esac
done
[ -n "$file" ] || usage
[ -f "$file" ] || die "$file: no such file"

PG_RESTORE="$(pg_tool pg_restore)"
PSQL="$(pg_tool psql)"
"$PG_RESTORE" --list "$file" >/dev/null 2>&1 || die "$file is not a dump pg_restore can read (npm run db:backup writes them)"
use_database_environment

relations="$("$PSQL" -X -q -v ON_ERROR_STOP=1 -tAc "select count(*) from pg_class c join pg_namespace n on n.oid = c.relnamespace
  where c.relkind in ('r', 'p', 'v', 'm', 'S', 'f') and n.nspname not in ('pg_catalog', 'information_schema') and n.nspname not like 'pg_toast%'")" \
  || die "cannot reach database $PGDATABASE on $PGHOST:$PGPORT"
if [ "$relations" != "0" ]; then
  die "database $PGDATABASE on $PGHOST:$PGPORT is not empty ($relations tables, views or sequences): restore only into a new, empty database"
fi

if [ -z "$yes" ]; then
  [ -t 0 ] || { echo "[turnstone] not on a terminal: add --yes to restore without being asked" >&2; exit 2; }
  read -r -p "[turnstone] Restore $file into database $PGDATABASE on $PGHOST:$PGPORT? Type yes to go on: " answer
  [ "$answer" = "yes" ] || { log "Nothing restored"; exit 1; }
fi

log "Restoring $file into $PGDATABASE on $PGHOST:$PGPORT"
# One transaction: a restore that fails leaves the database as empty as it was.
"$PG_RESTORE" --no-owner --exit-on-error --single-transaction --dbname="$PGDATABASE" "$file" || die "pg_restore failed: nothing restored"
log "Restored. If the dump comes from an older Turnstone, npm run db:migrate brings it up to date."
