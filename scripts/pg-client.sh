#!/usr/bin/env bash
# PostgreSQL's client programs and the connection DATABASE_URL names, for db-backup.sh,
# db-restore.sh and test.sh. Sourced after services.sh (ROOT, die).

# The newest installed copy of a PostgreSQL program (pg_dump must be as new as the server).
pg_tool() {
  local name="$1" found=""
  if [ -n "${TURNSTONE_PG_BIN:-}" ] && [ -x "$TURNSTONE_PG_BIN/$name" ]; then printf '%s' "$TURNSTONE_PG_BIN/$name"; return 0; fi
  found="$(ls -d /usr/lib/postgresql/*/bin/"$name" 2>/dev/null | sort -V | tail -1)"
  [ -n "$found" ] || found="$(command -v "$name" || true)"
  [ -n "$found" ] || die "$name is missing: install PostgreSQL's client programs (apt-get install postgresql-client)"
  printf '%s' "$found"
}

# Exports DATABASE_URL's parts as PGHOST, PGPORT, PGUSER, PGPASSWORD, PGDATABASE (and TLS
# settings), so the password never shows on a command line; stops with lib/env.ts's message when
# the configuration is wrong.
use_database_environment() {
  local lines name value
  lines="$(node --import tsx "$ROOT/scripts/pg-connection-env.ts")" || exit $?
  while IFS=$'\t' read -r name value; do
    if [ -n "$name" ]; then export "$name=$value"; fi
  done <<< "$lines"
}
