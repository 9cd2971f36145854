import { createHash, X509Certificate } from 'node:crypto';
import { mkdtemp } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import type { Browser } from 'playwright-core';
import request from 'supertest';
import { DEMO_USERS } from '@/server/dev/seed';
import type { TestApp } from '../helpers/test-app';
import { fillSignIn, launchBrowser, phonePage } from './helpers/browser';
import { writeQrVideo } from './helpers/qr-video';
import { serveTestApp } from './helpers/served-app';

/**
 * The bench as a phone on the shop's network sees it: HTTPS with the certificate Pitchcard made, the
 * public name resolved (inside Chromium only) to 127.0.0.1, the fake camera showing a printed label.
 * The camera starts only in a secure context, so this proves the scanner works over the network address.
 */
jest.setTimeout(240_000);

let t: TestApp;
let base: string;
let closeApp: () => Promise<void>;
let browser: Browser;
let spki: string;

beforeAll(async () => {
  const served = await serveTestApp({ https: true });
  ({ t, base, close: closeApp } = served);
  // What a phone trusts once the certificate is installed: this certificate's public key, nothing else.
  const der = new X509Certificate(served.tls!.cert).publicKey.export({ type: 'spki', format: 'der' });
  spki = createHash('sha256').update(der).digest('base64');
});
afterAll(async () => {
  await browser?.close().catch(() => undefined);
  await closeApp?.();
});

/** The printed label of a part of the demo's build, as its supplier prints it. */
async function labelOf(partNumber: string): Promise<{ partNumber: string; url: string }> {
  const supplier = await t.signIn(DEMO_USERS.supplier.email);
  const as = { Authorization: `Bearer ${supplier}` };
  const buildId = (await request(t.app).get('/api/builds').set(as)).body.items[0].id;
  const labels = await request(t.app).get(`/api/travelers/labels?buildId=${buildId}`).set(as);
  expect(labels.status).toBe(200);
  return labels.body.find((l: { partNumber: string }) => l.partNumber === partNumber);
}

describe('the bench over HTTPS at the public address', () => {
  it('starts the scanner in a secure context and opens the part from its label', async () => {
    const label = await labelOf('W-104');
    // The label carries the public HTTPS address, never this machine's loopback.
    expect(label.url).toMatch(new RegExp(`^${base}/t/`));

    const video = path.join(await mkdtemp(path.join(os.tmpdir(), 'pc-https-')), 'label.y4m');
    await writeQrVideo(video, label.url);
    browser = await launchBrowser({ video, trustSpki: spki });
    const page = await phonePage(browser, base);
    await page.goto('/');
    expect(await page.evaluate(() => window.isSecureContext && location.protocol)).toBe('https:');
    await fillSignIn(page, DEMO_USERS.builder.email);
    await page.getByTestId('start-scan').click();
    await page.getByTestId('traveler-screen').waitFor({ timeout: 30000 });
    expect(await page.getByTestId('part-number').textContent()).toContain('W-104');
  });

  it('opens a label’s link from the phone’s own camera: signed out, it lands on the part after sign-in', async () => {
    const label = await labelOf('W-105');
    browser ??= await launchBrowser({ trustSpki: spki });
    const page = await phonePage(browser, base);
    await page.goto(label.url);
    await fillSignIn(page, DEMO_USERS.builder.email);
    await page.getByTestId('traveler-screen').waitFor({ timeout: 30000 });
    expect(await page.getByTestId('part-number').textContent()).toContain('W-105');
  });
});
