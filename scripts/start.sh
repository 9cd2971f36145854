#!/usr/bin/env bash
# Runs the product with the demo scenario: private PostgreSQL, local SMTP fake, API + web app on one port.
# DATABASE_URL points it at an existing server instead; PORT (8080) and PGPORT (54329) move the ports.
set -euo pipefail
root=$(cd "$(dirname "$0")/.." && pwd)
cd "$root"
[ -d node_modules ] || npm ci

export PORT=${PORT:-8080}
pgport=${PGPORT:-54329}
if [ -z "${DATABASE_URL:-}" ]; then
  bash scripts/pg.sh start dev "$pgport"
  trap 'bash scripts/pg.sh stop dev "$pgport"' EXIT
  psql -h 127.0.0.1 -p "$pgport" -U postgres -tAc "select 1 from pg_database where datname = 'pitchcard'" | grep -q 1 \
    || psql -h 127.0.0.1 -p "$pgport" -U postgres -qc "create database pitchcard"
  export DATABASE_URL="postgres://postgres@127.0.0.1:$pgport/pitchcard"
fi

bash scripts/build-web.sh

# A secret of this machine's own, kept across restarts so sign-ins survive them.
mkdir -p .cache
[ -s .cache/jwt-secret ] || node -e "process.stdout.write(require('crypto').randomBytes(32).toString('base64url'))" > .cache/jwt-secret
export JWT_SECRET=${JWT_SECRET:-$(cat .cache/jwt-secret)}
export SMTP_FAKE=${SMTP_FAKE:-1} SMTP_PORT=${SMTP_PORT:-2525} SEED_DEMO=${SEED_DEMO:-1}
node_modules/.bin/tsx server/index.ts
