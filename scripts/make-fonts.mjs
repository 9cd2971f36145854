// Remakes the web fonts in assets/fonts/: the app's four faces (Atkinson Hyperlegible 400/700, IBM Plex
// Mono 400/600, the TTFs that @expo-google-fonts ships and native still loads) cut down to the
// characters the app shows, as WOFF2. The four TTFs are 380 kB; the subsets are a fraction of that.
//
//   node scripts/make-fonts.mjs
//
// Run it again after the app starts showing a character outside Latin that the fonts should draw: every
// non-ASCII character in the app's sources is kept (when the face has it), besides the fixed set below.
// public/index.html declares the faces under the family names constants/theme.ts uses; build-web.sh
// copies the files into the export.
import { mkdirSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import subsetFont from 'subset-font';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const require = createRequire(import.meta.url);
const out = path.join(root, 'assets', 'fonts');

const faces = [
  [
    'AtkinsonHyperlegible_400Regular',
    '@expo-google-fonts/atkinson-hyperlegible/400Regular/AtkinsonHyperlegible_400Regular.ttf',
  ],
  ['AtkinsonHyperlegible_700Bold', '@expo-google-fonts/atkinson-hyperlegible/700Bold/AtkinsonHyperlegible_700Bold.ttf'],
  ['IBMPlexMono_400Regular', '@expo-google-fonts/ibm-plex-mono/400Regular/IBMPlexMono_400Regular.ttf'],
  ['IBMPlexMono_600SemiBold', '@expo-google-fonts/ibm-plex-mono/600SemiBold/IBMPlexMono_600SemiBold.ttf'],
];

const range = (from, to) => Array.from({ length: to - from + 1 }, (_, i) => String.fromCodePoint(from + i)).join('');

// Latin (Basic, Latin-1 Supplement with × · ° ± µ ² ÷, Extended-A for people's and places' names) and
// the typography and signs the app writes: dashes, quotes, ellipsis, bullets, minus, arrows, ≤ ≥, ⌀.
const fixed = range(0x20, 0x7e) + range(0xa0, 0x17f) + '–—‘’‚“”„•…‹›′″−×·°±µ²³≤≥≈≠→←↔↑↓⌀π∆Δ✓✕';

/** Every non-ASCII character in the app's own sources (screens, components, contracts' messages). */
function sourceCharacters() {
  const seen = new Set();
  const walk = (dir) => {
    for (const name of readdirSync(dir)) {
      const p = path.join(dir, name);
      if (statSync(p).isDirectory()) walk(p);
      else if (/\.(ts|tsx)$/.test(name))
        for (const ch of readFileSync(p, 'utf8')) if (ch.codePointAt(0) > 0x7e) seen.add(ch);
    }
  };
  for (const dir of ['app', 'components', 'hooks', 'constants', 'lib', 'db/contracts']) walk(path.join(root, dir));
  return [...seen].join('');
}

const text = [...new Set(fixed + sourceCharacters())].sort().join('');
mkdirSync(out, { recursive: true });
for (const [family, ttf] of faces) {
  const source = readFileSync(require.resolve(ttf));
  const woff2 = await subsetFont(source, text, { targetFormat: 'woff2' });
  writeFileSync(path.join(out, `${family}.woff2`), woff2);
  console.log(`${family}.woff2: ${(woff2.length / 1024).toFixed(1)} kB (TTF ${(source.length / 1024).toFixed(1)} kB)`);
}
