#!/usr/bin/env bash
# supervise.sh COMMAND [ARGS…]: runs the server and starts it again when it dies (out of memory, a
# crash), so that one bad request cannot take the product down until someone notices; the database
# and the mail fake stay up meanwhile (start.sh owns them, not this loop).
#
# Bounded: it gives up after SUPERVISE_MAX_CRASHES (5) crashes in a row that each came less than
# SUPERVISE_QUICK_SECONDS (60) after a start — a server that cannot stay up needs a person, not a loop.
# A run that lasted longer resets the count. Between quick crashes it waits 1, 2 … SUPERVISE_BACKOFF_SECONDS (5) s.
# The server exiting 0 by itself (someone stopped it on purpose) or 78 (its configuration is wrong,
# which a restart cannot mend) ends the loop too.
#
# SIGTERM or SIGINT: passed on to the server as SIGTERM (it drains and exits), waited for at most
# SUPERVISE_STOP_SECONDS (20) before SIGKILL, then this script exits.
set -uo pipefail
[ $# -gt 0 ] || { echo "usage: supervise.sh COMMAND [ARGS…]" >&2; exit 2; }
max=${SUPERVISE_MAX_CRASHES:-5}
quick=${SUPERVISE_QUICK_SECONDS:-60}
backoff_max=${SUPERVISE_BACKOFF_SECONDS:-5}
stop_seconds=${SUPERVISE_STOP_SECONDS:-20}

child=""; stopping=""
on_signal() {
  stopping=1
  if [ -n "$child" ]; then kill -TERM "$child" 2>/dev/null || true; fi
}
trap on_signal INT TERM

describe() { if [ "$1" -gt 128 ]; then echo "killed by signal $(kill -l $(($1 - 128)) 2>/dev/null || echo $(($1 - 128)))"; else echo "exited with code $1"; fi; }

crashes=0
while [ -z "$stopping" ]; do
  started=$SECONDS
  "$@" &
  child=$!
  wait "$child"; rc=$?
  if [ -n "$stopping" ]; then
    # The wait above returned early for the signal: give the server its drain time, no more.
    # (A plain sleep we can kill, not a subshell: an orphaned sleep would hold our stdout open.)
    sleep "$stop_seconds" & timer=$!
    finished=""
    wait -n -p finished "$child" "$timer" 2>/dev/null
    if [ "$finished" = "$timer" ]; then
      echo "supervise: the server did not stop within ${stop_seconds}s: killing it" >&2
      kill -KILL "$child" 2>/dev/null
    fi
    wait "$child" 2>/dev/null
    kill "$timer" 2>/dev/null; wait "$timer" 2>/dev/null
    exit 0
  fi
  child=""
  [ "$rc" = 0 ] && exit 0
  [ "$rc" = 78 ] && { echo "supervise: the server stopped on a configuration error: not restarting it" >&2; exit 78; }
  up=$((SECONDS - started))
  # Only quick crashes count: one after a long run starts no streak and is restarted at once.
  if [ "$up" -lt "$quick" ]; then crashes=$((crashes + 1)); else crashes=0; fi
  if [ "$crashes" -ge "$max" ]; then
    echo "supervise: the server $(describe "$rc") $crashes times in a row, each within ${quick}s of starting: giving up" >&2
    exit "$rc"
  fi
  pause=$(( crashes < backoff_max ? crashes : backoff_max ))
  echo "supervise: the server $(describe "$rc") after ${up}s: starting it again in ${pause}s ($crashes of at most $max quick crashes in a row)" >&2
  # In the background so that a signal during the pause is handled at once.
  sleep "$pause" & pauser=$!
  wait "$pauser" 2>/dev/null
  kill "$pauser" 2>/dev/null || true
done
