#!/usr/bin/env bash
# Exports the web app into dist/ (or the folder given as the first argument, e.g. for the web benchmark)
# when its sources changed since the last export, then makes the service worker that lets it open
# without signal (scripts/build-offline.mjs).
set -euo pipefail
root=$(cd "$(dirname "$0")/.." && pwd)
cd "$root"
out=${1:-dist}
# The service worker is written last, so an export that stopped half-way is done again next time.
stamp=$out/sw.js
if [ -f "$stamp" ] && [ -z "$(find index.ts app components hooks constants assets lib public db/contracts app.json babel.config.js metro.config.js metro.zod-locales.js metro.router-ctx.js package.json package-lock.json scripts/build-web.sh scripts/build-offline.mjs -newer "$stamp" -type f 2>/dev/null | head -1)" ]; then
  exit 0
fi
echo "exporting the web app into $out…"
# The QR reader's wasm is served from our own origin (its default location is a CDN, unreachable offline);
# it must be the copy of the zxing-wasm that barcode-detector bundles.
mkdir -p public
cp "$(node -p "require.resolve('zxing-wasm/reader/zxing_reader.wasm')")" public/zxing_reader.wasm
# The manifest's icons, made from assets/images/icon.png (public/manifest.webmanifest names them).
node scripts/build-offline.mjs icons
# Metro's cache in a known folder makes a second export take seconds. public/index.html is Expo's own
# page template for web output "single" (it links the manifest and declares the fonts); expo export
# fills in the bundles. Async routes (app.json) split every screen into its own chunk.
export EXPO_NO_TELEMETRY=1 CI=${CI:-1}
log=$(mktemp "${TMPDIR:-/tmp}/pitchcard-export.XXXXXX")
node_modules/.bin/expo export --platform web --output-dir "$out" --max-workers 2 > "$log" 2>&1 || { cat "$log"; rm -f "$log"; exit 1; }
rm -f "$log"
# The web fonts (WOFF2 subsets, scripts/make-fonts.mjs), where public/index.html's @font-face rules look.
mkdir -p "$out/fonts"
cp assets/fonts/*.woff2 "$out/fonts/"
node scripts/build-offline.mjs service-worker "$out"
