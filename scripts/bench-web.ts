/**
 * npm run bench:web — how heavy and how quick the web app is beside an empty Expo Router app built from
 * the same lock file with the same `expo export` flags (its floor: what any app on this stack loads).
 *
 * Prints, as figures and never as pass/fail:
 *   - first-screen JavaScript, gzip: every script the sign-in page loads (and, for the record, what a
 *     traveler opened straight from its link loads), against the empty app's, beside the 1.2× target;
 *   - paint: the median over BENCH_LOADS (7, at most 25) cold loads in headless Chromium of the time
 *     until the page shows its content (the empty app's one screen; a traveler's screen with its holes
 *     drawn, two animation frames after they are in the page), against the empty app's beside 1.5×, and
 *     a 2,000-hole traveler against the demo's 55-hole one beside 1.3×. First-contentful-paint is
 *     printed alongside;
 *   - with BENCH_WATERFALL=1, one cold traveler load as a waterfall: each request the page made (its
 *     start and end), the first paint and the moment the holes were in, in time order.
 *
 * Both exports go under the system's temporary folder (never dist/): the product through
 * scripts/build-web.sh, the empty app from a one-screen app/ that links this project's node_modules.
 * The folder keeps its name between runs so Metro's cache makes the next run quick. The product runs
 * as the browser tests run it (tests/e2e/helpers/served-app.ts): the real API on its own database of
 * the test cluster, the demo plus a 2,000-hole part; it starts the cluster when TEST_DATABASE_URL is not
 * set (TEST_PGPORT, 54330 by default) and stops it again if it started it. Everything listens on
 * 127.0.0.1 only, and every wait is bounded.
 */
import { execFileSync } from 'node:child_process';
import { copyFileSync, existsSync, mkdirSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import compression from 'compression';
import express from 'express';
import type { Browser, BrowserContext, BrowserContextOptions } from 'playwright-core';
import request from 'supertest';
import { DEMO_PASSWORD, DEMO_SKIN_REVISION, DEMO_USERS } from '../server/dev/seed';
import { launchBrowser } from '../tests/e2e/helpers/browser';
import { startTestApp, type TestApp } from '../tests/helpers/test-app';
import { median, testClusterForBench } from './bench-common';

const root = path.join(__dirname, '..');
const work = path.join(os.tmpdir(), 'pitchcard-bench-web');
const productOut = path.join(work, 'export-product');
const emptyApp = path.join(work, 'app-empty');
const emptyOut = path.join(work, 'export-empty');
const LOADS = Math.min(25, Math.max(3, Number(process.env.BENCH_LOADS ?? 7) || 7));
/** One page load gives up after this long. */
const LOAD_TIMEOUT_MS = 60_000;
const TARGET_JS = 1.2;
const TARGET_PAINT = 1.5;
const TARGET_BIG_PART = 1.3;
const BIG_PART_HOLES = 2000;

const kB = (n: number) => `${(n / 1000).toFixed(1)} kB`;
const ms = (n: number) => `${n.toFixed(0)} ms`;
const ratio = (a: number, b: number, target: number) =>
  `${(a / b).toFixed(2)}× (target ≤ ${target}×: ${a / b <= target ? 'within' : 'over'})`;

/** The empty app: one screen, this project's lock file and node_modules, the same web output. */
function exportEmptyApp() {
  mkdirSync(path.join(emptyApp, 'app'), { recursive: true });
  const pkg = JSON.parse(readFileSync(path.join(root, 'package.json'), 'utf8'));
  writeFileSync(
    path.join(emptyApp, 'package.json'),
    JSON.stringify(
      {
        name: 'empty',
        version: '1.0.0',
        private: true,
        main: 'expo-router/entry',
        dependencies: pkg.dependencies,
        devDependencies: pkg.devDependencies,
        overrides: pkg.overrides,
      },
      null,
      2,
    ),
  );
  copyFileSync(path.join(root, 'package-lock.json'), path.join(emptyApp, 'package-lock.json'));
  if (!existsSync(path.join(emptyApp, 'node_modules')))
    symlinkSync(path.join(root, 'node_modules'), path.join(emptyApp, 'node_modules'), 'dir');
  writeFileSync(
    path.join(emptyApp, 'app.json'),
    JSON.stringify(
      {
        expo: {
          name: 'Empty',
          slug: 'empty',
          scheme: 'empty',
          web: { bundler: 'metro', output: 'single' },
          plugins: ['expo-router'],
        },
      },
      null,
      2,
    ),
  );
  // Its own Metro cache: Metro keys a transform by the file and the settings, not by the project, so
  // expo-router's route context transformed for another project (its app/ folder baked in) could
  // otherwise be reused here.
  writeFileSync(
    path.join(emptyApp, 'metro.config.js'),
    [
      "const path = require('node:path');",
      "const { getDefaultConfig } = require('expo/metro-config');",
      "const { FileStore } = require('metro-cache');",
      'const config = getDefaultConfig(__dirname);',
      "config.cacheStores = [new FileStore({ root: path.join(__dirname, '.metro-cache') })];",
      'module.exports = config;',
      '',
    ].join('\n'),
  );
  writeFileSync(
    path.join(emptyApp, 'app', 'index.tsx'),
    [
      "import { Text, View } from 'react-native';",
      '',
      'export default function Index() {',
      "  return <View testID=\"empty-screen\" style={{ flex: 1, justifyContent: 'center', alignItems: 'center' }}><Text>An empty app</Text></View>;",
      '}',
      '',
    ].join('\n'),
  );
  // The flags scripts/build-web.sh gives the product's export.
  execFileSync(
    path.join(emptyApp, 'node_modules', '.bin', 'expo'),
    ['export', '--platform', 'web', '--output-dir', emptyOut, '--max-workers', '2'],
    {
      cwd: emptyApp,
      stdio: ['ignore', 'ignore', 'inherit'],
      env: { ...process.env, EXPO_NO_TELEMETRY: '1', CI: process.env.CI ?? '1' },
    },
  );
}

/** An export served as the product serves its own: compressed, with every path answered by the page. */
async function serveStatic(dir: string): Promise<{ base: string; close: () => Promise<void> }> {
  const app = express();
  app.use(compression());
  app.use(express.static(dir, { index: false, maxAge: '1h' }));
  app.use((_req, res) => {
    res.sendFile(path.join(dir, 'index.html'));
  });
  const server = createServer(app);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  return {
    base: `http://127.0.0.1:${(server.address() as AddressInfo).port}`,
    close: () =>
      new Promise((r) => {
        server.closeAllConnections();
        server.close(() => r());
      }),
  };
}

/** A list answer, whether the endpoint pages (`{ items, next }`) or not. */
const itemsOf = <T>(body: T[] | { items: T[] }): T[] => (Array.isArray(body) ? body : body.items);

/**
 * A part with about 2,000 holes: a published design of the demo kit (five lines of 200 in at 0.5 in
 * pitch) and a second build of the kit for the demo builder, which makes its travelers.
 */
async function addBigPart(t: TestApp): Promise<void> {
  const supplier = await t.signIn(DEMO_USERS.supplier.email);
  const as = (r: request.Test) => r.set({ Authorization: `Bearer ${supplier}` });
  const kits = itemsOf<{ id: string; code: string }>((await as(request(t.app).get('/api/kits'))).body);
  const kit = kits.find((k) => k.code === 'NK-2') ?? kits[0];
  const lines = ['A', 'B', 'C', 'D', 'E'].map((code) => ({
    code,
    name: `Bench line ${code}`,
    surface: 'flat',
    startIn: 0,
    lengthIn: 200,
    zones: [{ fromIn: 0, toIn: 200, pitchIn: 0.5 }],
  }));
  const created = await as(request(t.app).post('/api/designs')).send({
    design: { kitModelId: kit.id, partNumber: 'W-990', name: 'Bench panel, many holes', kind: 'skin_panel' },
    // The demo skin's sheet and rivets, over a far longer chord with many more holes.
    revision: { ...DEMO_SKIN_REVISION, chordIn: 200, lines, steps: ['Rivet the lines'] },
  });
  if (created.status !== 201)
    throw new Error(`making the big part's design: ${created.status} ${JSON.stringify(created.body)}`);
  const revisionId = created.body.revisions[0].id;
  const published = await as(request(t.app).post(`/api/revisions/${revisionId}/publish`)).send({});
  if (published.status !== 200)
    throw new Error(`publishing the big part: ${published.status} ${JSON.stringify(published.body)}`);
  const build = await as(request(t.app).post('/api/builds')).send({
    kitModelId: kit.id,
    kitSerial: 'NK2-BENCH',
    builderEmail: DEMO_USERS.builder.email,
    inspectorEmail: DEMO_USERS.inspector.email,
  });
  if (build.status !== 201) throw new Error(`shipping the bench kit: ${build.status} ${JSON.stringify(build.body)}`);
}

type Part = { id: string; partNumber: string; holes: number };

async function benchParts(t: TestApp): Promise<{ small: Part; big: Part }> {
  const builder = await t.signIn(DEMO_USERS.builder.email);
  const get = async (url: string) =>
    (
      await request(t.app)
        .get(url)
        .set({ Authorization: `Bearer ${builder}` })
    ).body;
  const parts = itemsOf<{ id: string; partNumber: string }>(await get('/api/travelers?limit=100'));
  const withHoles = async (p: { id: string; partNumber: string } | undefined): Promise<Part> => {
    if (!p) throw new Error("a bench part is missing from the builder's travelers");
    return { id: p.id, partNumber: p.partNumber, holes: (await get(`/api/travelers/${p.id}`)).holes.length };
  };
  return {
    small: await withHoles(parts.find((p) => p.partNumber === 'W-104')),
    big: await withHoles(parts.find((p) => p.partNumber === 'W-990')),
  };
}

const contextOptions: BrowserContextOptions = {
  viewport: { width: 390, height: 844 },
  deviceScaleFactor: 2,
  isMobile: true,
  hasTouch: true,
  // Every load cold and straight from the server: the product's service worker would otherwise answer
  // the later loads from its own copy, which the empty app has no counterpart of.
  serviceWorkers: 'block',
};

/**
 * Records in the page when every selector matches an element, and the time two animation frames
 * later (the frame with them has been painted by then). Source text rather than a function: tsx's
 * transform would wrap a function's inner functions in a helper the page does not have.
 */
const readyWatcher = (selectors: string[]) => `(() => {
  const selectors = ${JSON.stringify(selectors)};
  const check = () => {
    if (window.__seen !== undefined || !selectors.every((s) => document.querySelector(s))) return;
    window.__seen = performance.now();
    requestAnimationFrame(() => requestAnimationFrame(() => { window.__ready = performance.now(); }));
  };
  new MutationObserver(check).observe(document, { childList: true, subtree: true });
})();`;

type Load = {
  scripts: { url: string; gzip: number }[];
  ready: number;
  fcp: number | null;
  /** Every request the page made: its path, kind and times (ms from the start of the load). */
  requests: { path: string; kind: string; start: number; end: number }[];
  /** When the watched elements were all in the page. */
  seen: number;
};

/** One load of `url` in a fresh context: the scripts it fetched (gzip of the exported file) and its times. */
async function load(
  browser: Browser,
  base: string,
  dir: string,
  url: string,
  selectors: string[],
  storageState?: BrowserContextOptions['storageState'],
): Promise<Load> {
  const context: BrowserContext = await browser.newContext({ ...contextOptions, baseURL: base, storageState });
  try {
    const page = await context.newPage();
    const scripts: string[] = [];
    page.on('request', (r) => {
      if (r.resourceType() === 'script' && r.url().startsWith(base)) scripts.push(new URL(r.url()).pathname);
    });
    await page.addInitScript(readyWatcher(selectors));
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(String(e)));
    await page.goto(url);
    await page
      .waitForFunction(() => (window as unknown as { __ready?: number }).__ready !== undefined, undefined, {
        timeout: LOAD_TIMEOUT_MS,
      })
      .catch(async (err) => {
        const shot = path.join(work, 'load-failed.png');
        await page.screenshot({ path: shot });
        throw new Error(
          `${url} never showed ${selectors.join(' and ')} (screen in ${shot}; page errors: ${errors.join(' | ') || 'none'}): ${err}`,
        );
      });
    // Scripts asked for once the screen is up (a chunk that loads after) still count as the screen's.
    await page.waitForLoadState('networkidle', { timeout: LOAD_TIMEOUT_MS }).catch(() => undefined);
    const times = await page.evaluate(() => ({
      ready: (window as unknown as { __ready: number }).__ready,
      seen: (window as unknown as { __seen: number }).__seen,
      fcp: performance.getEntriesByName('first-contentful-paint')[0]?.startTime ?? null,
      requests: (performance.getEntriesByType('resource') as PerformanceResourceTiming[]).map((r) => ({
        path: new URL(r.name).pathname + new URL(r.name).search,
        kind: r.initiatorType,
        start: r.startTime,
        end: r.responseEnd,
      })),
    }));
    return {
      scripts: [...new Set(scripts)].map((p) => ({ url: p, gzip: gzipSync(readFileSync(path.join(dir, p))).length })),
      ...times,
    };
  } finally {
    await context.close().catch(() => undefined);
  }
}

const gzipTotal = (l: Load) => l.scripts.reduce((s, x) => s + x.gzip, 0);

async function main() {
  const started = Date.now();
  console.log(`exports into ${work} (never dist/)`);
  mkdirSync(work, { recursive: true });
  execFileSync('bash', [path.join(root, 'scripts', 'build-web.sh'), productOut], {
    cwd: root,
    stdio: ['ignore', 'inherit', 'inherit'],
  });
  rmSync(emptyOut, { recursive: true, force: true });
  exportEmptyApp();
  console.log(`exports done in ${((Date.now() - started) / 1000).toFixed(0)} s`);

  const stopCluster = testClusterForBench();

  // The product, as the browser tests serve it: the port first, so the app's own links name it.
  const server: Server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const productBase = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const t = await startTestApp({ port: (server.address() as AddressInfo).port, webDist: productOut });
  server.on('request', t.app);
  const empty = await serveStatic(emptyOut);
  let browser: Browser | undefined;
  try {
    await addBigPart(t);
    const { small, big } = await benchParts(t);
    browser = await launchBrowser();

    // Signed in once through the sign-in page; each later load starts a fresh context from this state.
    const signing = await browser.newContext({ ...contextOptions, baseURL: productBase });
    const page = await signing.newPage();
    await page.goto('/');
    await page.getByTestId('email').fill(DEMO_USERS.builder.email);
    await page.getByTestId('password').fill(DEMO_PASSWORD);
    await page.getByTestId('sign-in').click();
    // Signed in once the session is kept on the device (lib/storage.ts, storageKeys.session).
    await page
      .waitForFunction(() => !!localStorage.getItem('pitchcard.session'), undefined, { timeout: LOAD_TIMEOUT_MS })
      .catch(async (err) => {
        await page.screenshot({ path: path.join(work, 'sign-in-failed.png') });
        throw new Error(`signing in did not finish (screen in ${path.join(work, 'sign-in-failed.png')}): ${err}`);
      });
    const signedIn = await signing.storageState();
    await signing.close();

    const emptyScreen = ['[data-testid="empty-screen"]'];
    const travelerScreen = ['[data-testid="traveler-screen"]', '[data-testid="holes"] [data-testid^="hole-"]'];
    const signInScreen = ['[data-testid="sign-in"]'];

    // — Bytes: what the first screen fetches (the same on every load; one load each).
    const emptyFirst = await load(browser, empty.base, emptyOut, '/', emptyScreen);
    const signInFirst = await load(browser, productBase, productOut, '/', signInScreen);
    const travelerFirst = await load(
      browser,
      productBase,
      productOut,
      `/travelers/${small.id}`,
      travelerScreen,
      signedIn,
    );
    console.log('\nfirst-screen JavaScript (gzip of the scripts the page loads)');
    console.log(`  empty app:                ${kB(gzipTotal(emptyFirst))} in ${emptyFirst.scripts.length} files`);
    console.log(
      `  sign-in page:             ${kB(gzipTotal(signInFirst))} in ${signInFirst.scripts.length} files: ${ratio(gzipTotal(signInFirst), gzipTotal(emptyFirst), TARGET_JS)}`,
    );
    console.log(
      `  traveler page (its link): ${kB(gzipTotal(travelerFirst))} in ${travelerFirst.scripts.length} files: ${(gzipTotal(travelerFirst) / gzipTotal(emptyFirst)).toFixed(2)}×`,
    );
    for (const s of [...signInFirst.scripts].sort((a, b) => b.gzip - a.gzip).slice(0, 6))
      console.log(`    ${kB(s.gzip).padStart(9)}  ${path.basename(s.url)}`);

    // — Paint: cold loads, the three pages in turn so drift touches each alike.
    const runs = { empty: [] as Load[], small: [] as Load[], big: [] as Load[] };
    for (let i = 0; i < LOADS; i++) {
      runs.empty.push(await load(browser, empty.base, emptyOut, '/', emptyScreen));
      runs.small.push(await load(browser, productBase, productOut, `/travelers/${small.id}`, travelerScreen, signedIn));
      runs.big.push(await load(browser, productBase, productOut, `/travelers/${big.id}`, travelerScreen, signedIn));
    }
    const m = (ls: Load[]) => ({
      ready: median(ls.map((l) => l.ready)),
      fcp: median(ls.map((l) => l.fcp ?? NaN).filter((x) => !Number.isNaN(x))),
    });
    const e = m(runs.empty),
      s = m(runs.small),
      b = m(runs.big);
    if (process.env.BENCH_WATERFALL) {
      const w = await load(browser, productBase, productOut, `/travelers/${small.id}`, travelerScreen, signedIn);
      console.log(`\nwaterfall of one cold load of traveler ${small.partNumber} (ms from the start of the load)`);
      const rows: [number, string][] = w.requests.map((r) => [
        r.start,
        `${ms(r.start).padStart(8)} – ${ms(r.end).padEnd(8)} ${r.kind.padEnd(7)} ${r.path.slice(0, 80)}`,
      ]);
      if (w.fcp !== null) rows.push([w.fcp, `${ms(w.fcp).padStart(8)}   first-contentful-paint`]);
      rows.push([w.seen, `${ms(w.seen).padStart(8)}   the traveler and its holes in the page`]);
      for (const [, line] of rows.sort((a, b) => a[0] - b[0])) console.log(line);
    }

    console.log(`\npaint, median of ${LOADS} cold loads (content shown; first-contentful-paint in brackets)`);
    console.log(`  empty app:                       ${ms(e.ready)} (${ms(e.fcp)})`);
    console.log(
      `  traveler ${small.partNumber}, ${String(small.holes).padStart(4)} holes:   ${ms(s.ready)} (${ms(s.fcp)}): ${ratio(s.ready, e.ready, TARGET_PAINT)} the empty app`,
    );
    console.log(
      `  traveler ${big.partNumber}, ${String(big.holes).padStart(4)} holes:   ${ms(b.ready)} (${ms(b.fcp)}): ${ratio(b.ready, s.ready, TARGET_BIG_PART)} the ${small.holes}-hole one`,
    );
    if (Math.abs(big.holes - BIG_PART_HOLES) > BIG_PART_HOLES * 0.1)
      console.log(`  (the big part has ${big.holes} holes, not about ${BIG_PART_HOLES})`);
  } finally {
    await browser?.close().catch(() => undefined);
    await empty.close();
    server.closeAllConnections();
    await new Promise((r) => server.close(r));
    await t.close();
    stopCluster?.();
  }
  console.log(`\ndone in ${((Date.now() - started) / 1000).toFixed(0)} s`);
}

main().then(
  () => process.exit(0),
  (err) => {
    console.error(err);
    process.exit(1);
  },
);
