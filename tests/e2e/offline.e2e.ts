import { mkdtemp, writeFile } from 'node:fs/promises';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import sharp from 'sharp';
import request from 'supertest';
import type { SessionUser, TravelerDetail, TravelerSummary } from '@/db/contracts';
import { DEMO_USERS } from '@/server/dev/seed';
import { jpeg } from '../helpers/photos';
import { auth, startTestApp, type TestApp } from '../helpers/test-app';
import { fillSignIn, keptPhotoIds, launchBrowser, phonePage } from './helpers/browser';
import { webDist } from './helpers/served-app';

/**
 * The installable app at the bench with no signal, in Debian's headless Chromium against the real server:
 * the manifest and its icons; the service worker keeping the app shell and the bench's answers, so the
 * bench and a part in progress open after a reload with no signal; a tick and work started then wait on
 * the phone and reach the server when the signal returns, the work with the time it was started. And on a plain-http shop address (no secure context)
 * the scanner says the camera needs the https address, while the short code still opens the part.
 *
 * "No signal" is both Chromium's offline mode and a server that drops every connection: Chromium's
 * offline mode has not always reached the requests a service worker makes itself (Playwright issue
 * 2311), and with the server dropping them too the test cannot pass on a signal it should not have.
 */
jest.setTimeout(240_000);

let t: TestApp;
let server: Server;
let port: number;
let base: string;
let browser: Browser;
let signal = true;

beforeAll(async () => {
  server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  port = (server.address() as AddressInfo).port;
  t = await startTestApp({ port, webDist });
  server.on('request', (req, res) => {
    if (signal) {
      t.app(req, res);
      return;
    }
    req.socket.destroy();
  });
  base = `http://localhost:${port}`;
  browser = await launchBrowser();
});
// A test that fails while offline must not leave the server dropping the next test's connections.
afterEach(() => {
  signal = true;
});
afterAll(async () => {
  await browser?.close().catch(() => undefined);
  server?.closeAllConnections();
  await new Promise((r) => server?.close(r));
  await t?.close();
});

const visible = (page: Page, id: string) => page.locator(`[data-testid="${id}"]:visible`).first();

async function api<T>(url: string): Promise<T> {
  const token = await t.signIn(DEMO_USERS.builder.email);
  const res = await request(t.app).get(url).set(auth(token));
  if (res.status !== 200) throw new Error(`GET ${url}: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body as T;
}

/** The demo's inboard rib W-104 and a hole on it still to be riveted. */
async function pendingHoleOfW104() {
  const parts = (await api<{ items: TravelerSummary[] }>('/api/travelers')).items;
  const part = parts.find((p) => p.partNumber === 'W-104')!;
  const detail = await api<TravelerDetail>(`/api/travelers/${part.id}`);
  return { part, hole: detail.holes.find((h) => h.status === 'pending')!.holeId };
}

async function signIn(page: Page, at: string) {
  await page.goto(at);
  await fillSignIn(page, DEMO_USERS.builder.email);
  await visible(page, 'bench-screen').waitFor({ timeout: 30_000 });
}

/** Until the service worker is active and answers this page's requests. */
async function controlledByServiceWorker(page: Page): Promise<string> {
  return page.evaluate(async () => {
    const reg = await navigator.serviceWorker.ready;
    if (!navigator.serviceWorker.controller) {
      await new Promise((r) => navigator.serviceWorker.addEventListener('controllerchange', r, { once: true }));
    }
    return new URL(reg.active!.scriptURL).pathname;
  });
}

/** Until the visible element `id` has text matching `pattern` (a RegExp source: it runs in the page). */
async function showsText(page: Page, id: string, pattern: string) {
  await page.waitForFunction(
    ([testId, source]) =>
      Array.from(document.querySelectorAll(`[data-testid="${testId}"]`)).some(
        (e) => (e as HTMLElement).offsetParent !== null && new RegExp(source).test(e.textContent ?? ''),
      ),
    [id, pattern] as const,
    { timeout: 15_000 },
  );
}

async function goOffline(page: Page) {
  signal = false;
  await page.context().setOffline(true);
}

async function goOnline(page: Page) {
  signal = true;
  await page.context().setOffline(false);
}

describe('the installable app', () => {
  it('links a manifest that parses, opens standalone in our colours, and names icons that are served', async () => {
    const page = await phonePage(browser, base);
    await page.goto('/');
    const href = await page.locator('link[rel="manifest"]').getAttribute('href');
    expect(href).toBe('/manifest.webmanifest');
    const res = await page.request.get(href!);
    expect(res.status()).toBe(200);
    expect(res.headers()['content-type']).toMatch(/^application\/manifest\+json/);
    expect(res.headers()['cache-control']).toBe('no-cache');
    const manifest = JSON.parse(await res.text());
    expect(manifest).toMatchObject({
      name: 'Pitchcard',
      short_name: 'Pitchcard',
      display: 'standalone',
      start_url: '/',
      background_color: '#F3EEE2',
      theme_color: '#1C1A16',
    });

    const icons = manifest.icons as { src: string; sizes: string; type: string; purpose: string }[];
    expect(icons.map((i) => `${i.sizes} ${i.purpose}`).sort()).toEqual([
      '192x192 any',
      '512x512 any',
      '512x512 maskable',
    ]);
    const appleIcon = await page.locator('link[rel="apple-touch-icon"]').getAttribute('href');
    for (const [src, size] of [
      ...icons.map((i) => [i.src, Number(i.sizes.split('x')[0])] as const),
      [appleIcon!, 180] as const,
    ]) {
      const icon = await page.request.get(src);
      expect(icon.status()).toBe(200);
      expect(icon.headers()['content-type']).toBe('image/png');
      const meta = await sharp(await icon.body()).metadata();
      expect([meta.format, meta.width, meta.height]).toEqual(['png', size, size]);
    }

    // The service worker and the page it serves offline are asked for again at every load.
    const sw = await page.request.get('/sw.js');
    expect(sw.status()).toBe(200);
    expect(sw.headers()['content-type']).toMatch(/javascript/);
    expect(sw.headers()['cache-control']).toBe('no-cache');
    await page.context().close();
  });
});

describe('the bench with no signal', () => {
  it('reloads the bench and a part in progress from the phone, and a tick made offline reaches the server later', async () => {
    const { part, hole } = await pendingHoleOfW104();
    const me = await api<SessionUser>('/api/auth/me');

    const page = await phonePage(browser, base);
    // The service worker runs under the same content security policy as the page: neither may report a refusal.
    const refused: string[] = [];
    const watch = (m: { text: () => string }) => {
      if (/content security policy|refused to/i.test(m.text())) refused.push(m.text());
    };
    page.on('console', watch);
    page.context().on('serviceworker', (w) => w.on('console', watch));
    await signIn(page, '/');
    expect(await controlledByServiceWorker(page)).toBe('/sw.js');

    // Online once more under the service worker, which keeps what the bench and the part answered.
    await page.reload();
    await visible(page, `traveler-${part.shortCode}`).click();
    await visible(page, 'traveler-screen').waitFor({ timeout: 30_000 });
    await page.goto('/');
    await visible(page, `traveler-${part.shortCode}`).waitFor({ timeout: 30_000 });
    // Kept under the person who fetched them, never for whoever signs in next on this phone.
    const kept = await page.evaluate(async () => (await (await caches.open('pitchcard-api')).keys()).map((r) => r.url));
    expect(kept.length).toBeGreaterThan(0);
    for (const url of kept) expect(new URL(url).searchParams.get('pitchcard-person')).toBe(me.id);

    // The signal drops with the bench open: the part still opens, from what the phone kept.
    await goOffline(page);
    await visible(page, `traveler-${part.shortCode}`).click();
    await visible(page, 'traveler-screen').waitFor({ timeout: 30_000 });
    expect(await visible(page, 'part-number').textContent()).toContain('W-104');
    // Reloaded with no signal, the part's own address opens again (every app path is the same page,
    // kept on the phone), and so does the bench.
    await page.reload();
    await visible(page, 'traveler-screen').waitFor({ timeout: 30_000 });
    expect(
      await page.evaluate(() =>
        fetch('/api/health').then(
          () => 'answered',
          () => 'no signal',
        ),
      ),
    ).toBe('no signal');
    await visible(page, 'tab-bench').click();
    await visible(page, `traveler-${part.shortCode}`).waitFor({ timeout: 30_000 });
    await page.reload();
    await visible(page, `traveler-${part.shortCode}`).click();
    await visible(page, 'traveler-screen').waitFor({ timeout: 30_000 });

    await visible(page, `hole-${hole}`).click();
    await visible(page, 'part-waiting').waitFor({ timeout: 15_000 });
    expect(await visible(page, `hole-${hole}`).getAttribute('aria-checked')).toBe('true');
    // Work started with no signal shows as running at once and waits with the tick.
    const startedBy = Date.now();
    await visible(page, 'work-start').click();
    await visible(page, 'work-running').waitFor({ timeout: 15_000 });
    await showsText(page, 'part-waiting', '^2 changes waiting for signal');
    const meanwhile = await api<TravelerDetail>(`/api/travelers/${part.id}`);
    expect(meanwhile.holes.find((h) => h.holeId === hole)!.status).toBe('pending');
    expect(meanwhile.work!.running).toBeNull();

    // The bench says so too, over every part.
    await visible(page, 'tab-bench').click();
    await showsText(page, 'bench-waiting', '^2 changes on one part waiting for signal');

    const onlineAt = Date.now();
    await goOnline(page);
    await visible(page, 'bench-waiting').waitFor({ state: 'detached', timeout: 30_000 });
    const after = await api<TravelerDetail>(`/api/travelers/${part.id}`);
    expect(after.holes.find((h) => h.holeId === hole)!.status).toBe('installed');
    // The session starts when the button was pressed on the phone, not when the signal came back.
    const startedAt = Date.parse(after.work!.running!.startedAt);
    expect(startedAt).toBeGreaterThanOrEqual(startedBy - 1000);
    expect(startedAt).toBeLessThan(onlineAt);
    expect(refused).toEqual([]);
    await page.context().close();
  });
});

describe('a finding flagged with no signal', () => {
  it('waits on the phone with its photo through a reload, and reaches the server when the signal returns', async () => {
    const { part, hole } = await pendingHoleOfW104();
    const findingsOn = async () =>
      (await api<{ items: { id: string; holeIds: string[] }[] }>(`/api/findings?travelerId=${part.id}`)).items.filter(
        (f) => f.holeIds.includes(hole),
      );
    expect(await findingsOn()).toEqual([]);
    const photo = path.join(await mkdtemp(path.join(os.tmpdir(), 'pc-e2e-offline-')), 'hole.jpg');
    await writeFile(photo, await jpeg('#6d7378'));

    const page = await phonePage(browser, base);
    await signIn(page, '/');
    await controlledByServiceWorker(page);
    // Once with signal, so the phone keeps the part and its flag form's answers.
    await page.reload();
    await page.goto(`/travelers/${part.id}/flag?holes=${hole}`);
    await visible(page, 'flag-screen').waitFor({ timeout: 30_000 });

    await goOffline(page);
    await page.reload();
    await visible(page, 'flag-screen').waitFor({ timeout: 30_000 });
    await visible(page, 'finding-kind-hole_elongated').click();
    await visible(page, 'finding-note').fill(`${hole} oval, flagged with no signal`);
    const chooser = page.waitForEvent('filechooser');
    await visible(page, 'add-photo').click();
    await (await chooser).setFiles(photo);
    await visible(page, 'photo-0').waitFor();
    await visible(page, 'submit-finding').click();
    // Back on the part, which says the finding waits; the server has none yet.
    await visible(page, 'traveler-screen').waitFor({ timeout: 30_000 });
    await showsText(page, 'part-waiting', '^1 finding waiting for signal');
    expect(await findingsOn()).toEqual([]);
    // The phone closes the tab and opens it again, still with no signal: the finding and its photo wait on.
    await page.reload();
    await visible(page, 'traveler-screen').waitFor({ timeout: 30_000 });
    await showsText(page, 'part-waiting', '^1 finding waiting for signal');

    await goOnline(page);
    await visible(page, 'part-waiting').waitFor({ state: 'detached', timeout: 30_000 });
    const [sent] = await findingsOn();
    expect(sent).toBeDefined();
    const full = await api<{ photos: unknown[]; note: string }>(`/api/findings/${sent.id}`);
    expect(full.note).toBe(`${hole} oval, flagged with no signal`);
    expect(full.photos).toHaveLength(1);
    // Its photo's bytes are let go from the phone once the server has it.
    expect(await keptPhotoIds(page)).toEqual([]);
    await page.context().close();
  });
});

describe('the scanner on a plain-http shop address', () => {
  it('says the camera needs the https address, and the short code still opens the part', async () => {
    const part = (await api<{ items: TravelerSummary[] }>('/api/travelers')).items.find(
      (p) => p.partNumber === 'W-104',
    )!;
    // A name other than localhost (mapped to 127.0.0.1 by the browser helper): not a secure context.
    const shop = `http://pitchcard.test:${port}`;
    const page = await phonePage(browser, shop);
    await signIn(page, `${shop}/`);
    expect(await page.evaluate(() => [window.isSecureContext, 'serviceWorker' in navigator])).toEqual([false, false]);
    const notice = await visible(page, 'scan-needs-https').textContent();
    expect(notice).toContain('https://');
    expect(notice).toContain(shop);
    expect(notice).not.toMatch(/not allowed/);
    expect(await page.locator('[data-testid="start-scan"]:visible').count()).toBe(0);

    await visible(page, 'short-code').fill(part.shortCode);
    await visible(page, 'open-code').click();
    await visible(page, 'traveler-screen').waitFor({ timeout: 30_000 });
    await page.context().close();
  });
});
