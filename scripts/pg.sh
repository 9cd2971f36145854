#!/usr/bin/env bash
# Private PostgreSQL cluster for the product or its tests: pg.sh start|stop NAME PORT [test]
# The data folder is $PGDATA_DIR, else .pgdata/NAME in the project (git-ignored). initdb refuses root,
# so as root the cluster belongs to the postgres user; when that user cannot enter the project folder
# (a clone under a private temp folder, say) the cluster lives under the system temp folder instead.
set -euo pipefail
cmd=$1; name=$2; port=$3; mode=${4:-}
root=$(cd "$(dirname "$0")/.." && pwd)

data_dir() {
  if [ -n "${PGDATA_DIR:-}" ]; then echo "$PGDATA_DIR"; return; fi
  if [ "$(id -u)" != 0 ] || runuser -u postgres -- test -x "$root"; then echo "$root/.pgdata/$name"; return; fi
  echo "${TMPDIR:-/tmp}/pitchcard-pg-$(echo "$root" | md5sum | cut -c1-10)/$name"
}
data=$(data_dir)

find_bin() {
  local b
  for b in /usr/lib/postgresql/*/bin; do [ -x "$b/initdb" ] && { echo "$b"; return; }; done
  return 1
}

ensure_server() {
  if ! find_bin >/dev/null; then
    echo "PostgreSQL server not found: installing Debian's package" >&2
    [ "$(id -u)" = 0 ] || { echo "run as root, or install postgresql yourself" >&2; exit 1; }
    # Tell Debian not to create and start its own cluster.
    mkdir -p /etc/postgresql-common/createcluster.d
    echo "create_main_cluster = false" > /etc/postgresql-common/createcluster.d/no-main.conf
    apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq postgresql >/dev/null
  fi
}

as_owner() { if [ "$(id -u)" = 0 ]; then (cd / && runuser -u postgres -- "$@"); else "$@"; fi; }

case "$cmd" in
  start)
    ensure_server
    bin=$(find_bin)
    if [ ! -s "$data/PG_VERSION" ]; then
      mkdir -p "$data"
      if [ "$(id -u)" = 0 ]; then
        chmod 755 "$(dirname "$data")"
        chown postgres "$data"
        runuser -u postgres -- test -x "$data" || { echo "postgres cannot enter $data: set PGDATA_DIR to a folder it can reach" >&2; exit 1; }
      fi
      as_owner "$bin/initdb" -D "$data" -U postgres --auth=trust -E UTF8 --locale=C.UTF-8 >/dev/null
      {
        echo "listen_addresses = '127.0.0.1'"
        echo "port = $port"
        echo "unix_socket_directories = '$data'"
        echo "max_connections = 200"
        if [ "$mode" = test ]; then echo "fsync = off"; echo "synchronous_commit = off"; echo "full_page_writes = off"; fi
      } >> "$data/postgresql.conf"
    fi
    if ! as_owner "$bin/pg_ctl" -D "$data" status >/dev/null 2>&1; then
      as_owner "$bin/pg_ctl" -D "$data" -l "$data/server.log" -w -t 30 start >/dev/null
    fi
    ;;
  stop)
    bin=$(find_bin) || exit 0
    [ -s "$data/PG_VERSION" ] || exit 0
    as_owner "$bin/pg_ctl" -D "$data" -m fast -w stop >/dev/null 2>&1 || true
    ;;
  dir) echo "$data" ;;
  *) echo "usage: pg.sh start|stop|dir NAME PORT [test]" >&2; exit 2 ;;
esac
