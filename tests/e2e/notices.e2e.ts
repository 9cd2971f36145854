import { mkdtemp, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import sharp from 'sharp';
import request from 'supertest';
import { DEMO_USERS } from '@/server/dev/seed';
import type { TestApp } from '../helpers/test-app';
import { auth } from '../helpers/test-app';
import { fillSignIn, phonePage } from './helpers/browser';
import { servedWithBrowser } from './helpers/served-app';

/**
 * A notice in a real browser: the supplier's engineer issues a mandatory notice on the inboard rib W-104
 * of the NK-2 kits NK2-0100 to NK2-0199 from the office; the builder of NK2-0147 sees it on that rib's
 * traveler, opens it and records it done with a note and a photo; the supplier then sees that build done
 * in the notice's table of answers.
 */
jest.setTimeout(300_000);

let t: TestApp;
let base: string;
let browser: Browser;
let photo: string;

const visible = (page: Page, id: string) => page.locator(`[data-testid="${id}"]:visible`).first();

servedWithBrowser((s) => ({ t, base, browser } = s));
beforeAll(async () => {
  const dir = await mkdtemp(path.join(os.tmpdir(), 'pc-e2e-notices-'));
  photo = path.join(dir, 'doubler.jpg');
  await writeFile(
    photo,
    await sharp({ create: { width: 640, height: 480, channels: 3, background: '#9aa0a6' } })
      .jpeg()
      .toBuffer(),
  );
});

/** Signed in on the first page, then on to `at` (as a person opening a link they were sent). */
async function signedIn(page: Page, email: string, at: string, ready: string) {
  await page.goto('/');
  await fillSignIn(page, email);
  await page
    .locator('[data-testid="bench-screen"], [data-testid="catalogue-screen"], [data-testid="review-screen"]')
    .first()
    .waitFor({ timeout: 30000 })
    .catch(() => undefined);
  await page.goto(at);
  await visible(page, ready).waitFor({ timeout: 30000 });
}

describe('a notice in a real browser', () => {
  it('supplier issues it for W-104 → the builder sees it on the part and records it done with a photo → the supplier sees it done', async () => {
    const { supplier, builder } = await t.tokens();
    const kits = (await request(t.app).get('/api/kits').set(auth(supplier))).body.items as {
      id: string;
      code: string;
    }[];
    const kitId = kits.find((k) => k.code === 'NK-2')!.id;
    const parts = (await request(t.app).get('/api/travelers').set(auth(builder))).body.items as {
      id: string;
      buildId: string;
      partNumber: string;
      kitSerial: string;
    }[];
    const rib = parts.find((p) => p.partNumber === 'W-104' && p.kitSerial === 'NK2-0147')!;

    // The supplier's engineer, at a wide screen in the office, issues it from the kit's page.
    const context = await browser.newContext({ baseURL: base, viewport: { width: 1280, height: 900 } });
    const office = await context.newPage();
    await signedIn(office, DEMO_USERS.supplier.email, `/catalogue/kits/${kitId}`, 'kit-screen');
    await visible(office, 'issue-notice').click();
    await visible(office, 'notice-form-screen').waitFor({ timeout: 30000 });
    await visible(office, 'notice-level-mandatory').click();
    await visible(office, 'notice-title').fill('Check the W-104 lower flange at the nose');
    await visible(office, 'notice-text').fill(
      'Measure the bend radius of the lower flange at the nose. Under 0.09 in: fit the doubler of drawing D-12.',
    );
    await visible(office, 'notice-serial-from').fill('NK2-0100');
    await visible(office, 'notice-serial-to').fill('NK2-0199');
    await visible(office, 'notice-part-W-104').click();
    await visible(office, 'notice-letter-W-104-A').click();
    await visible(office, 'notice-submit').click();
    await visible(office, 'notice-screen').waitFor({ timeout: 30000 });
    const noticeId = /\/notices\/([0-9a-f-]{36})/.exec(office.url())![1];
    await visible(office, 'compliance-row-NK2-0147').getByText('Not yet read').waitFor({ timeout: 30000 });

    // The builder, at the bench, finds it on the rib's traveler and opens it.
    const bench = await phonePage(browser, base);
    await signedIn(bench, DEMO_USERS.builder.email, `/travelers/${rib.id}`, 'traveler-screen');
    await visible(bench, 'notice-banner')
      .getByText('Check the W-104 lower flange at the nose')
      .waitFor({ timeout: 30000 });
    await visible(bench, `notice-banner-open-${noticeId}`).click();
    await visible(bench, 'notice-screen').waitFor({ timeout: 30000 });
    await visible(bench, 'notice-caution').waitFor();

    // Records it done, with a note and a photo of the work.
    await visible(bench, 'compliance-outcome-done').click();
    await visible(bench, 'compliance-note').fill('Radius 0.08 in: doubler D-12 fitted, MS20470AD4 rivets');
    const chooser = bench.waitForEvent('filechooser');
    await visible(bench, 'notice-add-photo').click();
    await (await chooser).setFiles(photo);
    await visible(bench, 'notice-photo-0').waitFor({ timeout: 30000 });
    await visible(bench, 'compliance-submit').click();
    await visible(bench, 'compliance-saved').waitFor({ timeout: 30000 });
    await visible(bench, 'notice-answer-NK2-0147').locator('[data-testid="compliance-status-done"]').waitFor();

    const stored = (await request(t.app).get(`/api/notices/${noticeId}`).set(auth(builder))).body as {
      builds: { kitSerial: string; status: string; note: string | null; photos: unknown[] }[];
    };
    expect(stored.builds.find((b) => b.kitSerial === 'NK2-0147')).toMatchObject({
      status: 'done',
      note: 'Radius 0.08 in: doubler D-12 fitted, MS20470AD4 rivets',
      photos: [expect.anything()],
    });

    // The build's page lists the notice with the build's answer.
    await bench.goto(`/builds/${rib.buildId}`);
    await visible(bench, 'build-notices-list')
      .locator(`[data-testid="notice-${noticeId}"]`)
      .locator('[data-testid="compliance-status-done"]')
      .waitFor({ timeout: 30000 });

    // The supplier sees the build done, with who, the note and the photo.
    await office.reload();
    const row = visible(office, 'compliance-row-NK2-0147');
    await row.locator('[data-testid="compliance-status-done"]').waitFor({ timeout: 30000 });
    expect(await row.textContent()).toContain('Radius 0.08 in: doubler D-12 fitted');
    expect(await row.textContent()).toContain('Tobias Fenn');
    await visible(office, 'compliance-photo-NK2-0147-0').waitFor();
    expect(await visible(office, 'compliance-counts').textContent()).toContain('1 of 1 build done');
    await context.close();
  });
});
