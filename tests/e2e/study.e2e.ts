import type { Browser, Page } from 'playwright-core';
import request from 'supertest';
import { DEMO_USERS } from '@/server/dev/seed';
import type { TestApp } from '../helpers/test-app';
import { fillSignIn } from './helpers/browser';
import { servedWithBrowser } from './helpers/served-app';

/**
 * The supplier's load study in a real browser on a wide screen: the demo rib study shows its pictures,
 * the trade table and the caution; a bad input is refused at its field; applying the chosen gauge and
 * rivet writes the computed zones into a draft revision of the part design.
 */
jest.setTimeout(300_000);

let t: TestApp;
let base: string;
let browser: Browser;
let page: Page;

servedWithBrowser((s) => ({ t, base, browser } = s));
beforeAll(async () => {
  page = await (await browser.newContext({ baseURL: base, viewport: { width: 1366, height: 900 } })).newPage();
});

describe('a load study on the supplier’s wide screen', () => {
  it('shows the pressure, the loads against the allowables, the zones, the trade table and the caution', async () => {
    await page.goto('/');
    await fillSignIn(page, DEMO_USERS.supplier.email);
    await page.locator('[data-testid="tab-studies"]:visible').first().click();
    await page.locator('[data-testid^="study-row-"]').first().click();
    await page.getByTestId('study-screen').waitFor({ timeout: 30000 });
    for (const id of ['pressure-picture', 'load-plot', 'zones-drawing', 'trade-table', 'zone-table', 'study-caution']) {
      await page.locator(`[data-testid="${id}"]:visible`).first().waitFor({ timeout: 30000 });
    }
    // Pictures are drawn, not placeholders: the rib outline with a pressure arrow at each sample, the
    // load plot (drawn once laid out).
    await page.locator('[data-testid="cp-outline"]').first().waitFor({ timeout: 30000 });
    expect(await page.locator('[data-testid="pressure-plot"] svg line').count()).toBeGreaterThan(20);
    await page.locator('[data-testid="load-plot"] svg').first().waitFor({ timeout: 30000 });
    // 6 gauges × 3 rivets, the coupon-backed 0.020 in with the pulled rivet recommended (common practice).
    expect(await page.locator('[data-testid^="trade-row-"][data-testid$="-recommended"]').count()).toBe(1);
    await page.getByTestId('trade-row-0.02-PULLED-4-recommended').waitFor();
    expect(await page.locator('[data-testid="study-caution"]:visible').first().textContent()).toMatch(/aid/i);
  });

  it('refuses a negative rib spacing at its field as it is typed', async () => {
    const spacing = page.locator('[data-testid="study-rib-spacing"]:visible').first();
    await spacing.fill('-3');
    await page.locator('[data-testid="study-rib-spacing-field-error"]:visible').first().waitFor();
    await spacing.fill('14.5');
  });

  it('applies the chosen gauge and rivet to W-104 as a draft revision with the computed zones', async () => {
    await page.getByTestId('trade-row-0.02-PULLED-4').click();
    await page.getByTestId('apply-design-W-104').click();
    await page.getByTestId('apply-study').click();
    await page.getByTestId('apply-result').waitFor({ timeout: 30000 });

    const token = await t.signIn(DEMO_USERS.supplier.email);
    const auth = { Authorization: `Bearer ${token}` };
    const designs = (await request(t.app).get('/api/designs').set(auth)).body.items;
    const rib = (
      await request(t.app)
        .get(`/api/designs/${designs.find((d: { partNumber: string }) => d.partNumber === 'W-104').id}`)
        .set(auth)
    ).body;
    const draft = rib.revisions[0];
    expect(draft).toMatchObject({ status: 'draft', letter: 'B', gaugeIn: 0.02, rivetSpec: 'PULLED-4' });
    const [study] = (await request(t.app).get('/api/studies').set(auth)).body.items;
    const result = (await request(t.app).get(`/api/studies/${study.id}`).set(auth)).body.result;
    const chosen = result.candidates.find(
      (c: { gaugeIn: number; rivet: string }) => c.gaugeIn === 0.02 && c.rivet === 'PULLED-4',
    );
    expect(draft.lines.map((l: { zones: { pitchIn: number }[] }) => l.zones.map((z) => z.pitchIn))).toEqual(
      chosen.lines.map((l: { zones: { pitchIn: number }[] }) => l.zones.map((z) => z.pitchIn)),
    );

    await page.getByTestId('apply-open-design').click();
    await page.getByTestId('design-screen').waitFor({ timeout: 30000 });
    expect(await page.getByTestId('revision-B-status').textContent()).toMatch(/draft/i);
  });
});
