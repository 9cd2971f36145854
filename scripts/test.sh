#!/usr/bin/env bash
# Every test: type check, lint (ESLint, Expo's rules) and format check (Prettier), then jest (engineering, server against a private PostgreSQL and SMTP fake,
# components, and the real-browser walk in headless Chromium). Extra arguments go to jest.
set -euo pipefail
root=$(cd "$(dirname "$0")/.." && pwd)
cd "$root"
[ -d node_modules ] || npm ci

# The browser tests drive Debian's Chromium: installed here when missing, as pg.sh installs PostgreSQL.
if [ -z "${CHROMIUM_PATH:-}" ] && ! command -v chromium >/dev/null 2>&1; then
  [ "$(id -u)" = 0 ] || { echo "Debian's chromium is missing: install it (apt-get install chromium) or set CHROMIUM_PATH" >&2; exit 1; }
  echo "Chromium not found: installing Debian's package" >&2
  apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium >/dev/null
fi

pgport=${TEST_PGPORT:-54330}
bash scripts/pg.sh start test "$pgport" test
trap 'bash scripts/pg.sh stop test "$pgport"' EXIT
# Each test file makes its own database on this cluster. The URL carries the cluster's password;
# by hand: TEST_DATABASE_URL=$(bash scripts/pg.sh url test 54330)
TEST_DATABASE_URL=$(bash scripts/pg.sh url test "$pgport")
export TEST_DATABASE_URL

node_modules/.bin/tsc --noEmit -p .
# Cached between runs under .cache/ (git-ignored); warnings print, errors fail.
node_modules/.bin/eslint --cache --cache-location .cache/eslint/ .
node_modules/.bin/prettier --check --log-level warn .
bash scripts/build-web.sh
node_modules/.bin/jest --ci "$@"
