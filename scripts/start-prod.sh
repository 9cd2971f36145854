#!/usr/bin/env bash
# start-prod.sh api|worker: runs the compiled server (`npm run build` made it) with plain node, in
# production mode, against the environment as given: DATABASE_URL and JWT_SECRET at least (README,
# "Running it for many builds"). No private database, no SMTP fake, no demo data, no supervisor: the
# host's process manager (systemd, a container runtime) restarts it; exit code 78 means the
# configuration is wrong and a restart cannot help.
set -euo pipefail
root=$(cd "$(dirname "$0")/.." && pwd)
case "${1:-}" in
  api) entry=server/index.js ;;
  worker) entry=server/worker.js ;;
  *) echo "usage: start-prod.sh api|worker" >&2; exit 2 ;;
esac
build=${BUILD_DIR:-$root/build}
if [ ! -f "$build/$entry" ]; then
  echo "$build/$entry is missing: run \`npm run build\` first (from the sources: \`npm start\` or \`npm run worker:dev\`)" >&2
  exit 78
fi
export NODE_ENV=${NODE_ENV:-production}
# exec: the process manager's SIGTERM reaches node itself, which drains and exits.
exec node "$build/$entry"
