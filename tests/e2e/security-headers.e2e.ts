import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import sharp from 'sharp';
import request from 'supertest';
import { DEMO_USERS } from '@/server/dev/seed';
import { auth, type TestApp } from '../helpers/test-app';
import { fillSignIn, launchBrowser, phonePage } from './helpers/browser';
import { writeQrVideo } from './helpers/qr-video';
import { serveTestApp } from './helpers/served-app';

/**
 * The exported web app runs under the content security policy (server/middleware/security-headers.ts)
 * in Debian's headless Chromium: a builder signs in, scans a label with the fake camera (the QR reader
 * compiles its WebAssembly), opens the part and flags a hole with a photo (a data: preview fetched
 * back for the upload) — and the browser reports no violation. A canary inline script proves the policy is enforced and that violations are seen.
 */
jest.setTimeout(180_000);

type Violation = { directive: string; blocked: string; sample: string };
declare global {
  interface Window {
    __cspViolations: Violation[];
  }
}

const CANARY = 'window.__canaryRan = true';

let t: TestApp;
let base: string;
let closeApp: () => Promise<void>;
let browser: Browser | undefined;
let work: string;

beforeAll(async () => {
  ({ t, base, close: closeApp } = await serveTestApp());
  work = await mkdtemp(path.join(os.tmpdir(), 'pc-csp-'));
});
afterAll(async () => {
  await browser?.close().catch(() => undefined);
  await closeApp?.();
  await rm(work, { recursive: true, force: true });
});

/** Every violation the page sees, as events (in the page) and as console reports (from the browser). */
async function watchViolations(context: BrowserContext, page: Page) {
  await context.addInitScript(() => {
    window.__cspViolations = [];
    document.addEventListener(
      'securitypolicyviolation',
      (e) => {
        window.__cspViolations.push({ directive: e.violatedDirective, blocked: e.blockedURI, sample: e.sample });
      },
      true,
    );
  });
  const consoleReports: string[] = [];
  page.on('console', (m) => {
    if (/content security policy|refused to/i.test(m.text())) consoleReports.push(m.text());
  });
  return {
    consoleReports,
    events: () => page.evaluate(() => window.__cspViolations ?? []),
  };
}

/** Polls until the value passes, failing with the last value seen (the browser reports asynchronously). */
async function until<T>(read: () => Promise<T> | T, ok: (v: T) => boolean, ms = 10_000): Promise<T> {
  const end = Date.now() + ms;
  let v = await read();
  while (!ok(v)) {
    if (Date.now() > end) throw new Error(`gave up waiting; last value: ${JSON.stringify(v)}`);
    await new Promise((r) => setTimeout(r, 100));
    v = await read();
  }
  return v;
}

async function api<T>(email: string, url: string): Promise<T> {
  const token = await t.signIn(email);
  const res = await request(t.app).get(url).set(auth(token));
  if (res.status !== 200) throw new Error(`GET ${url} as ${email}: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body as T;
}

describe('security headers in a real browser', () => {
  it('the builder signs in, scans a label, opens the part and picks a photo with no policy violation', async () => {
    const builds = (await api<{ items: { id: string }[] }>(DEMO_USERS.supplier.email, '/api/builds')).items;
    const labels = await api<{ url: string }[]>(
      DEMO_USERS.supplier.email,
      `/api/travelers/labels?buildId=${builds[0].id}`,
    );
    expect(labels.length).toBeGreaterThan(0);
    const video = path.join(work, 'label.y4m');
    await writeQrVideo(video, labels[0].url);

    browser = await launchBrowser({ video });
    const page = await phonePage(browser, base);
    const seen = await watchViolations(page.context(), page);

    const doc = await page.goto('/');
    const headers = doc!.headers();
    expect(headers['content-security-policy']).toContain("script-src 'self' 'wasm-unsafe-eval'");
    expect(headers['content-security-policy']).toContain("frame-ancestors 'none'");
    expect(headers['x-frame-options']).toBe('DENY');
    expect(headers['x-content-type-options']).toBe('nosniff');
    expect(headers['referrer-policy']).toBe('no-referrer');

    await fillSignIn(page, DEMO_USERS.builder.email);
    await page.getByTestId('bench-screen').waitFor({ timeout: 30_000 });

    // The QR reader: zxing's wasm from our own origin, compiled under 'wasm-unsafe-eval'.
    await page.getByTestId('start-scan').click();
    await page.getByTestId('traveler-screen').waitFor({ timeout: 30_000 });

    // A finding with a photo: the picker's preview is a data: (or blob:) image, which is fetched back
    // into a Blob for the upload (connect-src), and the stored photo is then shown from our origin.
    const photo = path.join(work, 'hole.jpg');
    await writeFile(
      photo,
      await sharp({ create: { width: 320, height: 240, channels: 3, background: '#8a9096' } })
        .jpeg()
        .toBuffer(),
    );
    await page.getByTestId('flag-hole').click();
    await page.getByTestId('flag-screen').waitFor({ timeout: 15_000 });
    await page.locator('[data-testid^="pick-hole-"]').last().click();
    await page.getByTestId('finding-kind-hole_elongated').click();
    await page.getByTestId('finding-note').fill('Checked under the content security policy');
    const chooser = page.waitForEvent('filechooser');
    await page.getByTestId('add-photo').click();
    await (await chooser).setFiles(photo);
    await page.getByTestId('photo-0').waitFor({ timeout: 15_000 });
    expect(await page.locator('img[src^="data:"], img[src^="blob:"]').count()).toBeGreaterThan(0);
    await page.getByTestId('submit-finding').click();
    await page.getByTestId('finding-sent').waitFor({ timeout: 30_000 });

    // Fonts, styles and images have had their chance to load.
    await page.waitForLoadState('networkidle').catch(() => undefined);
    expect(await seen.events()).toEqual([]);
    expect(seen.consoleReports).toEqual([]);

    // The canary: an injected inline script is refused, and the refusal is seen by both listeners.
    await page.evaluate((code) => {
      const s = document.createElement('script');
      s.textContent = code;
      document.body.appendChild(s);
    }, CANARY);
    const events = await until(
      () => seen.events(),
      (v) => v.length > 0,
    );
    expect(events).toEqual([expect.objectContaining({ directive: 'script-src-elem', blocked: 'inline' })]);
    expect(await page.evaluate(() => (window as unknown as { __canaryRan?: boolean }).__canaryRan)).toBeUndefined();
    await until(
      () => seen.consoleReports.length,
      (n) => n === 1,
    );
    await page.context().close();
  });

  it('another site cannot frame the app', async () => {
    browser ??= await launchBrowser();
    const context = await browser.newContext();
    const page = await context.newPage();
    const refused: string[] = [];
    page.on('console', (m) => {
      if (/frame-ancestors/.test(m.text())) refused.push(m.text());
    });
    // A page of another origin (about:blank with content) framing the sign-in page.
    await page.setContent(`<iframe id="f" src="${base}/sign-in" width="400" height="600"></iframe>`);
    await until(
      () => refused.length,
      (n) => n > 0,
      15_000,
    );
    const frame = page.frames().find((f) => f !== page.mainFrame());
    expect(await frame?.locator('[data-testid="email"]').count()).toBe(0);
    await context.close();
  });
});
