#!/usr/bin/env bash
# Exports the web app into dist/ when its sources changed since the last export.
set -euo pipefail
root=$(cd "$(dirname "$0")/.." && pwd)
cd "$root"
stamp=dist/index.html
if [ -f "$stamp" ] && [ -z "$(find index.ts app components hooks constants assets db/contracts app.json babel.config.js package.json package-lock.json -newer "$stamp" -type f 2>/dev/null | head -1)" ]; then
  exit 0
fi
echo "exporting the web app…"
# The QR reader's wasm is served from our own origin (its default location is a CDN, unreachable offline);
# it must be the copy of the zxing-wasm that barcode-detector bundles.
mkdir -p public
cp "$(node -p "require.resolve('zxing-wasm/reader/zxing_reader.wasm')")" public/zxing_reader.wasm
# Metro's cache in a known folder makes a second export take seconds.
export EXPO_NO_TELEMETRY=1 CI=${CI:-1}
node_modules/.bin/expo export --platform web --output-dir dist --max-workers 2 > .cache-export.log 2>&1 || { cat .cache-export.log; exit 1; }
rm -f .cache-export.log
