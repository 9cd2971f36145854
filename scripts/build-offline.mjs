// What makes the exported web app installable and able to open without signal, in two steps that
// scripts/build-web.sh runs around `expo export`:
//
//   node scripts/build-offline.mjs icons            before: the manifest's icons into public/icons/
//   node scripts/build-offline.mjs service-worker [DIR]   after:  DIR/sw.js (Workbox, DIR defaults to
//                                                            dist/), precaching the export
//
// Plain JavaScript on purpose: Workbox writes the route matchers and plugins below into sw.js from
// their source text (Function#toString), so they must reach it exactly as written here, not as a
// TypeScript transform would rewrite them (helpers the service worker would not have).
import { existsSync, mkdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import sharp from 'sharp';
import { generateSW } from 'workbox-build';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const offline = JSON.parse(readFileSync(path.join(root, 'lib', 'offline-caches.json'), 'utf8'));

const iconSource = path.join(root, 'assets', 'images', 'icon.png');
const iconDir = path.join(root, 'public', 'icons');

/** The manifest's icons (public/manifest.webmanifest names them), made from the app's one icon. */
async function icons() {
  mkdirSync(iconDir, { recursive: true });
  const made = statSync(iconSource).mtimeMs;
  // The icon's own paper colour fills what the maskable and Apple icons add around it, so no seam shows.
  const { data } = await sharp(iconSource)
    .extract({ left: 0, top: 0, width: 1, height: 1 })
    .removeAlpha()
    .raw()
    .toBuffer({ resolveWithObject: true });
  const paper = { r: data[0], g: data[1], b: data[2], alpha: 1 };
  const jobs = [
    ['icon-192.png', (s) => s.resize(192, 192)],
    ['icon-512.png', (s) => s.resize(512, 512)],
    // A launcher may cut a maskable icon to any shape inside the middle 80 %: the drawing (which
    // reaches the icon's edges) is shrunk to 80 % and set on paper, so no rivet is cut off.
    [
      'icon-maskable-512.png',
      (s) => s.resize(410, 410).extend({ top: 51, bottom: 51, left: 51, right: 51, background: paper }),
    ],
    // iOS ignores the manifest's icons for the home screen and wants an opaque square of its own.
    ['apple-touch-icon.png', (s) => s.resize(180, 180).flatten({ background: paper })],
  ];
  for (const [name, shape] of jobs) {
    const out = path.join(iconDir, name);
    if (existsSync(out) && statSync(out).mtimeMs >= made) continue;
    await shape(sharp(iconSource)).png({ compressionLevel: 9 }).toFile(out);
  }
}

/**
 * Keeps each answer under the person it was fetched for (the subject of the bearer token the app sent),
 * so a phone passed from one person to the next never shows the first one's parts, even if an answer
 * lands in the cache after the sign-out emptied it. The app also empties these caches at sign-out
 * (lib/service-worker.web.ts, clearOfflineCaches). A token it cannot read files the answer under
 * "nobody", which no signed-in request asks for.
 *
 * No comments inside the functions given to Workbox: it joins their text onto one line, and a `//`
 * comment would swallow the rest of the function.
 */
const perPerson = {
  cacheKeyWillBeUsed: async ({ request }) => {
    let person = 'nobody';
    const token = /^Bearer\s+[^.\s]+\.([^.\s]+)\./.exec(request.headers.get('Authorization') || '');
    if (token) {
      try {
        person = String(JSON.parse(atob(token[1].replace(/-/g, '+').replace(/_/g, '/'))).sub || person);
      } catch {
        person = 'nobody';
      }
    }
    const key = new URL(request.url);
    key.searchParams.set('pitchcard-person', person);
    return key.href;
  },
};

async function serviceWorker(dist) {
  if (!existsSync(path.join(dist, 'index.html')))
    throw new Error(`${dist}/index.html is missing: export the web app first`);
  const { count, size, warnings } = await generateSW({
    globDirectory: dist,
    // The app shell: the page, the JS bundles (the entry and every screen's chunk: async routes load
    // a screen's code when it is first opened, so all of them are kept for opening it with no signal;
    // the QR reader's chunk too), fonts and images, the QR reader's wasm, the icons and the manifest.
    globPatterns: [
      'index.html',
      '_expo/static/**/*.{js,css}',
      'assets/**/*.{ttf,otf,woff,woff2,png,jpg,svg}',
      'fonts/*.woff2',
      'zxing_reader.wasm',
      'icons/*.png',
      'manifest.webmanifest',
      'favicon.ico',
    ],
    // Expo puts the fonts and images of packages under assets/node_modules/, which Workbox skips by default.
    globIgnores: [],
    // The wasm is about 1.1 MB and the entry bundle about as much; Workbox's default limit is 2 MB.
    maximumFileSizeToCacheInBytes: 8 * 1024 * 1024,
    // Expo names bundles, fonts and images by their content hash: no extra revision needed for those.
    dontCacheBustURLsMatching: /[.-][0-9a-f]{32}(@\dx)?\.\w+$/,
    swDest: path.join(dist, path.basename(offline.serviceWorker)),
    // One file: no workbox-*.js beside it to keep in step, and nothing the content policy must allow.
    inlineWorkboxRuntime: true,
    mode: 'production',
    sourcemap: false,
    cacheId: 'pitchcard',
    cleanupOutdatedCaches: true,
    // A new build takes over as soon as it is installed; the page already open keeps the code it runs,
    // and the next load (or reload) gets the new version. Claiming makes the first visit work offline
    // without a second load.
    skipWaiting: true,
    clientsClaim: true,
    // A single-page app: every path of the app opens the same page, which routes on the device.
    navigateFallback: '/index.html',
    navigateFallbackDenylist: [/^\/api(\/|$)/],
    runtimeCaching: [
      {
        // What the bench reads: the person, the parts in progress, a part (its holes and steps), its
        // findings, and a label's look-up. Fresh from the server when it answers within a few seconds;
        // otherwise the last answer kept on the phone. Only GET (a tick is a POST and never cached: it
        // waits as a paused, persisted mutation in the app instead).
        urlPattern: ({ url, sameOrigin }) =>
          sameOrigin && /^\/api\/(auth\/me|travelers|travelers\/[^/]+|findings)$/.test(url.pathname),
        handler: 'NetworkFirst',
        method: 'GET',
        options: {
          cacheName: offline.api,
          networkTimeoutSeconds: 4,
          cacheableResponse: { statuses: [200] },
          expiration: { maxEntries: 300, maxAgeSeconds: 14 * 24 * 3600 },
          plugins: [perPerson],
        },
      },
      {
        // Finding photos: signed links that expire, so only a few, for a short while.
        urlPattern: ({ url, sameOrigin }) => sameOrigin && url.pathname.startsWith('/api/photos/'),
        handler: 'CacheFirst',
        method: 'GET',
        options: {
          cacheName: offline.photos,
          cacheableResponse: { statuses: [200] },
          expiration: { maxEntries: 40, maxAgeSeconds: 24 * 3600 },
        },
      },
    ],
  });
  for (const w of warnings) console.warn(`service worker: ${w}`);
  console.log(`service worker: ${count} files precached (${(size / 1024 / 1024).toFixed(1)} MB)`);
}

const step = process.argv[2];
if (step === 'icons') await icons();
else if (step === 'service-worker') await serviceWorker(path.resolve(root, process.argv[3] ?? 'dist'));
else {
  console.error('usage: node scripts/build-offline.mjs icons | service-worker [DIR]');
  process.exit(2);
}
