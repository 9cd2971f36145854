import type { Browser, Page } from 'playwright-core';
import request from 'supertest';
import { DEMO_USERS } from '@/server/dev/seed';
import type { TestApp } from '../helpers/test-app';
import { fillSignIn, phonePage } from './helpers/browser';
import { servedWithBrowser } from './helpers/served-app';

/**
 * The supplier on a phone takes back what can be taken back: corrects a recorded coupon (the old entry
 * stays, shown as corrected), discards a draft revision, and is asked before publishing, which cannot be undone.
 */
jest.setTimeout(300_000);

let t: TestApp;
let base: string;
let browser: Browser;
let page: Page;
let token: string;
const auth = () => ({ Authorization: `Bearer ${token}` });
const visible = (id: string) => page.locator(`[data-testid="${id}"]:visible`).first();

servedWithBrowser((s) => ({ t, base, browser } = s));
beforeAll(async () => {
  token = await t.signIn(DEMO_USERS.supplier.email);
  page = await phonePage(browser, base);
  await page.goto('/');
  await fillSignIn(page, DEMO_USERS.supplier.email);
  await page.locator('[data-testid="tab-catalogue"]:visible').first().waitFor({ timeout: 30000 });
});

async function designOf(partNumber: string) {
  const list = (await request(t.app).get('/api/designs').set(auth())).body.items as {
    id: string;
    partNumber: string;
  }[];
  return list.find((d) => d.partNumber === partNumber)!.id;
}

/** A draft revision B… of the part, made the way the supplier's form makes one. */
async function draftOf(designId: string, changeNote: string) {
  const detail = (await request(t.app).get(`/api/designs/${designId}`).set(auth())).body;
  const {
    id: _i,
    partDesignId: _p,
    letter: _l,
    status: _s,
    basis: _b,
    studyId: _st,
    createdAt: _c,
    publishedAt: _pa,
    publishedByName: _pb,
    allowedActions: _a,
    ...body
  } = detail.revisions[0];
  const res = await request(t.app)
    .post(`/api/designs/${designId}/revisions`)
    .set(auth())
    .send({ ...body, changeNote });
  expect(res.status).toBe(201);
  return res.body as { id: string; letter: string };
}

describe('taking back what can be taken back, on a phone', () => {
  it('corrects a recorded coupon: the new value counts, the old one stays shown as corrected', async () => {
    const tests = (await request(t.app).get('/api/coupons').set(auth())).body.items as {
      id: string;
      gaugeIn: number;
      loadLb: number;
    }[];
    const old = tests.find((c) => c.gaugeIn === 0.02 && c.loadLb === 30)!;
    await page.goto('/coupons');
    await visible(`coupon-correct-${old.id}`).click();
    await visible('coupon-correction').waitFor();
    await visible('coupon-correction-reason').fill('Load cell read with the tare left on');
    await visible('coupon-correction-load').fill('25');
    await visible('coupon-correction-submit').click();
    await visible(`coupon-corrected-${old.id}`).waitFor({ timeout: 15000 });
    expect(await visible(`coupon-corrected-${old.id}`).textContent()).toMatch(
      /Corrected .* by Maren Holt: Load cell read with the tare left on/,
    );
    // The old value is still there to read; no button offers to change it again.
    expect(await visible(`coupon-load-${old.id}`).textContent()).toBe('30.0');
    expect(await page.locator(`[data-testid="coupon-correct-${old.id}"]`).count()).toBe(0);
    const after = (await request(t.app).get('/api/coupons').set(auth())).body.items as {
      id: string;
      loadLb: number;
      correctionReason: string;
    }[];
    expect(after.filter((c) => c.correctionReason.includes('tare')).map((c) => c.loadLb)).toEqual([25]);
  });

  it('discards a draft revision: the published revisions stay', async () => {
    const designId = await designOf('W-105');
    const draft = await draftOf(designId, 'Try a wider pitch aft');
    await page.goto(`/catalogue/designs/${designId}`);
    await visible(`revision-${draft.letter}-status`).waitFor({ timeout: 15000 });
    await visible('discard-draft').click();
    expect(await visible('discard-ask-message').textContent()).toMatch(/published revisions of this part stay/);
    await visible('discard-ask-confirm').click();
    await page
      .locator(`[data-testid="revision-${draft.letter}-status"]`)
      .waitFor({ state: 'detached', timeout: 15000 });
    expect(await visible('revision-B-status').textContent()).toBe('Published');
    expect(await page.locator('[data-testid="save-draft"]').count()).toBe(0);
  });

  it('asks before publishing, saying the approval cannot be undone, and publishes only when confirmed', async () => {
    const designId = await designOf('W-105');
    const draft = await draftOf(designId, 'Gauge up at the nose');
    await page.goto(`/catalogue/designs/${designId}`);
    await visible('publish').click();
    expect(await visible('publish-ask-message').textContent()).toMatch(/cannot be undone/);
    await visible('publish-ask-cancel').click();
    const still = (await request(t.app).get(`/api/designs/${designId}`).set(auth())).body;
    expect(still.revisions.find((r: { id: string }) => r.id === draft.id).status).toBe('draft');

    await visible('publish').click();
    await visible('publish-ask-confirm').click();
    await visible(`revision-${draft.letter}-approved`).waitFor({ timeout: 15000 });
    expect(await visible(`revision-${draft.letter}-approved`).textContent()).toContain(DEMO_USERS.supplier.name);
    // Published is final: nothing offers to discard or edit it.
    expect(await page.locator('[data-testid="discard-draft"]').count()).toBe(0);
  });
});
