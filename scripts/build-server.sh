#!/usr/bin/env bash
# Compiles the server for plain `node` (no tsx, no dev dependencies at run time) into build/ or the
# folder given: build/server/index.js (API), build/server/worker.js (queue worker), build/db/migrations.
# Needs the dev dependencies (typescript); `npm prune --omit=dev` may follow.
set -euo pipefail
root=$(cd "$(dirname "$0")/.." && pwd)
cd "$root"
out=${1:-build}
case "$out" in /*) ;; *) out="$root/$out" ;; esac
# A clean folder: a file whose source was deleted must not linger in the build.
rm -rf "$out"
node_modules/.bin/tsc -p tsconfig.build.json --outDir "$out"
# db/migrate.ts finds the SQL beside itself (path.join(__dirname, 'migrations')).
cp -R db/migrations "$out/db/migrations"
# The study pool's thread entry: in the sources a JavaScript shim that compiles the task with tsx, a
# dev dependency; compiled, the task is JavaScript already and is required as it is.
cat > "$out/server/studies/study-worker.js" <<'JS'
'use strict';
// Written by scripts/build-server.sh: the compiled study task, loaded without tsx (see server/studies/study-worker.js).
module.exports = require('./study-task.js').runStudyTask;
JS
echo "server compiled into ${out#"$root"/}"
