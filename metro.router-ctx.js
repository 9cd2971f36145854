// Expo Router's route context on the web (metro.config.js puts it in place of expo-router/_ctx): every
// page of app/ loaded when first opened (async routes, app.json), as expo-router's own context does, but
// the layouts bundled with the entry. Every visit draws the root layout and its guard at once, and
// expo-router reads every layout (its `unstable_settings`) while it builds the route tree; lazy, the
// layouts were one more round trip (nine small files) between the entry's script and the first paint.

// The same files as expo-router/_ctx.web.js (every route and layout, not +api, +middleware, +html),
// split in two: the layouts, bundled with the entry, and the pages, each its own chunk.
const layouts = require.context('./app', true, /^\.\/(?:.*\/)?_layout\.[tj]sx?$/, 'sync');
const pages = require.context(
  './app',
  true,
  /^(?:\.\/)(?!(?:.*\/)?_layout\.[tj]sx?$)(?!(?:(?:(?:.*\+api)|(?:\+middleware)|(?:\+(html|native-intent))))\.[tj]sx?$).*(?:\.android|\.ios|\.native)?\.[tj]sx?$/,
  'lazy',
);
const layoutKeys = new Set(layouts.keys());

function load(key) {
  if (layoutKeys.has(key)) return layouts(key);
  return pages(key);
}
load.keys = () => [...layouts.keys(), ...pages.keys()];
load.resolve = (key) => (layoutKeys.has(key) ? layouts.resolve(key) : pages.resolve(key));
load.id = pages.id;

/**
 * Starts loading the page that `pathname` opens, before expo-router has drawn down to it: the page's
 * chunk then comes in while the entry starts up rather than after (components/navigation/
 * early-arrival.web.ts calls this for a person already signed in). Of the pages the path matches, the
 * most specific (most plain segments); none for +not-found. With it the first page of its folder's
 * stack (the layout's initialRouteName), which the stack mounts beneath it so that going back lands
 * there; not a group's first page, as a group's navigator here is the tab bar, which mounts a tab only
 * when it is shown. Each chunk loads once: expo-router's own load finds it on its way or done.
 */
load.preload = (pathname) => {
  const wanted = String(pathname)
    .split('/')
    .filter(Boolean)
    .map((s) => {
      try {
        return decodeURIComponent(s);
      } catch {
        return s;
      }
    });
  let best = null;
  let bestScore = -1;
  for (const key of pages.keys()) {
    const score = matchScore(key, wanted);
    if (score > bestScore) {
      best = key;
      bestScore = score;
    }
  }
  if (!best) return;
  const keys = [best];
  const folder = nearestLayoutFolder(best);
  if (folder !== null && !/(^|\/)\(.*\)$/.test(folder)) {
    const first = layouts(layoutKeyOf(folder))?.unstable_settings?.initialRouteName;
    const firstKey = first && pages.keys().find((k) => k.replace(/\.[tj]sx?$/, '') === `./${folder}/${first}`);
    if (firstKey && firstKey !== best) keys.push(firstKey);
  }
  for (const key of keys) Promise.resolve(pages(key)).catch(() => undefined);
};

/** The folder (without './') of the layout nearest above page `key`; null when only the root's. */
function nearestLayoutFolder(key) {
  const parts = key.replace(/^\.\//, '').split('/').slice(0, -1);
  for (let n = parts.length; n > 0; n--) {
    const folder = parts.slice(0, n).join('/');
    if (layoutKeyOf(folder)) return folder;
  }
  return null;
}

const layoutKeyOf = (folder) => [...layoutKeys].find((k) => k.replace(/\.[tj]sx?$/, '') === `./${folder}/_layout`);

/** How many plain segments of page `key` match `wanted`; -1 when it does not match at all. */
function matchScore(key, wanted) {
  const segments = key
    .replace(/^\.\//, '')
    .replace(/\.[tj]sx?$/, '')
    .split('/')
    .filter((s) => !/^\(.*\)$/.test(s));
  if (segments[segments.length - 1] === 'index') segments.pop();
  if (segments.some((s) => s.startsWith('+'))) return -1;
  let score = 0;
  for (let i = 0; i < segments.length; i++) {
    const s = segments[i];
    if (/^\[\.\.\..+\]$/.test(s)) return wanted.length > i ? score : -1;
    if (i >= wanted.length) return -1;
    if (/^\[.+\]$/.test(s)) continue;
    if (s !== wanted[i]) return -1;
    score++;
  }
  return segments.length === wanted.length ? score : -1;
}

export const ctx = load;
