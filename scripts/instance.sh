#!/usr/bin/env bash
# The processes `npm start` runs for this checkout (its data folder, $DATA_DIR): the app, the
# worker and the local fakes. Each is started with TURNSTONE_STARTED_BY=<data folder> and
# TURNSTONE_PROCESS=<role> in its environment, which its children (the app's processes, tsx's
# runner) inherit; on Linux, /proc/<pid>/environ shows them for as long as the process lives. So
# `npm start` finds a running instance and `npm run stop` finds every process even when a pid file
# was lost or overwritten. Sourced by services.sh; expects DATA_DIR, ROOT and log().

INSTANCE_MARK="TURNSTONE_STARTED_BY=$DATA_DIR"
# How long the app (which gives requests in flight 10 s: serve.mjs) and the worker (5 s) may
# take to stop before they are killed.
STOP_WAIT_SECONDS=15

# Runs a command in the background, marked as this checkout's process of the given role.
start_marked() {
  local role="$1"; shift
  TURNSTONE_STARTED_BY="$DATA_DIR" TURNSTONE_PROCESS="$role" "$@" &
}

# Pids of this checkout's live processes, of the given roles (all roles when none is given).
marked_pids() {
  local file pid role
  [ -d /proc/self ] || { pidfile_pids "$@"; return; }
  # One grep over every process's environment; processes that end meanwhile are skipped.
  for file in $(grep -lzxF -- "$INSTANCE_MARK" /proc/[0-9]*/environ 2>/dev/null); do
    pid="${file#/proc/}"; pid="${pid%/environ}"
    if [ $# -gt 0 ]; then
      for role in "$@"; do
        if grep -qzxF -- "TURNSTONE_PROCESS=$role" "$file" 2>/dev/null; then printf '%s\n' "$pid"; break; fi
      done
    else
      printf '%s\n' "$pid"
    fi
  done
}

# Without /proc: the live pids the pid files name (app.pid, worker.pid, fakes.pid).
pidfile_pids() {
  local roles=("$@") role pid
  [ ${#roles[@]} -gt 0 ] || roles=(app worker fakes)
  for role in "${roles[@]}"; do
    pid="$(cat "$DATA_DIR/$role.pid" 2>/dev/null || true)"
    if [ -n "$pid" ] && running "$pid"; then printf '%s\n' "$pid"; fi
  done
}

# A pid file's process that an earlier version of these scripts started without the marks:
# alive, running one of our programs, from this checkout.
unmarked_leftover() {
  local pid="$1"
  [ -n "$pid" ] && running "$pid" && [ -d "/proc/$pid" ] || return 1
  [ "$(readlink "/proc/$pid/cwd" 2>/dev/null)" = "$ROOT" ] || return 1
  tr '\0' ' ' < "/proc/$pid/cmdline" 2>/dev/null | grep -qE 'serve\.mjs|workers/index\.ts|scripts/fakes\.ts'
}

# Alive and not a zombie (one that exited but whose parent has not collected it yet).
running() {
  local stat
  kill -0 "$1" 2>/dev/null || return 1
  [ -r "/proc/$1/stat" ] || return 0
  read -r stat 2>/dev/null < "/proc/$1/stat" || return 1
  stat="${stat##*) }"
  [ "${stat%% *}" != "Z" ]
}

join_pids() { tr '\n' ' ' | sed 's/ $//'; }

# Says where this checkout's Turnstone runs and returns 0, or returns 1 when it does not run.
report_running_instance() {
  local app worker url
  app="$(marked_pids app | join_pids)"
  worker="$(marked_pids worker | join_pids)"
  [ -n "$app$worker" ] || return 1
  url="$(cat "$DATA_DIR/app.url" 2>/dev/null || echo "an unknown address")"
  log "Turnstone is already running from this checkout on $url (app pid ${app:-none}, worker pid ${worker:-none}; logs in $DATA_DIR)."
  log "Nothing was built or started. To restart it: npm run stop, then npm start."
  return 0
}

# Stops this checkout's processes of the given roles: SIGTERM, then SIGKILL for any still there
# after STOP_WAIT_SECONDS. Their pid files go too.
stop_marked() {
  local role pid deadline
  local -a pids alive
  mapfile -t pids < <(marked_pids "$@")
  for role in "$@"; do
    pid="$(cat "$DATA_DIR/$role.pid" 2>/dev/null || true)"
    if unmarked_leftover "$pid" && [[ " ${pids[*]} " != *" $pid "* ]]; then pids+=("$pid"); fi
  done
  if [ ${#pids[@]} -gt 0 ]; then
    log "Stopping this checkout's $* processes (pid ${pids[*]})"
    kill -TERM "${pids[@]}" 2>/dev/null || true
    deadline=$((SECONDS + STOP_WAIT_SECONDS))
    while :; do
      alive=()
      for pid in "${pids[@]}"; do if running "$pid"; then alive+=("$pid"); fi; done
      [ ${#alive[@]} -eq 0 ] || [ "$SECONDS" -ge "$deadline" ] && break
      sleep 0.2
    done
    if [ ${#alive[@]} -gt 0 ]; then
      log "Still running after $STOP_WAIT_SECONDS s, killing pid ${alive[*]}"
      kill -KILL "${alive[@]}" 2>/dev/null || true
    fi
  fi
  for role in "$@"; do rm -f "$DATA_DIR/$role.pid"; done
}

stop_instance() {
  stop_marked app worker
  rm -f "$DATA_DIR/app.url"
  stop_marked fakes
}
