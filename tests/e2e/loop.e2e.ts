import { mkdtemp, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import sharp from 'sharp';
import request from 'supertest';
import { DEMO_USERS } from '@/server/dev/seed';
import { readQr } from '../fixtures/read-qr';
import { auth, type TestApp } from '../helpers/test-app';
import { fillSignIn, launchBrowser, phonePage } from './helpers/browser';
import { writeQrVideo } from './helpers/qr-video';
import { serveTestApp } from './helpers/served-app';

/**
 * The whole loop through the web UI at phone size, in Debian's headless Chromium, against the real
 * server, PostgreSQL, job queue and SMTP fake: supplier → builder (QR scan through the fake camera)
 * → inspector → builder.
 */
jest.setTimeout(300_000);

const stamp = Date.now().toString(36).slice(-4).toUpperCase();

let t: TestApp;
let base: string;
let closeApp: () => Promise<void>;
let work: string;
const browsers: Browser[] = [];

beforeAll(async () => {
  ({ t, base, close: closeApp } = await serveTestApp());
  work = await mkdtemp(path.join(os.tmpdir(), 'pc-e2e-'));
});
afterAll(async () => {
  for (const b of browsers) await b.close().catch(() => undefined);
  await closeApp?.();
});

/** Polls until the value matches (the UI updates asynchronously), failing with the last value seen. */
async function until<T>(read: () => Promise<T>, ok: (v: T) => boolean, ms = 15000): Promise<T> {
  const end = Date.now() + ms;
  let v = await read();
  while (!ok(v)) {
    if (Date.now() > end) throw new Error(`gave up waiting; last value: ${String(v)}`);
    await new Promise((r) => setTimeout(r, 150));
    v = await read();
  }
  return v;
}

const visible = (page: Page, id: string) => page.locator(`[data-testid="${id}"]:visible`).first();

async function signIn(page: Page, email: string) {
  await page.goto('/');
  await fillSignIn(page, email);
}

describe('the loop in a real browser at phone size', () => {
  let qrText = '';
  let shortCode = '';

  it('supplier: creates a kit and a rib design, publishes revision A, ships a build and prints QR labels', async () => {
    const browser = await launchBrowser();
    browsers.push(browser);
    const page = await phonePage(browser, base);
    await signIn(page, DEMO_USERS.supplier.email);
    await page.getByTestId('catalogue-screen').waitFor({ timeout: 30000 });

    await page.getByTestId('new-kit').click();
    await page.getByTestId('kit-code').fill(`E${stamp}`);
    await page.getByTestId('kit-name').fill('Browser test kit');
    await page.getByTestId('kit-airfoil').fill('NACA 2412');
    await page.getByTestId('kit-weight').fill('1320');
    await page.getByTestId('kit-wing-area').fill('110');
    await page.getByTestId('kit-mean-chord').fill('54');
    await page.getByTestId('kit-stall').fill('48');
    // A cruise speed below the stall speed is refused as it is typed.
    await page.getByTestId('kit-cruise').fill('40');
    await page.getByTestId('kit-cruise-field-error').waitFor();
    await page.getByTestId('kit-cruise').fill('120');
    await page.getByTestId('submit-kit').click();
    await page.getByTestId(`kit-E${stamp}`).waitFor({ timeout: 15000 });

    await page.getByTestId(`new-design-E${stamp}`).click();
    await page.getByTestId('design-create-screen').waitFor();
    await page.getByTestId('design-part-number').fill(`R-${stamp}`);
    await page.getByTestId('design-name').fill('Browser test rib');
    await page.getByTestId('rev-gauge').fill('0.032');
    await page.getByTestId('rev-chord').fill('40');
    await page.getByTestId('rev-rivet').fill('MS20470AD4');
    await page.getByTestId('rev-drill-size').fill('#30');
    await page.getByTestId('rev-drill-diameter').fill('0.1285');
    await page.getByTestId('rev-edge-distance').fill('0.25');
    for (const [i, pitch] of [
      [0, '1'],
      [1, '1.5'],
    ] as const) {
      await page.getByTestId(`line-${i}-start`).fill('1');
      await page.getByTestId(`line-${i}-length`).fill('30');
      await page.getByTestId(`line-${i}-zone-0-from`).fill('0');
      await page.getByTestId(`line-${i}-zone-0-to`).fill('20');
      await page.getByTestId(`line-${i}-zone-0-pitch`).fill(pitch);
      await page.getByTestId(`line-${i}-add-zone`).click();
      await page.getByTestId(`line-${i}-zone-1-pitch`).fill('2');
    }
    await page.getByTestId('submit-design').click();
    await page.getByTestId('design-screen').waitFor({ timeout: 15000 });
    await page.getByTestId('publish').click();
    // Publishing is the approval and cannot be undone: the screen asks first.
    await page.getByTestId('publish-ask-confirm').click();
    await page.getByTestId('revision-A-approved').waitFor({ timeout: 15000 });
    expect(await page.getByTestId('revision-A-approved').textContent()).toContain(DEMO_USERS.supplier.name);
    // Published means frozen: no draft fields remain to edit.
    expect(await page.getByTestId('save-draft').count()).toBe(0);

    await page.goto('/builds');
    await visible(page, 'ship-build').click();
    await page.getByTestId(`build-kit-E${stamp}`).click();
    await page.getByTestId('build-serial').fill(`E-${stamp}`);
    await page.getByTestId('build-builder-email').fill(DEMO_USERS.builder.email);
    await page.getByTestId('build-inspector-email').fill(DEMO_USERS.inspector.email);
    await page.getByTestId('submit-build').click();
    await page.getByTestId('build-screen').waitFor({ timeout: 15000 });
    await visible(page, 'labels').click();
    const label = page.locator('[data-testid^="part-label-"]').first();
    await label.waitFor({ timeout: 15000 });
    shortCode = ((await label.getAttribute('data-testid')) ?? '').replace('part-label-', '');
    expect(shortCode).toMatch(/^[A-Z0-9]{3}-[A-Z0-9]{3}$/);

    // Read the printed QR back off the page, as a phone would.
    const img = label.locator('img').first();
    const decoded = await readQr(await img.screenshot());
    // The label carries the public address (a name phones resolve), not this machine's loopback.
    expect(decoded).toMatch(new RegExp(`^${t.config.publicUrl}/t/[A-Za-z0-9_-]{20,}$`));
    qrText = decoded!;
  });

  it('builder: scans the label with the camera, ticks a hole and a run, flags a hole with a photo', async () => {
    const video = path.join(work, 'label.y4m');
    await writeQrVideo(video, qrText);
    const browser = await launchBrowser({ video });
    browsers.push(browser);
    const page = await phonePage(browser, base);
    await signIn(page, DEMO_USERS.builder.email);
    await page.getByTestId('start-scan').click();
    await page.getByTestId('traveler-screen').waitFor({ timeout: 30000 });
    expect(await page.getByTestId('part-number').textContent()).toContain(`R-${stamp}`);
    expect(await page.getByTestId('progress-count').textContent()).toMatch(/^0\b/);

    await page.getByTestId('hole-U-01').click();
    await until(
      () => page.getByTestId('hole-U-01').getAttribute('aria-checked'),
      (v) => v === 'true',
    );
    await page.getByTestId('run-mode').click();
    await page.getByTestId('hole-U-02').click();
    await page.getByTestId('hole-U-05').click();
    await page.getByTestId('tick-run').click();
    await until(
      () => page.getByTestId('progress-count').textContent(),
      (v) => /^5\b/.test(v ?? ''),
    );

    // No signal at the bench: the tick stays as made, waits on the device, and reaches the server later.
    await page.context().setOffline(true);
    await page.getByTestId('hole-U-06').click();
    await page.getByTestId('part-waiting').waitFor({ timeout: 15000 });
    expect(await page.getByTestId('hole-U-06').getAttribute('aria-checked')).toBe('true');
    await page.context().setOffline(false);
    await page.getByTestId('part-waiting').waitFor({ state: 'detached', timeout: 30000 });
    const token = await t.signIn(DEMO_USERS.builder.email);
    const lookup = await request(t.app).get('/api/travelers/lookup').query({ code: qrText }).set(auth(token));
    const saved = await request(t.app).get(`/api/travelers/${lookup.body.id}`).set(auth(token));
    expect(saved.body.holes.find((h: { holeId: string }) => h.holeId === 'U-06').status).toBe('installed');

    const photo = path.join(work, 'hole.jpg');
    await writeFile(
      photo,
      await sharp({ create: { width: 640, height: 480, channels: 3, background: '#8a9096' } })
        .jpeg()
        .toBuffer(),
    );
    await page.getByTestId('flag-hole').click();
    await page.getByTestId('flag-screen').waitFor();
    await page.getByTestId('pick-hole-U-07').click();
    await page.getByTestId('finding-kind-hole_elongated').click();
    await page.getByTestId('finding-note').fill('Hole U-07 looks oval toward the trailing edge');
    const chooser = page.waitForEvent('filechooser');
    await page.getByTestId('add-photo').click();
    await (await chooser).setFiles(photo);
    await page.getByTestId('photo-0').waitFor();
    await page.getByTestId('submit-finding').click();
    await page.getByTestId('finding-sent').waitFor({ timeout: 30000 });

    const mail = await t.waitForMail(
      (m) =>
        m.to.includes(DEMO_USERS.inspector.email) && m.subject.includes(`R-${stamp}`) && m.subject.includes('U-07'),
    );
    expect(mail.text).toContain('Elongated hole');
    expect(mail.attachments).toBe(1);
  });

  it('inspector: finds it in the review queue, views the photo and dispositions it; the builder sees it', async () => {
    const browser = browsers[browsers.length - 1];
    const page = await phonePage(browser, base);
    await signIn(page, DEMO_USERS.inspector.email);
    await page.getByTestId('review-screen').waitFor({ timeout: 30000 });
    await page.getByTestId('filter-text').fill('U-07');
    const row = page.locator('[data-testid^="review-row-"]').first();
    await row.waitFor({ timeout: 15000 });
    await row.click();
    await page.getByTestId('finding-screen').waitFor();
    await page.getByTestId('finding-photo-0').click();
    await page.getByTestId('photo-viewer').waitFor();
    await page.getByTestId('photo-close').click();
    await page.getByTestId('disposition-rework').click();
    await page.getByTestId('action-note').fill('Drill out and set the same rivet again, checking the edge distance');
    await page.getByTestId('finding-action-disposition').click();
    await page.getByTestId('disposition').waitFor({ timeout: 15000 });
    // The history is read again after the disposition shows: wait for its new line before reading it.
    await page.getByTestId('history').getByText('Drill out and set the same rivet again').waitFor({ timeout: 15000 });
    expect(await page.getByTestId('history').textContent()).toContain('Drill out and set the same rivet again');

    await t.waitForMail(
      (m) => m.to.includes(DEMO_USERS.builder.email) && m.subject.includes(`R-${stamp}`) && /Rework/.test(m.subject),
    );

    const bench = await phonePage(browser, base);
    await signIn(bench, DEMO_USERS.builder.email);
    await bench.getByTestId('short-code').fill(shortCode.replace('-', '').toLowerCase());
    await bench.getByTestId('open-code').click();
    await bench.getByTestId('traveler-screen').waitFor({ timeout: 30000 });
    await until(
      () => bench.getByTestId('traveler-findings').textContent(),
      (v) => /Rework/.test(v ?? ''),
    );
    expect(await bench.getByTestId('hole-U-07').getAttribute('aria-label')).toMatch(/held/i);
  });
});
