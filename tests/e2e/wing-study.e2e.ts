import os from 'node:os';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import request from 'supertest';
import { DEMO_SKIN_REVISION, DEMO_USERS } from '@/server/dev/seed';
import type { TestApp } from '../helpers/test-app';
import { fillSignIn, phonePage } from './helpers/browser';
import { servedWithBrowser } from './helpers/served-app';

/**
 * A whole-wing study on the supplier's phone: made from the form (the kit's numbers pre-filled, the ten
 * default ribs), computed by the server, read as stacked tables with the caution above them, and one
 * skin panel's schedule applied to a skin-panel part design that the test makes through the API.
 */
jest.setTimeout(300_000);

let t: TestApp;
let base: string;
let browser: Browser;
let page: Page;
let auth: { Authorization: string };
let skinDesignId: string;
const SHOTS = path.join(os.tmpdir(), 'pitchcard-wing-e2e');

const visible = (id: string) => page.locator(`[data-testid="${id}"]:visible`).first();

servedWithBrowser((s) => ({ t, base, browser } = s));
beforeAll(async () => {
  auth = { Authorization: `Bearer ${await t.signIn(DEMO_USERS.supplier.email)}` };
  // A skin panel of the root bay of our own, so the test does not lean on what the demo happens to hold:
  // the demo skin's revision with only its front-spar line.
  const kit = (await request(t.app).get('/api/kits').set(auth)).body.items.find(
    (k: { code: string }) => k.code === 'NK-2',
  );
  const made = await request(t.app)
    .post('/api/designs')
    .set(auth)
    .send({
      design: {
        kitModelId: kit.id,
        partNumber: 'S-390',
        name: 'Upper skin, root bay (phone test)',
        kind: 'skin_panel',
      },
      revision: {
        ...DEMO_SKIN_REVISION,
        lines: DEMO_SKIN_REVISION.lines.filter((l) => l.code === 'FS'),
        steps: ['Cleco the skin to the spars and ribs'],
      },
    });
  if (made.status !== 201)
    throw new Error(`the skin panel design was not made: ${made.status} ${JSON.stringify(made.body)}`);
  skinDesignId = made.body.id;
  page = await phonePage(browser, base);
});

describe('a whole-wing study on the supplier’s phone', () => {
  it('is made from the form with the kit’s numbers and the default ribs', async () => {
    await page.goto('/');
    await fillSignIn(page, DEMO_USERS.supplier.email);
    await visible('tab-studies').click();
    await visible('new-wing-study').click();
    await visible('wing-form').waitFor({ timeout: 30000 });
    await visible('wing-kit-NK-2').click();
    // The kit's area over its mean chord: a 320 in span (120 ft² × 144 ÷ 54 in).
    expect(await visible('wing-span').inputValue()).toBe('320');
    await visible('wing-name').fill('Left wing from the phone');
    await visible('wing-tail-arm').fill('170');
    expect(await visible('wing-rib-count').textContent()).toBe('10 ribs');
    await visible('wing-compute').click();
    await visible('wing-study-screen').waitFor({ timeout: 120000 });
  });

  it('shows the caution above every rib and every skin panel, in stacked rows that fit the phone', async () => {
    await visible('wing-results').waitFor({ timeout: 30000 });
    const caution = visible('study-caution');
    expect(await caution.textContent()).toMatch(/aid/i);
    const cautionBox = await caution.boundingBox();
    const ribsBox = await visible('wing-rib-table').boundingBox();
    expect(cautionBox!.y).toBeLessThan(ribsBox!.y);
    // Ten ribs, each a stacked block on a 390 px screen: the first four, then all on request; so the skins.
    expect(await page.locator('[data-testid="wing-rib-table"] [role="listitem"]').count()).toBe(4);
    await visible('wing-rib-grid-show-all').click();
    expect(await page.locator('[data-testid="wing-rib-table"] [role="listitem"]').count()).toBe(10);
    expect(await page.locator('[data-testid^="skin-row-"]').count()).toBe(4);
    await visible('skin-panel-grid-show-all').click();
    expect(await page.locator('[data-testid^="skin-row-"]').count()).toBe(18);
    await visible('skin-row-W-101-W-102-upper').waitFor();
    // Nothing runs off the side: not the page, not the tables, not a number inside them.
    const overflow = await page.evaluate(() => {
      const wide = (el: Element) => el.scrollWidth > el.clientWidth + 1;
      const cells = Array.from(
        document.querySelectorAll('[data-testid="wing-rib-table"] *, [data-testid="skin-panel-table"] *'),
      ).filter(wide);
      return { page: document.documentElement.scrollWidth, cells: cells.length };
    });
    expect(overflow.page).toBeLessThanOrEqual(390);
    expect(overflow.cells).toBe(0);
    // For a person to look at (not compared): the phone's view at each table.
    await page.screenshot({ path: path.join(SHOTS, 'wing-phone-top.png') });
    for (const id of ['wing-conditions', 'wing-rib-table', 'skin-panel-table', 'wing-trade']) {
      await visible(id).scrollIntoViewIfNeeded();
      await page.screenshot({ path: path.join(SHOTS, `wing-phone-${id}.png`) });
    }
  });

  it('applies the root-bay upper skin’s schedule to the skin-panel part design', async () => {
    await visible('skin-W-101-W-102-upper').click();
    await visible('skin-zone-table').waitFor();
    // The panel shown is the one offered; only skin-panel part designs are offered for it.
    expect(await visible('wing-apply-target-W-101-W-102-upper').getAttribute('aria-checked')).toBe('true');
    expect(await page.locator('[data-testid="apply-design-W-104"]:visible').count()).toBe(0);
    await visible('apply-design-S-390').click();
    await visible('apply-study').click();
    await visible('apply-result').waitFor({ timeout: 30000 });
    await visible('skin-zone-table').scrollIntoViewIfNeeded();
    await page.screenshot({ path: path.join(SHOTS, 'wing-phone-skin-zones.png') });
    await visible('apply-result').scrollIntoViewIfNeeded();
    await page.screenshot({ path: path.join(SHOTS, 'wing-phone-applied.png') });

    const studies = (await request(t.app).get('/api/studies').set(auth)).body.items as {
      id: string;
      name: string;
      kind: string;
    }[];
    const mine = studies.find((s) => s.name === 'Left wing from the phone')!;
    expect(mine.kind).toBe('wing');
    const result = (await request(t.app).get(`/api/studies/${mine.id}`).set(auth)).body.result;
    const panel = result.skins.find((s: { name: string }) => s.name === 'W-101–W-102 upper');
    const rec = panel.candidates.find(
      (c: { gaugeIn: number; rivet: string }) =>
        c.gaugeIn === panel.recommended.gaugeIn && c.rivet === panel.recommended.rivet,
    );
    const design = (await request(t.app).get(`/api/designs/${skinDesignId}`).set(auth)).body;
    const draft = design.revisions.find((r: { status: string }) => r.status === 'draft');
    expect(draft).toMatchObject({ gaugeIn: panel.recommended.gaugeIn, rivetSpec: panel.recommended.rivet });
    // The draft's zones are the panel's recommended schedule, line by line.
    expect(draft.lines.map((l: { zones: { pitchIn: number }[] }) => l.zones.map((z) => z.pitchIn))).toEqual(
      rec.lines.map((l: { zones: { pitchIn: number }[] }) => l.zones.map((z) => z.pitchIn)),
    );
  });

  it('reads on a wide screen with the inputs beside the results', async () => {
    const wide = await (
      await browser.newContext({ baseURL: new URL(page.url()).origin, viewport: { width: 1366, height: 900 } })
    ).newPage();
    await wide.goto('/');
    await fillSignIn(wide, DEMO_USERS.supplier.email);
    await wide.locator('[data-testid="tab-studies"]:visible').first().click();
    await wide.locator('[data-testid^="study-row-"]', { hasText: 'Left wing from the phone' }).first().click();
    await wide.locator('[data-testid="wing-results"]:visible').first().waitFor({ timeout: 30000 });
    await wide.locator('[data-testid="wing-form"]:visible').first().waitFor();
    expect(await wide.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(1366);
    // Beside the form the rib table fits its pane: no sideways scrolling, no value sticking out of its cell.
    await wide.locator('[data-testid="wing-rib-table"] [role="table"]').first().waitFor();
    const ribTable = await wide.evaluate(() => {
      const t = document.querySelector('[data-testid="wing-rib-table"]')!;
      const cut = Array.from(t.querySelectorAll('[role="cell"]')).filter((c) => c.scrollWidth > c.clientWidth + 1);
      return { scrolls: !!t.querySelector('[role="region"]'), cut: cut.map((c) => c.textContent) };
    });
    expect(ribTable).toEqual({ scrolls: false, cut: [] });
    for (const id of ['wing-headline', 'wing-rib-table', 'skin-panel-table']) {
      await wide.locator(`[data-testid="${id}"]:visible`).first().scrollIntoViewIfNeeded();
      await wide.screenshot({ path: path.join(SHOTS, `wing-wide-${id}.png`) });
    }
    await wide.context().close();
  });
});
