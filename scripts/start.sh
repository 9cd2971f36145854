#!/usr/bin/env bash
# Runs the product with the demo scenario: private PostgreSQL, local SMTP fake, API + web app on one port.
# DATABASE_URL points it at an existing server instead; PORT (8080) and PGPORT (54329) move the ports.
# A server process that dies (out of memory, say) is started again by scripts/supervise.sh while the
# database stays up; Ctrl-C or SIGTERM stops the server (drained) and then the database.
# `npm start -- --lan` (or LAN=1): network mode for phones on the shop's network — listens on every
# interface, serves HTTPS with a certificate made on first start (kept in .cache/tls), and puts the
# machine's network address in QR labels and mail links. Plain `npm start` stays on loopback.
set -euo pipefail
root=$(cd "$(dirname "$0")/.." && pwd)
cd "$root"
for arg in "$@"; do
  case "$arg" in
    --lan) export LAN=1 ;;
    *) echo "unknown option $arg (use --lan for network mode)" >&2; exit 2 ;;
  esac
done
[ -d node_modules ] || npm ci

export PORT=${PORT:-8080}
pgport=${PGPORT:-54329}
own_pg=""
supervisor=""

# The server's whole process group first (drained, at most 20 s), then the database.
stop_server() {
  kill -TERM -- "-$supervisor" 2>/dev/null || return 0
  for _ in $(seq 200); do kill -0 -- "-$supervisor" 2>/dev/null || return 0; sleep 0.1; done
  kill -KILL -- "-$supervisor" 2>/dev/null || true
}
cleanup() {
  if [ -n "$supervisor" ]; then stop_server; fi
  if [ -n "$own_pg" ]; then bash scripts/pg.sh stop dev "$pgport"; fi
}
trap cleanup EXIT

if [ -z "${DATABASE_URL:-}" ]; then
  bash scripts/pg.sh start dev "$pgport"
  own_pg=1
  bash scripts/pg.sh ensure-db dev "$pgport" pitchcard
  # The URL carries the cluster's password (kept in .pgdata/dev.password, mode 0600).
  DATABASE_URL=$(bash scripts/pg.sh url dev "$pgport" pitchcard)
  export DATABASE_URL
fi

bash scripts/build-web.sh

# A secret of this machine's own, kept across restarts so sign-ins survive them; readable by us only,
# since whoever reads it can sign tokens for anyone.
mkdir -p .cache
[ -s .cache/jwt-secret ] || (umask 077 && node -e "process.stdout.write(require('crypto').randomBytes(32).toString('base64url'))" > .cache/jwt-secret)
chmod 600 .cache/jwt-secret
export JWT_SECRET=${JWT_SECRET:-$(cat .cache/jwt-secret)}
export SMTP_FAKE=${SMTP_FAKE:-1} SMTP_PORT=${SMTP_PORT:-2525} SEED_DEMO=${SEED_DEMO:-1}

# In the background so that a SIGTERM to this script is passed on at once (bash runs a trap only after
# a foreground command ends), and in a process group of its own (setsid) so that the server never
# outlives this script, even if the supervisor itself is killed. `node --import tsx`: one process per server.
setsid bash scripts/supervise.sh node --import tsx server/index.ts &
supervisor=$!
trap 'kill -TERM "$supervisor" 2>/dev/null || true' INT TERM
rc=0
wait "$supervisor" || rc=$?
# A trapped signal ends the first wait early: wait again until the supervisor has stopped the server.
while kill -0 "$supervisor" 2>/dev/null; do wait "$supervisor" || rc=$?; done
exit "$rc"
